import { expect } from 'chai';
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mariadb from 'mariadb';
import { projectRoot } from '../../server/config';
import { createSequelize } from '../../server/database/connection';
import { createMigrator } from '../../server/database/migrator';
import { initialiseModels, Supplier } from '../../server/database/models';
import { PrivateMariaDb } from '../../server/database/private-mariadb';
import { freeLoopbackPort } from '../support/free-port';
import { createScratchDatabase, testDatabaseConfig } from '../support/test-database';
import { catalogRowCounts, importText } from './catalog-fixtures';
import { largeCurveTable } from './large-curve-table';

/*
 * A commit is one transaction: if the process doing it dies, or the database itself is killed,
 * in the middle of writing a large file, nothing of that file is left behind.
 */

type DatabaseAddress = { host: string; port: number; user: string; password: string; name: string };

/** A connection that reads dirty (READ UNCOMMITTED): it sees the rows of transactions still open. */
async function openDirtyReader(database: DatabaseAddress): Promise<mariadb.Connection> {
  const connection = await mariadb.createConnection({
    host: database.host,
    port: database.port,
    user: database.user,
    password: database.password,
    database: database.name,
    connectTimeout: 10_000,
  });
  await connection.query('SET SESSION TRANSACTION ISOLATION LEVEL READ UNCOMMITTED');
  return connection;
}

/**
 * Waits until the number of curve points a dirty reader sees passes the test.
 * @returns the count that passed
 */
async function waitForDirtyPointCount(
  reader: mariadb.Connection,
  passes: (count: number) => boolean,
  timeoutMs = 120_000,
): Promise<number> {
  const deadline = Date.now() + timeoutMs;
  let count = -1;
  while (Date.now() < deadline) {
    const [row] = (await reader.query('SELECT COUNT(*) AS n FROM curve_points')) as Array<{ n: bigint | number }>;
    count = Number(row.n);
    if (passes(count)) return count;
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
  throw new Error(`the dirty count of curve points stayed at ${count} for ${timeoutMs} ms`);
}

/** Resolves once no process has this pid (a kill is asynchronous); gives up after 30 s. */
async function waitUntilGone(pid: number): Promise<void> {
  for (let waited = 0; waited < 30_000; waited += 50) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  throw new Error(`process ${pid} still runs 30 s after SIGKILL`);
}

describe('an interrupted commit leaves no partial revision', function () {
  this.timeout(300_000);
  const work = mkdtempSync(join(tmpdir(), 'riffle-interrupted-'));
  const file = join(work, 'large.csv');

  before(() => {
    writeFileSync(file, largeCurveTable(2000, 12));
  });

  after(() => {
    rmSync(work, { recursive: true, force: true });
  });

  it('the import command killed (SIGKILL) in the middle of its commit', async () => {
    const { sequelize, drop } = await createScratchDatabase('killed_import');
    try {
      await Supplier.create({ code: 'BULKTEST', name: 'Bulk Test Supply (invented)' });
      const before = await catalogRowCounts(sequelize);
      const child = spawn(
        process.execPath,
        ['--import', 'tsx', join(projectRoot, 'server', 'launch', 'import-command.ts'), '--supplier', 'BULKTEST', file],
        {
          cwd: projectRoot,
          env: {
            ...process.env,
            RIFFLE_DB_NAME: sequelize.config.database,
            RIFFLE_VAR_DIR: process.env.RIFFLE_TEST_WORK_FOLDER,
          },
          stdio: ['ignore', 'pipe', 'pipe'],
        },
      );
      let output = '';
      child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
      child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
      const exited = new Promise<string | null>((resolve) => child.once('exit', (_code, signal) => resolve(signal)));
      const reader = await openDirtyReader({ ...testDatabaseConfig(), name: sequelize.config.database! });
      const rowsWritten = await waitForDirtyPointCount(reader, (count) => count >= 4000).catch((error: Error) => {
        child.kill('SIGKILL');
        throw new Error(`${error.message}; the command said: ${output}`);
      });
      child.kill('SIGKILL');
      expect(await exited).to.equal('SIGKILL');
      expect(rowsWritten).to.be.within(4000, 23_999);
      // The server rolls back a transaction whose connection died; wait until it has.
      await waitForDirtyPointCount(reader, (count) => count === before.curve_points);
      await reader.end();
      expect(await catalogRowCounts(sequelize)).to.deep.equal(before);
    } finally {
      await drop();
    }
  });

  it('the database killed (SIGKILL) in the middle of a commit, then restarted', async () => {
    const folder = join(work, 'mariadb');
    const port = await freeLoopbackPort();
    let database = await PrivateMariaDb.startOrReuse({ folder, port });
    await database.ensureDatabase('riffle_killed');
    const config = { ...testDatabaseConfig(), host: '127.0.0.1', port, name: 'riffle_killed' };
    let sequelize = createSequelize(config);
    try {
      initialiseModels(sequelize);
      await createMigrator(sequelize).up();
      const supplier = await Supplier.create({ code: 'BULKTEST', name: 'Bulk Test Supply (invented)' });
      const before = await catalogRowCounts(sequelize);
      // Connected before the import starts: while it reads and fits, this process has little time to connect.
      const reader = await openDirtyReader(config);
      const commit = importText(sequelize, supplier, largeCurveTable(2000, 12)).then(
        () => 'finished',
        (error: Error) => error.message,
      );
      const rowsWritten = await waitForDirtyPointCount(reader, (count) => count >= 4000);
      process.kill(database.pid, 'SIGKILL');
      await reader.end().catch(() => undefined);
      expect(rowsWritten).to.be.within(4000, 23_999);
      expect(await commit).to.not.equal('finished');
      await sequelize.close().catch(() => undefined);
      // a killed process holds its port for a moment while the kernel tears it down
      await waitUntilGone(database.pid);

      database = await PrivateMariaDb.startOrReuse({ folder, port });
      sequelize = createSequelize(config);
      initialiseModels(sequelize);
      expect(await catalogRowCounts(sequelize)).to.deep.equal(before);
    } finally {
      await sequelize.close().catch(() => undefined);
      await database.stop();
    }
  });
});
