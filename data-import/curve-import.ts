import type { Readable } from 'node:stream';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { PowerBasis } from '../shared/hydraulics';
import type { CurveImportIssue, CurveImportPump, CurveImportReport } from '../shared/api/api-schemas';
import { CurveImport, Pump, type Supplier } from '../server/database/models';
import type { CurveImportChannel } from '../server/database/models/curve-import';
import { curveContentHash } from './curve-content-hash';
import { curveTableLimits } from './curve-table-format';
import { readCurveTable, type ReadPump, type ReadPumpDetails } from './curve-table-reader';
import { checkPumpCurve, type CheckedPump } from './pump-curve-check';

/*
 * The one import path, used by the command, the API and the demo seed: read and check the file,
 * fit every curve, compare with what the supplier already has, and (unless a dry run) write
 * every pump of the file in one transaction, or none.
 */

export interface ImportActor {
  /** The account that imports; null for the command line and the demo seed. */
  userId: number | null;
  /** Who, readably: an e-mail, or "command line (user)". */
  label: string;
  channel: CurveImportChannel;
}

export type ImportPhase = 'reading' | 'checking' | 'writing';

export interface CurveImportOptions {
  sequelize: Sequelize;
  supplier: Supplier;
  source: Readable;
  fileName: string;
  dryRun: boolean;
  actor: ImportActor;
  /** The file's size when known, so that progress can be shown as a fraction. */
  totalBytes?: number;
  onProgress?: (phase: ImportPhase, done: number, total: number) => void;
  maxFileBytes?: number;
  maxPointRows?: number;
}

export const siUnits = { flow: 'm3/s', head: 'm', power: 'W', efficiency: 'fraction', size: 'mm' } as const;

/** What the supplier holds already for one model code. */
interface ExistingPump {
  id: number;
  details: ReadPumpDetails;
  contentHash: string | null;
  currentNumber: number | null;
  highestNumber: number;
}

interface PlannedPump {
  read: ReadPump;
  checked: CheckedPump;
  contentHash: string;
  outcome: CurveImportPump['outcome'];
  changes: CurveImportPump['changes'];
  revisionNumber: number;
}

const pointRowsPerInsert = 4000;

function sameDetails(a: ReadPumpDetails, b: ReadPumpDetails): boolean {
  const near = (x: number | null, y: number | null) =>
    x === null || y === null ? x === y : Math.abs(x - y) <= 1e-6 * Math.max(1, Math.abs(x));
  return (
    a.displayName === b.displayName &&
    a.kind === b.kind &&
    a.nominalSpeedRpm === b.nominalSpeedRpm &&
    a.voltageV === b.voltageV &&
    a.phaseCount === b.phaseCount &&
    near(a.dischargeSizeMm, b.dischargeSizeMm) &&
    near(a.solidsHandlingMm, b.solidsHandlingMm) &&
    near(a.listPrice, b.listPrice) &&
    a.priceCurrency === b.priceCurrency &&
    a.status === b.status
  );
}

async function loadExistingPumps(
  sequelize: Sequelize,
  supplierId: number,
  transaction?: Transaction,
): Promise<Map<string, ExistingPump>> {
  const rows = await sequelize.query<{
    id: number;
    model_code: string;
    display_name: string;
    kind: ReadPumpDetails['kind'];
    nominal_speed_rpm: number | null;
    voltage_v: number | null;
    phase_count: number | null;
    discharge_size_mm: number | null;
    solids_handling_mm: number | null;
    list_price: string | null;
    price_currency: string | null;
    status: ReadPumpDetails['status'];
    content_hash: string | null;
    current_number: number | null;
    highest_number: number | null;
  }>(
    `SELECT p.id, p.model_code, p.display_name, p.kind, p.nominal_speed_rpm, p.voltage_v, p.phase_count, p.discharge_size_mm,
            p.solids_handling_mm, p.list_price, p.price_currency, p.status, r.content_hash, r.number AS current_number,
            (SELECT MAX(x.number) FROM curve_revisions x WHERE x.pump_id = p.id) AS highest_number
       FROM pumps p LEFT JOIN curve_revisions r ON r.id = p.current_revision_id
      WHERE p.supplier_id = ?`,
    { replacements: [supplierId], type: QueryTypes.SELECT, transaction },
  );
  return new Map(
    rows.map((row) => [
      row.model_code,
      {
        id: row.id,
        contentHash: row.content_hash,
        currentNumber: row.current_number,
        highestNumber: Number(row.highest_number ?? 0),
        details: {
          displayName: row.display_name,
          kind: row.kind,
          nominalSpeedRpm: row.nominal_speed_rpm,
          voltageV: row.voltage_v,
          phaseCount: row.phase_count,
          dischargeSizeMm: row.discharge_size_mm,
          solidsHandlingMm: row.solids_handling_mm,
          listPrice: row.list_price === null ? null : Number(row.list_price),
          priceCurrency: row.price_currency,
          status: row.status,
          notes: null,
        },
      },
    ]),
  );
}

function planPumps(
  pumps: ReadonlyArray<{ read: ReadPump; checked: CheckedPump }>,
  existing: Map<string, ExistingPump>,
  powerBasis: PowerBasis,
): PlannedPump[] {
  return pumps.map(({ read, checked }) => {
    const contentHash = curveContentHash({
      points: read.points,
      preferred: read.preferred,
      allowable: read.allowable,
      powerBasis,
      notes: read.details.notes,
    });
    const known = existing.get(read.modelCode);
    if (checked.errors.length > 0 || !checked.fit) {
      return { read, checked, contentHash, outcome: 'refused', changes: [], revisionNumber: known?.currentNumber ?? 0 };
    }
    if (!known) return { read, checked, contentHash, outcome: 'new', changes: ['curve', 'details'], revisionNumber: 1 };
    const changes: CurveImportPump['changes'] = [];
    if (known.contentHash !== contentHash) changes.push('curve');
    if (!sameDetails(known.details, read.details)) changes.push('details');
    return {
      read,
      checked,
      contentHash,
      outcome: changes.length > 0 ? 'changed' : 'unchanged',
      changes,
      revisionNumber: changes.includes('curve') ? known.highestNumber + 1 : (known.currentNumber ?? 0),
    };
  });
}

function pumpReport(plan: PlannedPump, withCurves: boolean): CurveImportPump {
  const { read, checked } = plan;
  const fit = checked.fit;
  return {
    modelCode: read.modelCode,
    displayName: read.details.displayName,
    kind: read.details.kind,
    firstRow: read.firstRow,
    lastRow: read.lastRow,
    outcome: plan.outcome,
    changes: plan.changes,
    revisionNumber: plan.revisionNumber,
    rmsHead: fit ? fit.statistics.rmsHead : null,
    worstResidual: fit ? fit.statistics.worstResidual : null,
    bep: fit?.bep ?? null,
    bepUnknownReason: fit ? fit.bepUnknownReason : null,
    declaredRanges: { preferred: read.preferred, allowable: read.allowable },
    ...(withCurves
      ? {
          points: read.points.map(({ row: _row, ...point }) => point),
          ...(fit ? { fit } : {}),
        }
      : {}),
    warnings: checked.warnings,
  };
}

/** The report without points and fits, as the import record keeps it (they are in the revisions). */
export function storedReport(report: CurveImportReport): CurveImportReport {
  return { ...report, pumps: report.pumps.map(({ points: _points, fit: _fit, ...pump }) => pump) };
}

/** One line for a person: where the issue is, what is wrong, what is expected. */
export function describeIssue(issue: CurveImportIssue): string {
  const where = [issue.row !== null ? `row ${issue.row}` : null, issue.column ? `column ${issue.column}` : null]
    .filter(Boolean)
    .join(', ');
  return `${where || 'file'}: ${issue.message}${issue.expected ? ` (expected ${issue.expected})` : ''}`;
}

function byRow(a: CurveImportIssue, b: CurveImportIssue): number {
  return (a.row ?? 0) - (b.row ?? 0);
}

/**
 * Checks a curve-table file and, unless `dryRun`, writes it. The report lists errors by row and
 * column; when there is any error nothing is written. Throws only for failures of the system
 * (the database), never for what the file holds.
 */
export async function importCurveTable(options: CurveImportOptions): Promise<CurveImportReport> {
  const { sequelize, supplier, actor, onProgress } = options;
  const read = await readCurveTable(options.source, {
    maxFileBytes: options.maxFileBytes,
    maxPointRows: options.maxPointRows,
    onBytes: (bytes) => onProgress?.('reading', bytes, options.totalBytes ?? bytes),
  });
  const powerBasis: PowerBasis = read.fileUnits?.powerBasis ?? 'shaft';
  const errors = [...read.errors];
  const checkedPumps = read.pumps.map((pump, index) => {
    const checked = checkPumpCurve(pump, powerBasis);
    errors.push(...checked.errors);
    onProgress?.('checking', index + 1, read.pumps.length);
    return { read: pump, checked };
  });
  errors.sort(byRow);
  const listedErrors = errors.slice(0, curveTableLimits.maxErrorsListed);
  const errorsOmitted = read.errorsOmitted + errors.length - listedErrors.length;

  const report = (plan: PlannedPump[], committed: boolean, importId: number | null): CurveImportReport => ({
    supplier: { id: supplier.id, code: supplier.code, name: supplier.name },
    fileName: options.fileName,
    fileChecksum: read.fileChecksum,
    formatVersion: read.formatVersion,
    fileUnits: read.fileUnits,
    units: siUnits,
    dryRun: options.dryRun,
    committed,
    importId,
    rowCount: read.pointRowCount,
    pumpCount: read.pumps.length,
    counts: {
      new: plan.filter((pump) => pump.outcome === 'new').length,
      changed: plan.filter((pump) => pump.outcome === 'changed').length,
      unchanged: plan.filter((pump) => pump.outcome === 'unchanged').length,
    },
    pumps: plan.map((pump) => pumpReport(pump, true)),
    errors: listedErrors,
    errorsOmitted,
    warnings: read.warnings,
  });

  if (errors.length > 0 || read.errorsOmitted > 0 || options.dryRun) {
    const existing = await loadExistingPumps(sequelize, supplier.id);
    return report(planPumps(checkedPumps, existing, powerBasis), false, null);
  }

  return sequelize.transaction(async (transaction) => {
    // One import per supplier at a time: the plan below is made under this lock.
    await sequelize.query('SELECT id FROM suppliers WHERE id = ? FOR UPDATE', {
      replacements: [supplier.id],
      transaction,
    });
    const existing = await loadExistingPumps(sequelize, supplier.id, transaction);
    const plan = planPumps(checkedPumps, existing, powerBasis);
    const toWrite = plan.filter((pump) => pump.outcome === 'new' || pump.outcome === 'changed');
    if (toWrite.length === 0) return report(plan, false, null);

    const draft = report(plan, true, null);
    const record = await CurveImport.create(
      {
        supplierId: supplier.id,
        importedByUserId: actor.userId,
        importedBy: actor.label.slice(0, 200),
        channel: actor.channel,
        fileName: options.fileName.slice(0, 255),
        fileChecksum: read.fileChecksum,
        fileUnits: read.fileUnits ?? {},
        rowCount: read.pointRowCount,
        pumpCount: read.pumps.length,
        newCount: draft.counts.new,
        changedCount: draft.counts.changed,
        unchangedCount: draft.counts.unchanged,
        report: storedReport(draft),
      },
      { transaction },
    );
    await writePumps(sequelize, {
      supplierId: supplier.id,
      importId: record.id,
      plan: toWrite,
      fileName: options.fileName,
      fileChecksum: read.fileChecksum,
      fileUnits: read.fileUnits ?? {},
      transaction,
      onProgress,
    });
    return { ...draft, importId: record.id };
  });
}

interface WriteOptions {
  supplierId: number;
  importId: number;
  plan: PlannedPump[];
  fileName: string;
  fileChecksum: string;
  fileUnits: object;
  transaction: Transaction;
  onProgress?: CurveImportOptions['onProgress'];
}

/** The writes of one import, all inside the caller's transaction. */
async function writePumps(sequelize: Sequelize, options: WriteOptions): Promise<void> {
  const { supplierId, importId, plan, transaction, onProgress } = options;
  const queryInterface = sequelize.getQueryInterface();
  const totalSteps = plan.length * 2;
  const now = new Date();

  const detailRows = plan.filter((pump) => pump.changes.includes('details'));
  if (detailRows.length > 0) {
    await Pump.bulkCreate(
      detailRows.map(({ read }) => {
        const { notes: _notes, ...details } = read.details;
        return {
          supplierId,
          modelCode: read.modelCode,
          ...details,
          listPrice: details.listPrice === null ? null : details.listPrice.toFixed(2),
          currentRevisionId: null,
        };
      }),
      {
        transaction,
        updateOnDuplicate: [
          'displayName',
          'kind',
          'nominalSpeedRpm',
          'voltageV',
          'phaseCount',
          'dischargeSizeMm',
          'solidsHandlingMm',
          'listPrice',
          'priceCurrency',
          'status',
          'updatedAt',
        ],
      },
    );
  }
  onProgress?.('writing', plan.length, totalSteps);

  const curveRows = plan.filter((pump) => pump.changes.includes('curve'));
  if (curveRows.length === 0) return;
  const pumpIds = new Map(
    (
      await sequelize.query<{ id: number; model_code: string }>(
        'SELECT id, model_code FROM pumps WHERE supplier_id = ?',
        {
          replacements: [supplierId],
          type: QueryTypes.SELECT,
          transaction,
        },
      )
    ).map((row) => [row.model_code, row.id]),
  );
  await queryInterface.bulkInsert(
    'curve_revisions',
    curveRows.map(({ read, checked, contentHash, revisionNumber }) => {
      const fit = checked.fit!;
      const heads = read.points.map((point) => point.head);
      return {
        pump_id: pumpIds.get(read.modelCode),
        number: revisionNumber,
        import_id: importId,
        source_file_name: options.fileName.slice(0, 255),
        source_checksum: options.fileChecksum,
        content_hash: contentHash,
        file_units: JSON.stringify(options.fileUnits),
        notes: read.details.notes,
        point_count: read.points.length,
        flow_min_m3s: fit.flowMin,
        flow_max_m3s: fit.flowMax,
        head_min_m: Math.min(...heads),
        head_max_m: Math.max(...heads),
        bep_flow_m3s: fit.bep?.flow ?? null,
        bep_head_m: fit.bep?.head ?? null,
        bep_efficiency: fit.bep?.efficiency ?? null,
        fit: JSON.stringify(fit),
        created_at: now,
      };
    }),
    { transaction },
  );
  const revisionIds = new Map(
    (
      await sequelize.query<{ id: number; pump_id: number }>(
        'SELECT id, pump_id FROM curve_revisions WHERE import_id = ?',
        {
          replacements: [importId],
          type: QueryTypes.SELECT,
          transaction,
        },
      )
    ).map((row) => [row.pump_id, row.id]),
  );

  const pointRows: object[] = [];
  const rangeRows: object[] = [];
  let written = plan.length;
  const flushPoints = async () => {
    if (pointRows.length === 0) return;
    await queryInterface.bulkInsert('curve_points', pointRows.splice(0), { transaction });
  };
  for (const { read } of curveRows) {
    const revisionId = revisionIds.get(pumpIds.get(read.modelCode)!);
    read.points.forEach((point, position) => {
      pointRows.push({
        revision_id: revisionId,
        position,
        flow_m3s: point.flow,
        head_m: point.head,
        power_w: point.power ?? null,
        efficiency: point.efficiency ?? null,
        npsh_required_m: point.npshRequired ?? null,
      });
    });
    for (const [region, range] of [
      ['preferred', read.preferred],
      ['allowable', read.allowable],
    ] as const) {
      if (range)
        rangeRows.push({ revision_id: revisionId, region, flow_min_m3s: range.flowMin, flow_max_m3s: range.flowMax });
    }
    written += 1;
    if (pointRows.length >= pointRowsPerInsert) {
      await flushPoints();
      onProgress?.('writing', written, totalSteps);
    }
  }
  await flushPoints();
  if (rangeRows.length > 0) await queryInterface.bulkInsert('curve_declared_ranges', rangeRows, { transaction });
  await sequelize.query(
    `UPDATE pumps p JOIN curve_revisions r ON r.pump_id = p.id
        SET p.current_revision_id = r.id, p.updated_at = ?
      WHERE r.import_id = ?`,
    { replacements: [now, importId], transaction },
  );
  onProgress?.('writing', totalSteps, totalSteps);
}
