import { Op, QueryTypes, col, fn, type Sequelize } from 'sequelize';
import type {
  CurveFileUnits,
  CurvePointSi,
  CurveRevisionSummary,
  PumpDetail,
  PumpListQuery,
  PumpSortKey,
  PumpSummary,
  StoredPumpCurveFit,
  SupplierList,
} from '../../shared/api/api-schemas';
import type { PumpKind, PumpStatus } from '../../shared/vocabularies';
import { CurveDeclaredRange, CurveImport, CurvePoint, CurveRevision, Pump, Supplier } from '../database/models';
import { fixedSpeedsOf } from '../database/models/pump';

/*
 * The catalog as designers and integrators read it: suppliers, pumps with the current curve's
 * range and BEP, and one pump with a curve revision. Reads go through the models, except the pump
 * summary select, which the filtered, sorted and paged list runs on every page of the catalog.
 */

/** A pump with its supplier and current curve revision, as the raw catalog selects return it. */
export interface PumpRow {
  id: number;
  supplier_id: number;
  supplier_code: string;
  supplier_name: string;
  model_code: string;
  display_name: string;
  kind: PumpKind;
  nominal_speed_rpm: number | null;
  voltage_v: number | null;
  phase_count: number | null;
  full_load_current_a: number | null;
  speed_min_rpm: number | null;
  speed_max_rpm: number | null;
  fixed_speeds_rpm: string | null;
  discharge_size_mm: number | null;
  solids_handling_mm: number | null;
  list_price: string | null;
  price_currency: string | null;
  status: PumpStatus;
  revision_number: number | null;
  flow_min_m3s: number | null;
  flow_max_m3s: number | null;
  head_min_m: number | null;
  head_max_m: number | null;
  bep_flow_m3s: number | null;
  bep_head_m: number | null;
  bep_efficiency: number | null;
}

/** The list's query once checked: the defaults filled in, flowMin to headMax in SI (m3/s, m). */
export type PumpListFilter = Omit<PumpListQuery, 'flowUnit' | 'headUnit'> &
  Required<Pick<PumpListQuery, 'status' | 'sort' | 'order' | 'page' | 'pageSize'>>;

// Raw SQL: one joined select with a dynamic sort on joined columns stays cheap per catalog page.
const pumpSelect = `
  SELECT p.id, p.supplier_id, s.code AS supplier_code, s.name AS supplier_name, p.model_code, p.display_name, p.kind,
         p.nominal_speed_rpm, p.voltage_v, p.phase_count, p.full_load_current_a, p.speed_min_rpm, p.speed_max_rpm,
         p.fixed_speeds_rpm, p.discharge_size_mm, p.solids_handling_mm,
         p.list_price, p.price_currency, p.status, r.number AS revision_number, r.flow_min_m3s, r.flow_max_m3s, r.head_min_m,
         r.head_max_m, r.bep_flow_m3s, r.bep_head_m, r.bep_efficiency
    FROM pumps p
    JOIN suppliers s ON s.id = p.supplier_id
    LEFT JOIN curve_revisions r ON r.id = p.current_revision_id`;

const sortColumns: Record<PumpSortKey, string> = {
  modelCode: 'p.model_code',
  displayName: 'p.display_name',
  kind: 'p.kind',
  supplier: 's.name',
  flowMax: 'r.flow_max_m3s',
  headMax: 'r.head_max_m',
  bepEfficiency: 'r.bep_efficiency',
};

function toPumpSummary(row: PumpRow): PumpSummary {
  return {
    id: row.id,
    supplier: { id: row.supplier_id, code: row.supplier_code, name: row.supplier_name },
    modelCode: row.model_code,
    displayName: row.display_name,
    kind: row.kind,
    nominalSpeedRpm: row.nominal_speed_rpm,
    voltage: row.voltage_v,
    phaseCount: row.phase_count as PumpSummary['phaseCount'],
    fullLoadCurrent: row.full_load_current_a,
    speedRange:
      row.speed_min_rpm === null || row.speed_max_rpm === null
        ? null
        : { minRpm: row.speed_min_rpm, maxRpm: row.speed_max_rpm },
    fixedSpeedsRpm: fixedSpeedsOf(row.fixed_speeds_rpm),
    dischargeSizeMm: row.discharge_size_mm,
    solidsHandlingMm: row.solids_handling_mm,
    listPrice:
      row.list_price === null || row.price_currency === null
        ? null
        : { amount: Number(row.list_price), currency: row.price_currency },
    status: row.status,
    currentRevisionNumber: row.revision_number,
    flowMin: row.flow_min_m3s,
    flowMax: row.flow_max_m3s,
    headMin: row.head_min_m,
    headMax: row.head_max_m,
    bep:
      row.bep_flow_m3s === null || row.bep_head_m === null || row.bep_efficiency === null
        ? null
        : { flow: row.bep_flow_m3s, head: row.bep_head_m, efficiency: row.bep_efficiency },
  };
}

/** `%` and `_` match themselves in a LIKE pattern. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (character) => `\\${character}`)}%`;
}

function whereOf(filter: PumpListFilter): { sql: string; replacements: unknown[] } {
  const where: string[] = [];
  const replacements: unknown[] = [];
  const add = (condition: string, ...values: unknown[]) => {
    where.push(condition);
    replacements.push(...values);
  };
  if (filter.status !== 'all') add('p.status = ?', filter.status);
  if (filter.kind !== undefined) add('p.kind = ?', filter.kind);
  if (filter.supplierId !== undefined) add('p.supplier_id = ?', filter.supplierId);
  if (filter.search !== undefined) {
    const pattern = likePattern(filter.search);
    add("(p.model_code LIKE ? ESCAPE '\\\\' OR p.display_name LIKE ? ESCAPE '\\\\')", pattern, pattern);
  }
  // A pump passes a range when its published curve reaches into it.
  if (filter.flowMin !== undefined) add('r.flow_max_m3s >= ?', filter.flowMin);
  if (filter.flowMax !== undefined) add('r.flow_min_m3s <= ?', filter.flowMax);
  if (filter.headMin !== undefined) add('r.head_max_m >= ?', filter.headMin);
  if (filter.headMax !== undefined) add('r.head_min_m <= ?', filter.headMax);
  return { sql: where.length > 0 ? `WHERE ${where.join(' AND ')}` : '', replacements };
}

/** Revision summaries newest first, with the fields the chosen one's detail needs. */
async function revisionsOf(pumpId: number, currentNumber: number | null) {
  const revisions = await CurveRevision.findAll({
    attributes: [
      'id',
      'number',
      'createdAt',
      'sourceFileName',
      'sourceChecksum',
      'pointCount',
      'fileUnits',
      'notes',
      'fit',
    ],
    where: { pumpId },
    include: [{ model: CurveImport, as: 'import', attributes: ['importedBy'], required: true }],
    order: [['number', 'DESC']],
  });
  return revisions.map((revision) => ({
    revision,
    summary: {
      number: revision.number,
      current: revision.number === currentNumber,
      importedAt: revision.createdAt.toISOString(),
      importedBy: revision.import!.importedBy,
      sourceFileName: revision.sourceFileName,
      sourceChecksum: revision.sourceChecksum,
      pointCount: revision.pointCount,
    } satisfies CurveRevisionSummary,
  }));
}

async function revisionDetail(
  revision: CurveRevision,
  summary: CurveRevisionSummary,
): Promise<NonNullable<PumpDetail['revision']>> {
  const [points, ranges] = await Promise.all([
    CurvePoint.findAll({ where: { revisionId: revision.id }, order: [['position', 'ASC']] }),
    CurveDeclaredRange.findAll({ where: { revisionId: revision.id } }),
  ]);
  const range = (region: CurveDeclaredRange['region']) => {
    const found = ranges.find((candidate) => candidate.region === region);
    return found ? { flowMin: found.flowMinM3s, flowMax: found.flowMaxM3s } : null;
  };
  return {
    ...summary,
    fileUnits: revision.fileUnits as CurveFileUnits,
    notes: revision.notes,
    points: points.map((point): CurvePointSi => ({
      flow: point.flowM3s,
      head: point.headM,
      ...(point.powerW !== null ? { power: point.powerW } : {}),
      ...(point.efficiency !== null ? { efficiency: point.efficiency } : {}),
      ...(point.npshRequiredM !== null ? { npshRequired: point.npshRequiredM } : {}),
    })),
    declaredRanges: { preferred: range('preferred'), allowable: range('allowable') },
    fit: revision.fit as StoredPumpCurveFit,
  };
}

/** What `readPumpDetail` found: the detail, or which of the two asked for is missing. */
export type PumpDetailRead =
  | { found: true; detail: Omit<PumpDetail, 'units'> }
  | { found: false; missing: 'pump' }
  | { found: false; missing: 'revision'; revisionCount: number };

export function createPumpCatalogQueries(sequelize: Sequelize) {
  /** Every supplier by code, with its active pumps that have a curve. */
  async function listSuppliers(): Promise<SupplierList['suppliers']> {
    const suppliers = await Supplier.findAll({
      attributes: ['id', 'code', 'name', [fn('COUNT', col('pumps.id')), 'pumpCount']],
      include: [
        {
          model: Pump,
          as: 'pumps',
          attributes: [],
          required: false,
          where: { status: 'active', currentRevisionId: { [Op.ne]: null } },
        },
      ],
      group: ['Supplier.id', 'Supplier.code', 'Supplier.name'],
      order: [['code', 'ASC']],
    });
    return suppliers.map((supplier) => ({
      id: supplier.id,
      code: supplier.code,
      name: supplier.name,
      pumpCount: Number(supplier.get('pumpCount')),
    }));
  }

  /** One page of the pumps that pass the filter, and how many pass in all. */
  async function findPumpPage(filter: PumpListFilter): Promise<{ total: number; items: PumpSummary[] }> {
    const where = whereOf(filter);
    const order = filter.order === 'desc' ? 'DESC' : 'ASC';
    const [countRow] = await sequelize.query<{ total: number | string }>(
      `SELECT COUNT(*) AS total FROM pumps p JOIN suppliers s ON s.id = p.supplier_id LEFT JOIN curve_revisions r ON r.id = p.current_revision_id ${where.sql}`,
      { replacements: where.replacements, type: QueryTypes.SELECT },
    );
    const rows = await sequelize.query<PumpRow>(
      `${pumpSelect} ${where.sql} ORDER BY ${sortColumns[filter.sort]} ${order}, p.id ${order} LIMIT ? OFFSET ?`,
      {
        replacements: [...where.replacements, filter.pageSize, (filter.page - 1) * filter.pageSize],
        type: QueryTypes.SELECT,
      },
    );
    return { total: Number(countRow.total), items: rows.map(toPumpSummary) };
  }

  /**
   * One pump, its revision list and the revision asked for (default the current one). The pump is
   * read by the list's own select, so a pump's summary is the same in the list and alone.
   */
  async function readPumpDetail(pumpId: number, wanted: number | undefined): Promise<PumpDetailRead> {
    const [row] = await sequelize.query<PumpRow>(`${pumpSelect} WHERE p.id = ?`, {
      replacements: [pumpId],
      type: QueryTypes.SELECT,
    });
    if (!row) return { found: false, missing: 'pump' };
    const revisions = await revisionsOf(pumpId, row.revision_number);
    const number = wanted ?? row.revision_number;
    const chosen = revisions.find(({ revision }) => revision.number === number);
    if (wanted !== undefined && !chosen) return { found: false, missing: 'revision', revisionCount: revisions.length };
    return {
      found: true,
      detail: {
        pump: toPumpSummary(row),
        revision: chosen ? await revisionDetail(chosen.revision, chosen.summary) : null,
        revisions: revisions.map(({ summary }) => summary),
      },
    };
  }

  return { listSuppliers, findPumpPage, readPumpDetail };
}
