import { Readable } from 'node:stream';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { CurveImportReport } from '../../shared/api/api-schemas';
import { importCurveTable } from '../../server/catalog/curve-import-transaction';
import { seedDemoCurvesWhenNone } from '../../server/demo/demo-curve-seed';
import { demoSuppliers } from '../../server/demo/demo-seed';
import { Supplier } from '../../server/database/models';

export const catalogTables = [
  'suppliers',
  'pumps',
  'curve_imports',
  'curve_revisions',
  'curve_points',
  'curve_declared_ranges',
] as const;

/** The demo suppliers and their demo curve tables, loaded through the import path. */
export async function seedDemoCatalog(sequelize: Sequelize): Promise<Supplier[]> {
  await Supplier.bulkCreate([...demoSuppliers]);
  await seedDemoCurvesWhenNone(sequelize);
  return Supplier.findAll({ order: [['code', 'ASC']] });
}

/** Row counts of the catalog's tables. */
export async function catalogRowCounts(sequelize: Sequelize): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of catalogTables) {
    const [row] = await sequelize.query<{ n: number | string }>(`SELECT COUNT(*) AS n FROM \`${table}\``, {
      type: QueryTypes.SELECT,
    });
    counts[table] = Number(row.n);
  }
  return counts;
}

/** Imports CSV text through the one import path. */
export function importText(
  sequelize: Sequelize,
  supplier: Supplier,
  text: string,
  options: { dryRun?: boolean; fileName?: string } = {},
): Promise<CurveImportReport> {
  return importCurveTable({
    sequelize,
    supplier,
    source: Readable.from([Buffer.from(text, 'utf8')]),
    fileName: options.fileName ?? 'test.csv',
    dryRun: options.dryRun ?? false,
    actor: { userId: null, label: 'test suite', channel: 'command' },
  });
}
