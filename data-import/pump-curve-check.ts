import {
  fitPumpCurve,
  HydraulicsInputError,
  type PumpCurveFit,
  type PumpCurvePoint,
  type PowerBasis,
} from '../shared/hydraulics';
import type { CurveImportIssue } from '../shared/api/api-schemas';
import { headRiseToleratedFraction } from './curve-table-format';
import type { ReadPump } from './curve-table-reader';

/*
 * The checks that need a whole pump: enough points, flows strictly increasing, head not rising
 * with flow (a small rise flagged, a large one refused), power and efficiency on every point or
 * none, and the engine's fit (shared/hydraulics/pump-curve-fit.ts), whose complaints are mapped
 * back to the file's rows.
 */

export interface CheckedPump {
  fit: PumpCurveFit | null;
  errors: CurveImportIssue[];
  warnings: CurveImportIssue[];
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

function fmt(value: number): string {
  return Number(value.toPrecision(4)).toString();
}

/** Maps an engine complaint (`/points/3/head`) to the row and column it came from. */
function engineIssue(pump: ReadPump, error: HydraulicsInputError): CurveImportIssue {
  const match = /^\/points\/(\d+)\/(\w+)$/.exec(error.field);
  if (match) {
    const point = pump.points[Number(match[1])];
    return {
      row: point?.row ?? pump.firstRow,
      column: pointFields[match[2] as keyof typeof pointFields] ?? match[2],
      message: error.message,
    };
  }
  if (error.field.startsWith('/allowableRegion'))
    return { row: pump.firstRow, column: 'allowable_flow_max', message: error.message };
  return { row: pump.firstRow, column: 'head', message: `pump ${pump.modelCode}: ${error.message}` };
}

export function checkPumpCurve(pump: ReadPump, powerBasis: PowerBasis): CheckedPump {
  const errors: CurveImportIssue[] = [];
  const warnings: CurveImportIssue[] = [...pump.warnings];
  const points = pump.points;
  if (pump.hasRowErrors) return { fit: null, errors, warnings };
  if (points.length < 3) {
    errors.push({
      row: pump.firstRow,
      column: 'flow',
      message: `pump ${pump.modelCode} has ${points.length} usable point(s)`,
      expected: 'at least three points per pump',
    });
    return { fit: null, errors, warnings };
  }
  const highest = Math.max(...points.map((point) => point.head));
  const fitted: PumpCurvePoint[] = [];
  let level = Infinity;
  points.forEach((point, index) => {
    const previous = points[index - 1];
    if (previous && !(point.flow > previous.flow)) {
      errors.push({
        row: point.row,
        column: 'flow',
        message: `the flow does not exceed the flow of row ${previous.row}`,
        expected: 'flows strictly increasing down the rows of a pump',
      });
    }
    if (previous && point.head > level) {
      const share = (point.head - level) / highest;
      if (share > headRiseToleratedFraction) {
        errors.push({
          row: point.row,
          column: 'head',
          message: `head rises from row ${previous.row} by ${(100 * share).toFixed(1)} % of the pump's highest head`,
          expected: `head not rising with flow (a rise up to ${100 * headRiseToleratedFraction} % of the highest head is flagged, more is refused)`,
        });
      } else {
        warnings.push({
          row: point.row,
          column: 'head',
          message: `head rises by ${(100 * share).toFixed(1)} % of the pump's highest head: flagged; the fit holds it level with the lowest head before it`,
          expected: 'head not rising with flow',
        });
      }
    }
    level = Math.min(level, point.head);
    fitted.push({
      flow: point.flow,
      head: Math.min(point.head, level),
      ...(point.power !== undefined ? { power: point.power } : {}),
      ...(point.efficiency !== undefined ? { efficiency: point.efficiency } : {}),
      ...(point.npshRequired !== undefined ? { npshRequired: point.npshRequired } : {}),
    });
  });
  for (const key of ['power', 'efficiency'] as const) {
    const given = points.filter((point) => point[key] !== undefined).length;
    if (given > 0 && given < points.length) {
      const missing = points.find((point) => point[key] === undefined)!;
      errors.push({
        row: missing.row,
        column: key,
        message: `pump ${pump.modelCode} gives ${key} on ${given} of its ${points.length} points`,
        expected: `${key} on every point of the pump, or on none`,
      });
    }
  }
  const npshPoints = points.filter((point) => point.npshRequired !== undefined);
  if (npshPoints.length > 0 && npshPoints.length < 3) {
    errors.push({
      row: npshPoints[0].row,
      column: 'npsh_required',
      message: `pump ${pump.modelCode} gives NPSH required on ${npshPoints.length} point(s)`,
      expected: 'NPSH required on at least three points, or on none',
    });
  }
  if (errors.length > 0) return { fit: null, errors, warnings };

  let fit: PumpCurveFit;
  try {
    fit = fitPumpCurve(fitted, { powerBasis, ...(pump.allowable ? { allowableRegion: pump.allowable } : {}) });
  } catch (error) {
    if (error instanceof HydraulicsInputError) return { fit: null, errors: [engineIssue(pump, error)], warnings };
    throw error;
  }
  for (const warning of fit.warnings) warnings.push({ row: pump.firstRow, column: null, message: warning });
  if (!fit.bep && fit.bepUnknownReason)
    warnings.push({ row: pump.firstRow, column: 'efficiency', message: `BEP unknown: ${fit.bepUnknownReason}` });
  if (fit.statistics.rmsHead > poorFitFraction * highest) {
    warnings.push({
      row: pump.firstRow,
      column: 'head',
      message: `the fitted curve misses the points by ${fmt(fit.statistics.rmsHead)} m RMS (worst ${fmt(fit.statistics.worstResidual)} m): check the data`,
    });
  }
  for (const [region, range] of [
    ['preferred', pump.preferred],
    ['allowable', pump.allowable],
  ] as const) {
    if (range && (range.flowMin < fit.flowMin - 1e-12 || range.flowMax > fit.flowMax + 1e-12)) {
      warnings.push({
        row: pump.firstRow,
        column: `${region}_flow_max`,
        message: `the ${region} range reaches beyond the published points`,
      });
    }
  }
  return { fit, errors, warnings };
}
