/*
 * Curve-import benchmark: a file of 2,000 invented pumps x 12 points, read, checked, fitted and
 * committed in one transaction through the import path, on a throwaway MariaDB. The baseline,
 * measured in the same run, is a bare bulk insert of the same rows (pumps, revisions with their
 * fits, points) into an empty copy of the tables, with nothing read, checked or fitted.
 * Prints figures only; nothing here asserts timing. Target: the import under 10 s.
 *
 * Run: npm run bench:import
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { importCurveTable } from '../../server/catalog/curve-import-transaction';
import { createSequelize } from '../../server/database/connection';
import { createMigrator } from '../../server/database/migrator';
import { initialiseModels, Supplier } from '../../server/database/models';
import { PrivateMariaDb } from '../../server/database/private-mariadb';
import { largeCurveTable } from '../data-import/large-curve-table';
import { freeLoopbackPort } from '../support/free-port';

const PUMPS = 2000;
const POINTS = 12;
const ROWS_PER_INSERT = 4000;

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
  } finally {
    await database.stop();
    rmSync(folder, { recursive: true, force: true });
  }
}

await main();
