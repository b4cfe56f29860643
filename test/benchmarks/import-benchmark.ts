/*
 * Curve-import benchmark: a file of 2,000 invented pumps x 12 points, read, checked, fitted and
 * committed in one transaction through the import path, on a throwaway MariaDB. The baseline,
 * measured in the same run, is a bare bulk insert of the same rows (pumps, revisions with their
 * fits, points) into an empty copy of the tables, with nothing read, checked or fitted.
 * Prints figures only; nothing here asserts timing. Target: the import under 10 s.
 *
 * A second part sends a file of 10,000 invented pumps x 10 points (100,000 rows) as a dry run
 * through the API, POST /api/v1/suppliers/{id}/curve-imports, to the real app in a child process
 * of its own, so that the child's peak resident memory (the kernel's maxRSS, and process.memoryUsage().rss
 * sampled every 10 ms) is the server's and the upload's alone; it prints the elapsed time and
 * both figures beside the child's memory at rest.
 *
 * Run: npm run bench:import
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { importCurveTable } from '../../server/catalog/curve-import-transaction';
import { createSequelize } from '../../server/database/connection';
import { createMigrator } from '../../server/database/migrator';
import { createApp } from '../../server/app';
import { initialiseModels, Supplier } from '../../server/database/models';
import { PrivateMariaDb } from '../../server/database/private-mariadb';
import { createLogger } from '../../server/logging';
import { createUserWithSession } from '../support/accounts';
import { largeCurveTable } from '../data-import/large-curve-table';
import { freeLoopbackPort } from '../support/free-port';

const PUMPS = 2000;
const POINTS = 12;
const ROWS_PER_INSERT = 4000;
const DRY_RUN_PUMPS = 10_000;
const DRY_RUN_POINTS = 10;
const MIB = 1024 * 1024;

/** What the child serving the dry run tells the benchmark. */
type ServerMessage =
  | { ready: { url: string; token: string; supplierId: number; rssAtRest: number } }
  | { memory: { maxRss: number; sampledPeakRss: number } };

async function freshDatabase(database: PrivateMariaDb, name: string): Promise<Sequelize> {
  await database.ensureDatabase(name);
  const sequelize = createSequelize({ host: '127.0.0.1', port: database.port, name, user: 'root', password: '' });
  initialiseModels(sequelize);
  await createMigrator(sequelize).up();
  return sequelize;
}

/** Multi-row INSERTs of already prepared rows, in one transaction. */
async function bareInsert(
  sequelize: Sequelize,
  table: string,
  rows: Record<string, unknown>[],
  transaction: Transaction,
): Promise<void> {
  for (let start = 0; start < rows.length; start += ROWS_PER_INSERT) {
    await sequelize.getQueryInterface().bulkInsert(table, rows.slice(start, start + ROWS_PER_INSERT), { transaction });
  }
}

/** The child: the real app on a loopback port, an admin's session, and its memory when asked. */
async function serveDryRun(databasePort: number): Promise<void> {
  const sequelize = createSequelize({
    host: '127.0.0.1',
    port: databasePort,
    name: 'bench_dry_run',
    user: 'root',
    password: '',
  });
  initialiseModels(sequelize);
  const supplier = await Supplier.findOne({ where: { code: 'BENCHDRY' }, rejectOnEmpty: true });
  const { token } = await createUserWithSession(sequelize, 'admin');
  let sampledPeakRss = process.memoryUsage().rss;
  setInterval(() => (sampledPeakRss = Math.max(sampledPeakRss, process.memoryUsage().rss)), 10).unref();
  const server = createApp({ sequelize, logger: createLogger('silent') }).listen(0, '127.0.0.1', () => {
    const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const ready: ServerMessage = {
      ready: { url, token, supplierId: supplier.id, rssAtRest: process.memoryUsage().rss },
    };
    process.send!(ready);
  });
  process.on('message', (asked) => {
    if (asked === 'memory') {
      const memory: ServerMessage = {
        memory: { maxRss: process.resourceUsage().maxRSS * 1024, sampledPeakRss },
      };
      process.send!(memory);
    } else server.close(() => void sequelize.close().then(() => process.exit(0)));
  });
}

/** The 100,000-row dry run through the API, measured in a server process of its own. */
async function dryRunThroughApi(database: PrivateMariaDb): Promise<void> {
  const sequelize = await freshDatabase(database, 'bench_dry_run');
  await Supplier.create({ code: 'BENCHDRY', name: 'Benchmark Dry-Run Supply (invented)' });
  await sequelize.close();
  const bytes = Buffer.from(largeCurveTable(DRY_RUN_PUMPS, DRY_RUN_POINTS));

  const child = spawn(
    process.execPath,
    ['--import', 'tsx', fileURLToPath(import.meta.url), '--serve-dry-run', String(database.port)],
    { stdio: ['ignore', 'inherit', 'inherit', 'ipc'] },
  );
  const exited = new Promise((resolve) => child.once('exit', resolve));
  const next = () =>
    new Promise<ServerMessage>((resolve, reject) => {
      child.once('message', (message) => resolve(message as ServerMessage));
      child.once('exit', (code) => reject(new Error(`the benchmark server stopped with code ${code}`)));
    });
  try {
    const ready = await next();
    if (!('ready' in ready)) throw new Error('the benchmark server did not say it was ready');
    const { url, token, supplierId, rssAtRest } = ready.ready;
    const started = performance.now();
    const response = await request(url)
      .post(`/api/v1/suppliers/${supplierId}/curve-imports`)
      .set('Authorization', `Bearer ${token}`)
      .field('dryRun', 'true')
      .attach('file', bytes, 'benchmark-100k.csv');
    const seconds = (performance.now() - started) / 1000;
    const report = response.body as { rowCount?: number; errors?: unknown[] };
    if (response.status !== 200 || report.rowCount !== DRY_RUN_PUMPS * DRY_RUN_POINTS)
      throw new Error(`the dry run answered ${response.status}: ${JSON.stringify(response.body).slice(0, 300)}`);
    const measured = next();
    child.send('memory');
    const memory = await measured;
    if (!('memory' in memory)) throw new Error('the benchmark server did not say its memory');
    const rows = DRY_RUN_PUMPS * DRY_RUN_POINTS;
    console.log(
      `dry run through the API: ${DRY_RUN_PUMPS} pumps x ${DRY_RUN_POINTS} points = ${rows} rows, ${(bytes.length / MIB).toFixed(1)} MiB, answer ${(Buffer.byteLength(response.text) / MIB).toFixed(1)} MiB`,
    );
    console.log(
      `  elapsed (upload, read, check, fit, compare, answer): ${seconds.toFixed(2)} s, ${Math.round(rows / seconds)} rows/s`,
    );
    console.log(
      `  server resident memory: at rest ${(rssAtRest / MIB).toFixed(0)} MiB, peak ${(memory.memory.maxRss / MIB).toFixed(0)} MiB (maxRSS), ${(memory.memory.sampledPeakRss / MIB).toFixed(0)} MiB (rss sampled)`,
    );
    console.log(`  peak above rest: ${((memory.memory.maxRss - rssAtRest) / MIB).toFixed(0)} MiB`);
  } finally {
    if (child.connected) child.send('stop');
    await exited;
  }
}

async function main(): Promise<void> {
  const folder = mkdtempSync(join(tmpdir(), 'riffle-import-bench-'));
  const database = await PrivateMariaDb.startOrReuse({ folder, port: await freeLoopbackPort() });
  try {
    const text = largeCurveTable(PUMPS, POINTS);
    const bytes = Buffer.from(text);

    const importing = await freshDatabase(database, 'bench_import');
    const supplier = await Supplier.create({ code: 'BENCH', name: 'Benchmark Supply (invented)' });
    const started = performance.now();
    const report = await importCurveTable({
      sequelize: importing,
      supplier,
      source: Readable.from([bytes]),
      fileName: 'benchmark.csv',
      dryRun: false,
      actor: { userId: null, label: 'benchmark', channel: 'command' },
    });
    const importSeconds = (performance.now() - started) / 1000;
    if (report.errors.length > 0 || report.counts.new !== PUMPS)
      throw new Error(`the benchmark file did not import: ${JSON.stringify(report.errors[0])}`);

    // The same rows as the import wrote, read back, for the bare insert.
    const pumps = await importing.query<Record<string, unknown>>(
      'SELECT id, supplier_id, model_code, display_name, kind, status, created_at, updated_at FROM pumps',
      { type: QueryTypes.SELECT },
    );
    const revisions = await importing.query<Record<string, unknown>>(
      `SELECT r.id, r.pump_id, r.number, r.import_id, r.source_file_name, r.source_checksum, r.content_hash, r.file_units, r.point_count,
              r.flow_min_m3s, r.flow_max_m3s, r.head_min_m, r.head_max_m, r.bep_flow_m3s, r.bep_head_m, r.bep_efficiency, r.fit, r.created_at
         FROM curve_revisions r`,
      { type: QueryTypes.SELECT },
    );
    const points = await importing.query<Record<string, unknown>>(
      'SELECT revision_id, position, flow_m3s, head_m, power_w, efficiency, npsh_required_m FROM curve_points',
      { type: QueryTypes.SELECT },
    );
    const [importRecord] = await importing.query<Record<string, unknown>>('SELECT * FROM curve_imports', {
      type: QueryTypes.SELECT,
    });
    await importing.close();
    for (const revision of revisions) {
      revision.fit = JSON.stringify(revision.fit);
      revision.file_units = JSON.stringify(revision.file_units);
    }
    importRecord.file_units = JSON.stringify(importRecord.file_units);
    importRecord.report = JSON.stringify(importRecord.report);

    const bare = await freshDatabase(database, 'bench_bare');
    await Supplier.create({ id: supplier.id, code: 'BENCH', name: 'Benchmark Supply (invented)' });
    const bareStarted = performance.now();
    await bare.transaction(async (transaction) => {
      await bareInsert(bare, 'curve_imports', [importRecord], transaction);
      await bareInsert(bare, 'pumps', pumps, transaction);
      await bareInsert(bare, 'curve_revisions', revisions, transaction);
      await bareInsert(bare, 'curve_points', points, transaction);
    });
    const bareSeconds = (performance.now() - bareStarted) / 1000;
    await bare.close();

    const pointRows = PUMPS * POINTS;
    console.log(
      `curve import: ${PUMPS} pumps x ${POINTS} points = ${pointRows} rows, ${(bytes.length / 1024).toFixed(0)} KiB`,
    );
    console.log(
      `  import (read, check, fit, compare, commit): ${importSeconds.toFixed(2)} s, ${Math.round(pointRows / importSeconds)} rows/s (target under 10 s)`,
    );
    console.log(
      `  bare bulk insert of the same rows:          ${bareSeconds.toFixed(2)} s, ${Math.round(pointRows / bareSeconds)} rows/s`,
    );
    console.log(`  ratio import / bare insert: ${(importSeconds / bareSeconds).toFixed(1)}`);

    await dryRunThroughApi(database);
  } finally {
    await database.stop();
    rmSync(folder, { recursive: true, force: true });
  }
}

if (process.argv[2] === '--serve-dry-run') await serveDryRun(Number(process.argv[3]));
else await main();
