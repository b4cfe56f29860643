import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { projectRoot } from '../config';
import { defaultClientFolder } from '../app';
import { precompressClient } from './client-precompress';

/** What the client build reads: when any of it changes, the build is stale. */
const clientSources = ['src', 'shared', 'angular.json', 'tsconfig.json', 'tsconfig.app.json', 'package-lock.json'];
const stampFile = join(projectRoot, 'dist', 'riffle', '.source-hash');

function* filesUnder(path: string): Generator<string> {
  if (!existsSync(path)) return;
  if (statSync(path).isFile()) {
    yield path;
    return;
  }
  for (const entry of readdirSync(path).sort()) yield* filesUnder(join(path, entry));
}

function sourceHash(): string {
  // the build's recipe counts too: a build made before its files were precompressed is stale
  const hash = createHash('sha256').update('precompressed: br, gzip\0');
  for (const source of clientSources) {
    for (const file of filesUnder(join(projectRoot, source))) {
      hash.update(relative(projectRoot, file)).update('\0').update(readFileSync(file)).update('\0');
    }
  }
  return hash.digest('hex');
}

/**
 * Builds the Angular app with `ng build`, then its brotli and gzip copies, when the build is
 * missing or older than its sources.
 */
export async function ensureClientBuilt(log: (line: string) => void): Promise<void> {
  const wanted = sourceHash();
  const built =
    existsSync(join(defaultClientFolder, 'index.html')) && existsSync(stampFile)
      ? readFileSync(stampFile, 'utf8').trim()
      : '';
  if (built === wanted) return;
  log(
    built
      ? 'the client build is stale; building it (about 20 s)'
      : 'the client is not built yet; building it (about 20 s)',
  );
  const exitCode = await new Promise<number | null>((resolve, reject) => {
    const child = spawn(
      process.execPath,
      [join(projectRoot, 'node_modules', '@angular', 'cli', 'bin', 'ng.js'), 'build'],
      {
        cwd: projectRoot,
        stdio: ['ignore', 'inherit', 'inherit'],
        env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
      },
    );
    child.once('error', reject);
    child.once('exit', resolve);
  });
  if (exitCode !== 0) throw new Error(`ng build failed with exit code ${exitCode}; its messages are above`);
  const { files, bytes, brotliBytes } = precompressClient(defaultClientFolder);
  log(
    `precompressed ${files} client files: ${Math.round(bytes / 1024)} KiB, ${Math.round(brotliBytes / 1024)} KiB as brotli`,
  );
  writeFileSync(stampFile, `${wanted}\n`);
}
