import { expect } from 'chai';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const projectRoot = join(import.meta.dirname, '..', '..', '..');

describe('the import command', function () {
  this.timeout(60_000);

  it('refuses a file whose name breaks the text rule before it opens the database', () => {
    const folder = mkdtempSync(join(tmpdir(), 'riffle-import-name-'));
    try {
      // U+202E turns "fdp.csv" into what reads as "vsc.pdf"
      const file = join(folder, 'curves\u202Efdp.csv');
      writeFileSync(file, 'riffle-curve-table,1\n');
      const run = spawnSync(
        process.execPath,
        ['--import', 'tsx', join(projectRoot, 'server', 'launch', 'import-command.ts'), '--supplier', 'ANY', file],
        { cwd: projectRoot, encoding: 'utf8', env: { ...process.env, RIFFLE_DB_PORT: '1' } },
      );
      expect(run.status).to.equal(2);
      expect(run.stderr).to.contain('must not contain bidirectional control characters');
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });
});
