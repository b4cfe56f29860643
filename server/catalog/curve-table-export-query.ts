import { curveTableOf, type CurveTableExport } from '../../data-import/curve-table-export';
import { CurveDeclaredRange, CurvePoint, CurveRevision, Pump, type Supplier } from '../database/models';

/** A supplier's current curves, read through the models, written as a curve table (data-import). */
export async function exportCurveTable(supplier: Supplier): Promise<CurveTableExport> {
  const pumps = await Pump.findAll({
    where: { supplierId: supplier.id },
    include: [
      {
        model: CurveRevision,
        as: 'currentRevision',
        required: true,
        include: [
          { model: CurvePoint, as: 'points' },
          { model: CurveDeclaredRange, as: 'declaredRanges' },
        ],
      },
    ],
    order: [
      ['modelCode', 'ASC'],
      [{ model: CurveRevision, as: 'currentRevision' }, { model: CurvePoint, as: 'points' }, 'position', 'ASC'],
    ],
  });
  return curveTableOf(supplier, pumps);
}
