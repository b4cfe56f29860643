import { createReadStream } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Sequelize } from 'sequelize';
import { demoCurveFiles } from '../../data-import/demo-data/demo-curve-tables';
import { importCurveTable } from '../catalog/curve-import-transaction';
import { Pump, Supplier } from '../database/models';

/**
 * Loads the demo curve tables (invented pumps) through the ordinary import path when the catalog
 * holds no pump at all; a supplier that does not exist is skipped.
 * @returns the number of pumps loaded
 */
export async function seedDemoCurvesWhenNone(sequelize: Sequelize): Promise<number> {
  if ((await Pump.count()) > 0) return 0;
  let loaded = 0;
  for (const { supplierCode, fileName } of demoCurveFiles) {
    const supplier = await Supplier.findOne({ where: { code: supplierCode } });
    if (!supplier) continue;
    const report = await importCurveTable({
      sequelize,
      supplier,
      source: createReadStream(fileURLToPath(new URL(`../../data-import/demo-data/${fileName}`, import.meta.url))),
      fileName,
      dryRun: false,
      actor: { userId: null, label: 'demo seed', channel: 'demo-seed' },
    });
    if (report.errors.length > 0) {
      throw new Error(
        `the demo curve table ${fileName} has errors, first: row ${report.errors[0].row}: ${report.errors[0].message}`,
      );
    }
    loaded += report.counts.new;
  }
  return loaded;
}
