import type { CurveImportIssue, CurveImportPump, CurveImportReport } from '../shared/api/api-schemas';
import type { PowerBasis } from '../shared/hydraulics';
import { importIssueText } from '../shared/messages/import-issue-text';
import type { ImportIssue } from '../shared/messages/import-issues';
import { curveContentHash } from './curve-content-hash';
import { curveTableLimits } from './curve-table-format';
import type { ReadCurveTable, ReadPump, ReadPumpDetails } from './curve-table-reader';
import { checkPumpCurve, type CheckedPump } from './pump-curve-check';

/*
 * The pure half of an import: check every curve of a read file, compare each pump with what the
 * supplier holds already and say what a commit would do. No database: the server's catalog store
 * loads what exists and writes the plan.
 */

export type ImportPhase = 'reading' | 'checking' | 'writing';

export const siUnits = { flow: 'm3/s', head: 'm', power: 'W', efficiency: 'fraction', size: 'mm' } as const;

/** What the supplier holds already for one model code. */
export interface ExistingPump {
  id: number;
  details: ReadPumpDetails;
  contentHash: string | null;
  currentNumber: number | null;
  highestNumber: number;
}

export interface PlannedPump {
  read: ReadPump;
  checked: CheckedPump;
  contentHash: string;
  outcome: CurveImportPump['outcome'];
  changes: CurveImportPump['changes'];
  revisionNumber: number;
}

export interface CheckedCurveTable {
  read: ReadCurveTable;
  powerBasis: PowerBasis;
  pumps: Array<{ read: ReadPump; checked: CheckedPump }>;
  /** Any error at all, listed or not: nothing may be written. */
  hasErrors: boolean;
  listedErrors: ImportIssue[];
  errorsOmitted: number;
}

function sameDetails(a: ReadPumpDetails, b: ReadPumpDetails): boolean {
  const near = (x: number | null, y: number | null) =>
    x === null || y === null ? x === y : Math.abs(x - y) <= 1e-6 * Math.max(1, Math.abs(x));
  return (
    a.displayName === b.displayName &&
    a.kind === b.kind &&
    a.nominalSpeedRpm === b.nominalSpeedRpm &&
    a.speedMinRpm === b.speedMinRpm &&
    a.speedMaxRpm === b.speedMaxRpm &&
    (a.fixedSpeedsRpm ?? []).join(';') === (b.fixedSpeedsRpm ?? []).join(';') &&
    a.voltageV === b.voltageV &&
    a.phaseCount === b.phaseCount &&
    near(a.fullLoadCurrentA, b.fullLoadCurrentA) &&
    near(a.dischargeSizeMm, b.dischargeSizeMm) &&
    near(a.solidsHandlingMm, b.solidsHandlingMm) &&
    near(a.listPrice, b.listPrice) &&
    a.priceCurrency === b.priceCurrency &&
    near(a.motorEfficiency, b.motorEfficiency) &&
    a.status === b.status
  );
}

function byRow(a: ImportIssue, b: ImportIssue): number {
  return (a.row ?? 0) - (b.row ?? 0);
}

/** Fits and checks every pump of a read file; the file's and the curves' errors sorted by row. */
export function checkCurveTable(
  read: ReadCurveTable,
  onChecked?: (done: number, total: number) => void,
): CheckedCurveTable {
  const powerBasis: PowerBasis = read.fileUnits?.powerBasis ?? 'shaft';
  const errors = [...read.errors];
  const pumps = read.pumps.map((pump, index) => {
    const checked = checkPumpCurve(pump, powerBasis);
    errors.push(...checked.errors);
    onChecked?.(index + 1, read.pumps.length);
    return { read: pump, checked };
  });
  errors.sort(byRow);
  const listedErrors = errors.slice(0, curveTableLimits.maxErrorsListed);
  return {
    read,
    powerBasis,
    pumps,
    hasErrors: errors.length > 0 || read.errorsOmitted > 0,
    listedErrors,
    errorsOmitted: read.errorsOmitted + errors.length - listedErrors.length,
  };
}

export function planPumps(
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

export function pumpReport(plan: PlannedPump, withCurves: boolean): CurveImportPump {
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
    curveBasis: fit ? fit.curveBasis : null,
    declaredRanges: { preferred: read.preferred, allowable: read.allowable },
    ...(withCurves
      ? {
          points: read.points.map(({ row: _row, ...point }) => point),
          ...(fit ? { fit } : {}),
        }
      : {}),
    warnings: checked.warnings.map(reportedIssue),
  };
}

/** The report without points and fits, as the import record keeps it (they are in the revisions). */
export function storedReport(report: CurveImportReport): CurveImportReport {
  return { ...report, pumps: report.pumps.map(({ points: _points, fit: _fit, ...pump }) => pump) };
}

/** An issue as the report gives it: its code and values, and their sentence from the one table. */
export function reportedIssue(issue: ImportIssue): CurveImportIssue {
  const { message, expected } = importIssueText(issue);
  return { ...issue, message, ...(expected ? { expected } : {}) };
}

/**
 * One line for a person: where the issue is, what is wrong, what is expected, in the table's words
 * (a report's issue was made from an ImportIssue, so its code and params are one's).
 */
export function describeIssue(issue: ImportIssue | CurveImportIssue): string {
  const where = [issue.row !== null ? `row ${issue.row}` : null, issue.column ? `column ${issue.column}` : null]
    .filter(Boolean)
    .join(', ');
  const { message, expected } = importIssueText(issue as ImportIssue);
  return `${where || 'file'}: ${message}${expected ? ` (expected ${expected})` : ''}`;
}

/** The report of a checked file against a plan, as the API, the command and the import record give it. */
export function importReport(
  checked: CheckedCurveTable,
  plan: PlannedPump[],
  context: {
    supplier: CurveImportReport['supplier'];
    fileName: string;
    dryRun: boolean;
    committed: boolean;
    importId: number | null;
  },
): CurveImportReport {
  const { read } = checked;
  return {
    supplier: context.supplier,
    fileName: context.fileName,
    fileChecksum: read.fileChecksum,
    formatVersion: read.formatVersion,
    fileUnits: read.fileUnits,
    units: siUnits,
    dryRun: context.dryRun,
    committed: context.committed,
    importId: context.importId,
    rowCount: read.pointRowCount,
    pumpCount: read.pumps.length,
    counts: {
      new: plan.filter((pump) => pump.outcome === 'new').length,
      changed: plan.filter((pump) => pump.outcome === 'changed').length,
      unchanged: plan.filter((pump) => pump.outcome === 'unchanged').length,
    },
    pumps: plan.map((pump) => pumpReport(pump, true)),
    errors: checked.listedErrors.map(reportedIssue),
    errorsOmitted: checked.errorsOmitted,
    warnings: read.warnings.map(reportedIssue),
  };
}
