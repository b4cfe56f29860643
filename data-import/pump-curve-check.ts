import {
  droopPeakIndex,
  fitPumpCurveWithIssues,
  flowOrdered,
  HydraulicsInputError,
  pumpCurvePointErrors,
  type EngineInputError,
  type PumpCurveFit,
  type PumpCurvePoint,
  type PowerBasis,
} from '../shared/hydraulics';
import type { ImportIssue } from '../shared/messages/import-issues';
import { issue } from './curve-table-cells';
import { headRiseToleratedFraction } from './curve-table-format';
import type { ReadPump } from './curve-table-reader';

/*
 * The checks that need a whole pump: the engine's point rules (shared/hydraulics/pump-curve-points.ts:
 * enough points or a two-point sheet, flows strictly increasing or all falling (then reversed, with
 * a warning), zero head on the last point only, power and efficiency on every point or none, a
 * plausible peak efficiency, NPSH on three or more), the importer's own head rule right of the peak
 * (a small rise flagged and levelled, a large one refused; a rise to the peak larger than that is a
 * drooping curve the engine uses from its peak on) and the engine's fit, whose complaints are mapped
 * back to the file's rows.
 */

export interface CheckedPump {
  fit: PumpCurveFit | null;
  errors: ImportIssue[];
  warnings: ImportIssue[];
}

/** The fit's RMS residual above this fraction of the highest head is worth a warning (our own threshold). */
const poorFitFraction = 0.03;

const pointFields = {
  flow: 'flow',
  head: 'head',
  power: 'power',
  efficiency: 'efficiency',
  npshRequired: 'npsh_required',
} as const;

/** The fit's allowable-region inputs and the columns they came from. */
const regionColumns: Readonly<Record<string, string>> = {
  '/allowableRegion/flowMin': 'allowable_flow_min',
  '/allowableRegion/flowMax': 'allowable_flow_max',
};

/** Maps an engine complaint (`/points/3/head`) to the row and column it came from, with the importer's code. */
function engineIssue(pump: ReadPump, error: EngineInputError): ImportIssue {
  const match = /^\/points\/(\d+)\/(\w+)$/.exec(error.pointer);
  const index = match ? Number(match[1]) : -1;
  const point = pump.points[index];
  const row = point?.row ?? pump.firstRow;
  const column = match ? (pointFields[match[2] as keyof typeof pointFields] ?? match[2]) : null;
  const { modelCode } = pump;
  switch (error.code) {
    case 'too-few-points':
      return issue(pump.firstRow, 'flow', 'too-few-points', { modelCode, count: error.params.count });
    case 'flow-not-increasing':
      return issue(row, 'flow', 'flow-not-increasing', { previousRow: pump.points[index - 1].row });
    case 'not-on-every-point':
      return issue(row, error.params.what, 'value-on-some-points', {
        modelCode,
        value: error.params.what,
        given: error.params.given,
        count: error.params.count,
      });
    case 'npsh-too-few-points':
      return issue(row, 'npsh_required', 'npsh-on-few-points', { modelCode, count: error.params.count });
    default:
      return issue(row, point ? column : (regionColumns[error.pointer] ?? 'head'), 'curve-refused', {
        modelCode,
        error,
        pointRow: point ? row : null,
      });
  }
}

export function checkPumpCurve(pump: ReadPump, powerBasis: PowerBasis): CheckedPump {
  const warnings: ImportIssue[] = [...pump.warnings];
  if (pump.hasRowErrors) return { fit: null, errors: [], warnings };
  const ordered = flowOrdered(pump.points);
  const points = ordered.points;
  const highest = Math.max(...points.map((point) => point.head));
  // A rise to the peak within the importer's tolerance is levelled below, not taken as a droop.
  const droopPeak = droopPeakIndex(points);
  const peak =
    droopPeak > 0 && (points[droopPeak].head - points[0].head) / highest > headRiseToleratedFraction ? droopPeak : 0;
  // The engine refuses any rise after the peak; the importer's own rule below tolerates a small one.
  const ruleErrors = pumpCurvePointErrors(pump.points).filter(
    (error) => error.code !== 'head-rises' && (peak > 0 || error.code !== 'droop-too-few-points'),
  );
  const errors = ruleErrors.map((error) => engineIssue(pump, error));
  if (ruleErrors.some((error) => error.code === 'too-few-points')) return { fit: null, errors, warnings };
  if (ordered.reversed)
    warnings.push(issue(pump.firstRow, 'flow', 'fit-issue', { issue: { code: 'points-reversed', params: {} } }));
  const fitted: PumpCurvePoint[] = [];
  let level = Infinity;
  points.forEach((point, index) => {
    const previous = points[index - 1];
    if (index >= peak && previous && point.head > level) {
      const share = (point.head - level) / highest;
      if (share > headRiseToleratedFraction) {
        errors.push(
          issue(point.row, 'head', 'head-rise-refused', {
            previousRow: previous.row,
            share,
            tolerated: headRiseToleratedFraction,
          }),
        );
      } else warnings.push(issue(point.row, 'head', 'head-rise-flagged', { share }));
    }
    if (index >= peak) level = Math.min(level, point.head);
    fitted.push({
      flow: point.flow,
      head: Math.min(point.head, level),
      ...(point.power !== undefined ? { power: point.power } : {}),
      ...(point.efficiency !== undefined ? { efficiency: point.efficiency } : {}),
      ...(point.npshRequired !== undefined ? { npshRequired: point.npshRequired } : {}),
    });
  });
  if (errors.length > 0) return { fit: null, errors, warnings };

  let result: ReturnType<typeof fitPumpCurveWithIssues>;
  try {
    result = fitPumpCurveWithIssues(fitted, {
      powerBasis,
      ...(pump.allowable ? { allowableRegion: pump.allowable } : {}),
    });
  } catch (error) {
    if (error instanceof HydraulicsInputError)
      return { fit: null, errors: [engineIssue({ ...pump, points: [...points] }, error.issue)], warnings };
    throw error;
  }
  const { fit, issues } = result;
  for (const fitIssue of issues) warnings.push(issue(pump.firstRow, null, 'fit-issue', { issue: fitIssue }));
  if (!fit.bep && fit.bepUnknownReason)
    warnings.push(issue(pump.firstRow, 'efficiency', 'bep-unknown', { reason: fit.bepUnknownReason }));
  if (fit.statistics.rmsHead > poorFitFraction * highest) {
    warnings.push(
      issue(pump.firstRow, 'head', 'poor-fit', {
        rmsHead: fit.statistics.rmsHead,
        worstResidual: fit.statistics.worstResidual,
      }),
    );
  }
  for (const [region, range] of [
    ['preferred', pump.preferred],
    ['allowable', pump.allowable],
  ] as const) {
    if (range && (range.flowMin < fit.flowMin - 1e-12 || range.flowMax > fit.flowMax + 1e-12)) {
      warnings.push(issue(pump.firstRow, `${region}_flow_max`, 'range-beyond-points', { region }));
    }
  }
  return { fit, errors, warnings };
}
