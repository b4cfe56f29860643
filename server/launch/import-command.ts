// `npm run import -- --supplier CODE FILE.csv [--dry-run]`: checks a curve-table file and loads it
// into Riffle's database through the same import path as the API, with a progress bar and a summary.
import { createReadStream, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { userInfo } from 'node:os';
import { parseArgs } from 'node:util';
import cliProgress from 'cli-progress';
import type { CurveImportReport } from '../../shared/api/api-schemas';
import { describeIssue, type ImportPhase } from '../../data-import/curve-import-plan';
import { CurveImportRunningError } from '../catalog/curve-import-claim';
import { importCurveTable } from '../catalog/curve-import-transaction';
import { ConfigError, loadConfig } from '../config';
import { createSequelize } from '../database/connection';
import { createMigrator } from '../database/migrator';
import { initialiseModels, Supplier } from '../database/models';
import { MariaDbStartError, PrivateMariaDb } from '../database/private-mariadb';
import { visibleTextProblem } from '../../shared/text-rules';

const usage = 'usage: npm run import -- --supplier CODE FILE.csv [--dry-run]';

/** Files smaller than this load too fast for a bar to help. */
const progressBarFromBytes = 256 * 1024;

function printSummary(report: CurveImportReport): void {
  const warnings = report.warnings.length + report.pumps.reduce((sum, pump) => sum + pump.warnings.length, 0);
  console.log(
    `${report.fileName}: ${report.rowCount} point rows, ${report.pumpCount} pumps for ${report.supplier.code}`,
  );
  console.log(
    `  new ${report.counts.new}, changed ${report.counts.changed}, unchanged ${report.counts.unchanged}, warnings ${warnings}, errors ${report.errors.length + report.errorsOmitted}`,
  );
  for (const pump of report.pumps) {
    for (const warning of pump.warnings) console.log(`  warning, ${pump.modelCode}: ${describeIssue(warning)}`);
  }
  for (const warning of report.warnings) console.log(`  warning: ${describeIssue(warning)}`);
  for (const error of report.errors) console.log(`  error: ${describeIssue(error)}`);
  if (report.errorsOmitted > 0) console.log(`  ... and ${report.errorsOmitted} more errors`);
}

async function main(): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      options: { supplier: { type: 'string' }, 'dry-run': { type: 'boolean', default: false } },
      allowPositionals: true,
    });
  } catch (error) {
    console.error(`${(error as Error).message}\n${usage}`);
    return 2;
  }
  const supplierCode = parsed.values.supplier;
  const file = parsed.positionals[0];
  if (!supplierCode || !file || parsed.positionals.length > 1) {
    console.error(usage);
    return 2;
  }
  const nameProblem = visibleTextProblem(basename(file));
  if (nameProblem) {
    // the name is stored with the import and shown to admins: the same rule as an upload's
    console.error(`the file name ${JSON.stringify(basename(file))} ${nameProblem}; rename the file`);
    return 2;
  }
  let size: number;
  try {
    size = statSync(file).size;
  } catch {
    console.error(`cannot read ${file}`);
    return 2;
  }

  const config = loadConfig();
  const database = await PrivateMariaDb.startOrReuse({
    folder: join(config.varDir, 'mariadb'),
    port: config.database.port,
  });
  await database.ensureDatabase(config.database.name);
  const sequelize = createSequelize(config.database);
  const bar =
    size >= progressBarFromBytes && process.stdout.isTTY
      ? new cliProgress.SingleBar(
          { format: '{phase} [{bar}] {percentage}% | {value}/{total}' },
          cliProgress.Presets.shades_classic,
        )
      : undefined;
  try {
    initialiseModels(sequelize);
    await createMigrator(sequelize).up();
    const supplier = await Supplier.findOne({ where: { code: supplierCode } });
    if (!supplier) {
      console.error(`no supplier has the code ${supplierCode}`);
      return 2;
    }
    let shownPhase: ImportPhase | undefined;
    const report = await importCurveTable({
      sequelize,
      supplier,
      source: createReadStream(file),
      fileName: basename(file),
      dryRun: parsed.values['dry-run'],
      actor: { userId: null, label: `command line (${userInfo().username})`, channel: 'command' },
      totalBytes: size,
      onProgress: (phase, done, total) => {
        if (!bar) return;
        if (phase !== shownPhase) {
          if (shownPhase) bar.stop();
          bar.start(total, done, { phase: phase.padEnd(8) });
          shownPhase = phase;
        } else bar.update(done);
      },
    });
    bar?.stop();
    printSummary(report);
    if (report.errors.length > 0) {
      console.log('nothing was written: fix the errors and run the command again');
      return 1;
    }
    if (report.dryRun) console.log('dry run: nothing was written');
    else if (report.committed) console.log(`written as import ${report.importId}`);
    else console.log('nothing to write: every pump is unchanged');
    return 0;
  } finally {
    bar?.stop();
    await sequelize.close();
    if (database.startedNow) await database.stop();
  }
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    const told =
      error instanceof ConfigError || error instanceof MariaDbStartError || error instanceof CurveImportRunningError;
    console.error(told ? error.message : error);
    process.exitCode = 1;
  },
);
