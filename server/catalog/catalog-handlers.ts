import type { RequestHandler } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import type {
  CurveFileUnits,
  CurvePointSi,
  CurveRevisionSummary,
  PumpDetail,
  PumpPage,
  PumpSummary,
  StoredPumpCurveFit,
  SupplierList,
} from '../../shared/api/api-schemas';
import { flowToSI, headToSI, type FlowUnit, type HeadUnit } from '../../shared/hydraulics';
import { siUnits } from '../../data-import/curve-import-plan';
import { ProblemError } from '../api/problem-details';

/*
 * The catalog as designers and integrators read it: suppliers, pumps with the current curve's
 * range and BEP, and one pump with a curve revision (the current one, or an older one asked for).
 */

interface PumpRow {
  id: number;
  supplier_id: number;
  supplier_code: string;
  supplier_name: string;
  model_code: string;
  display_name: string;
  kind: PumpSummary['kind'];
  nominal_speed_rpm: number | null;
  voltage_v: number | null;
  phase_count: number | null;
  discharge_size_mm: number | null;
  solids_handling_mm: number | null;
  list_price: string | null;
  price_currency: string | null;
  status: PumpSummary['status'];
  revision_number: number | null;
  flow_min_m3s: number | null;
  flow_max_m3s: number | null;
  head_min_m: number | null;
  head_max_m: number | null;
  bep_flow_m3s: number | null;
  bep_head_m: number | null;
  bep_efficiency: number | null;
}

const pumpSelect = `
  SELECT p.id, p.supplier_id, s.code AS supplier_code, s.name AS supplier_name, p.model_code, p.display_name, p.kind,
         p.nominal_speed_rpm, p.voltage_v, p.phase_count, p.discharge_size_mm, p.solids_handling_mm, p.list_price,
         p.price_currency, p.status, r.number AS revision_number, r.flow_min_m3s, r.flow_max_m3s, r.head_min_m,
         r.head_max_m, r.bep_flow_m3s, r.bep_head_m, r.bep_efficiency
    FROM pumps p
    JOIN suppliers s ON s.id = p.supplier_id
    LEFT JOIN curve_revisions r ON r.id = p.current_revision_id`;

const sortColumns: Record<string, string> = {
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

interface PumpQuery {
  kind?: string;
  supplierId?: number;
  status?: 'active' | 'retired' | 'all';
  search?: string;
  flowMin?: number;
  flowMax?: number;
  headMin?: number;
  headMax?: number;
  flowUnit?: FlowUnit;
  headUnit?: HeadUnit;
  sort?: string;
  order?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

function json(value: unknown): unknown {
  return typeof value === 'string' ? JSON.parse(value) : value;
}

function isoDate(value: Date | string): string {
  return (value instanceof Date ? value : new Date(value)).toISOString();
}

export function createCatalogHandlers(sequelize: Sequelize) {
  const listSuppliers: RequestHandler = async (_request, response) => {
    const rows = await sequelize.query<{ id: number; code: string; name: string; pump_count: number | string }>(
      `SELECT s.id, s.code, s.name, COUNT(p.id) AS pump_count
         FROM suppliers s
         LEFT JOIN pumps p ON p.supplier_id = s.id AND p.status = 'active' AND p.current_revision_id IS NOT NULL
        GROUP BY s.id, s.code, s.name
        ORDER BY s.code`,
      { type: QueryTypes.SELECT },
    );
    const answer: SupplierList = {
      suppliers: rows.map((row) => ({ id: row.id, code: row.code, name: row.name, pumpCount: Number(row.pump_count) })),
    };
    response.json(answer);
  };

  const listPumps: RequestHandler = async (request, response) => {
    const query = request.query as PumpQuery;
    const where: string[] = [];
    const replacements: unknown[] = [];
    const status = query.status ?? 'active';
    if (status !== 'all') {
      where.push('p.status = ?');
      replacements.push(status);
    }
    if (query.kind) {
      where.push('p.kind = ?');
      replacements.push(query.kind);
    }
    if (query.supplierId) {
      where.push('p.supplier_id = ?');
      replacements.push(query.supplierId);
    }
    if (query.search) {
      where.push("(p.model_code LIKE ? ESCAPE '\\\\' OR p.display_name LIKE ? ESCAPE '\\\\')");
      replacements.push(likePattern(query.search), likePattern(query.search));
    }
    const flowUnit = query.flowUnit ?? 'm3/h';
    const headUnit = query.headUnit ?? 'm';
    if (query.flowMin !== undefined && query.flowMax !== undefined && query.flowMax < query.flowMin) {
      throw new ProblemError(
        400,
        'Invalid request',
        '/query/flowMax must not be below flowMin',
        [{ pointer: '/query/flowMax', detail: 'must not be below flowMin' }],
        'invalid-request',
      );
    }
    if (query.headMin !== undefined && query.headMax !== undefined && query.headMax < query.headMin) {
      throw new ProblemError(
        400,
        'Invalid request',
        '/query/headMax must not be below headMin',
        [{ pointer: '/query/headMax', detail: 'must not be below headMin' }],
        'invalid-request',
      );
    }
    // A pump passes a range when its published curve reaches into it.
    if (query.flowMin !== undefined) {
      where.push('r.flow_max_m3s >= ?');
      replacements.push(flowToSI(query.flowMin, flowUnit));
    }
    if (query.flowMax !== undefined) {
      where.push('r.flow_min_m3s <= ?');
      replacements.push(flowToSI(query.flowMax, flowUnit));
    }
    if (query.headMin !== undefined) {
      where.push('r.head_max_m >= ?');
      replacements.push(headToSI(query.headMin, headUnit));
    }
    if (query.headMax !== undefined) {
      where.push('r.head_min_m <= ?');
      replacements.push(headToSI(query.headMax, headUnit));
    }
    const whereSql = where.length > 0 ? `WHERE ${where.join(' AND ')}` : '';
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const sortColumn = sortColumns[query.sort ?? 'modelCode'] ?? sortColumns.modelCode;
    const order = query.order === 'desc' ? 'DESC' : 'ASC';
    const [countRow] = await sequelize.query<{ total: number | string }>(
      `SELECT COUNT(*) AS total FROM pumps p JOIN suppliers s ON s.id = p.supplier_id LEFT JOIN curve_revisions r ON r.id = p.current_revision_id ${whereSql}`,
      { replacements, type: QueryTypes.SELECT },
    );
    const rows = await sequelize.query<PumpRow>(
      `${pumpSelect} ${whereSql} ORDER BY ${sortColumn} ${order}, p.id ${order} LIMIT ? OFFSET ?`,
      {
        replacements: [...replacements, pageSize, (page - 1) * pageSize],
        type: QueryTypes.SELECT,
      },
    );
    const answer: PumpPage = {
      units: siUnits,
      total: Number(countRow.total),
      page,
      pageSize,
      items: rows.map(toPumpSummary),
    };
    response.json(answer);
  };

  const getPump: RequestHandler = async (request, response) => {
    const pumpId = Number(request.params.pumpId);
    const wanted = (request.query as { revision?: number }).revision;
    const [row] = await sequelize.query<PumpRow>(`${pumpSelect} WHERE p.id = ?`, {
      replacements: [pumpId],
      type: QueryTypes.SELECT,
    });
    if (!row)
      throw new ProblemError(404, 'Not found', `No pump has the id ${pumpId}`, [
        { pointer: '/path/pumpId', detail: 'no such pump' },
      ]);
    const revisionRows = await sequelize.query<{
      id: number;
      number: number;
      created_at: Date;
      imported_by: string;
      source_file_name: string;
      source_checksum: string;
      point_count: number;
      file_units: unknown;
      notes: string | null;
      fit: unknown;
    }>(
      `SELECT r.id, r.number, r.created_at, i.imported_by, r.source_file_name, r.source_checksum, r.point_count, r.file_units, r.notes, r.fit
         FROM curve_revisions r JOIN curve_imports i ON i.id = r.import_id
        WHERE r.pump_id = ? ORDER BY r.number DESC`,
      { replacements: [pumpId], type: QueryTypes.SELECT },
    );
    const revisions: CurveRevisionSummary[] = revisionRows.map((revision) => ({
      number: revision.number,
      current: revision.number === row.revision_number,
      importedAt: isoDate(revision.created_at),
      importedBy: revision.imported_by,
      sourceFileName: revision.source_file_name,
      sourceChecksum: revision.source_checksum,
      pointCount: revision.point_count,
    }));
    const number = wanted ?? row.revision_number;
    const chosen = revisionRows.find((revision) => revision.number === number);
    if (wanted !== undefined && !chosen) {
      throw new ProblemError(404, 'Not found', `Pump ${pumpId} has no revision ${wanted}`, [
        { pointer: '/query/revision', detail: `no such revision; this pump has ${revisionRows.length}` },
      ]);
    }
    let revision: PumpDetail['revision'] = null;
    if (chosen) {
      const points = await sequelize.query<{
        flow_m3s: number;
        head_m: number;
        power_w: number | null;
        efficiency: number | null;
        npsh_required_m: number | null;
      }>(
        'SELECT flow_m3s, head_m, power_w, efficiency, npsh_required_m FROM curve_points WHERE revision_id = ? ORDER BY position',
        { replacements: [chosen.id], type: QueryTypes.SELECT },
      );
      const ranges = await sequelize.query<{
        region: 'preferred' | 'allowable';
        flow_min_m3s: number;
        flow_max_m3s: number;
      }>('SELECT region, flow_min_m3s, flow_max_m3s FROM curve_declared_ranges WHERE revision_id = ?', {
        replacements: [chosen.id],
        type: QueryTypes.SELECT,
      });
      const range = (region: 'preferred' | 'allowable') => {
        const found = ranges.find((candidate) => candidate.region === region);
        return found ? { flowMin: found.flow_min_m3s, flowMax: found.flow_max_m3s } : null;
      };
      revision = {
        ...revisions.find((summary) => summary.number === chosen.number)!,
        fileUnits: json(chosen.file_units) as CurveFileUnits,
        notes: chosen.notes,
        points: points.map((point): CurvePointSi => ({
          flow: point.flow_m3s,
          head: point.head_m,
          ...(point.power_w !== null ? { power: point.power_w } : {}),
          ...(point.efficiency !== null ? { efficiency: point.efficiency } : {}),
          ...(point.npsh_required_m !== null ? { npshRequired: point.npsh_required_m } : {}),
        })),
        declaredRanges: { preferred: range('preferred'), allowable: range('allowable') },
        fit: json(chosen.fit) as StoredPumpCurveFit,
      };
    }
    const answer: PumpDetail = { units: siUnits, pump: toPumpSummary(row), revision, revisions };
    response.json(answer);
  };

  return { listSuppliers, listPumps, getPump };
}
