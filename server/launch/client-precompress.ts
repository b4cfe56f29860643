import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

/** Text the browser fetches; images as PNG and fonts as WOFF2 are compressed already. */
const compressible = /\.(html|js|mjs|css|json|svg|txt|map|webmanifest|ico|ttf|eot|woff)$/;

/** Below this a compressed copy saves less than its headers cost (common practice, ~1 KiB). */
const smallestWorthCompressing = 1024;

function* builtFiles(folder: string): Generator<string> {
  for (const entry of readdirSync(folder).sort()) {
    const path = join(folder, entry);
    if (statSync(path).isDirectory()) yield* builtFiles(path);
    else if (compressible.test(entry)) yield path;
  }
}

/**
 * Writes `FILE.br` (brotli at its best quality, as it runs once per build) and `FILE.gz` (gzip
 * level 9) beside each built text file, so the server sends compressed bytes without compressing
 * per request. A copy that would not be smaller is left out and the file goes as it is.
 */
export function precompressClient(folder: string): { files: number; bytes: number; brotliBytes: number } {
  const totals = { files: 0, bytes: 0, brotliBytes: 0 };
  for (const path of builtFiles(folder)) {
    const content = readFileSync(path);
    if (content.length < smallestWorthCompressing) continue;
    const brotli = brotliCompressSync(content, {
      params: {
        [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY,
        [constants.BROTLI_PARAM_SIZE_HINT]: content.length,
      },
    });
    const gzip = gzipSync(content, { level: 9 });
    if (brotli.length < content.length) writeFileSync(`${path}.br`, brotli);
    if (gzip.length < content.length) writeFileSync(`${path}.gz`, gzip);
    totals.files += 1;
    totals.bytes += content.length;
    totals.brotliBytes += Math.min(brotli.length, content.length);
  }
  return totals;
}
