import type { EngineInputError } from './engine-issues';
import { HydraulicsInputError, positiveError, rangeError } from './hydraulics-error';
import type { PumpCurvePoint } from './pump-curve-fit';

/** Largest flow (m3/s), head (m) and power (W) a curve point may carry: far beyond any pump Riffle selects. */
const POINT_LIMITS = Object.freeze({ flow: 100, head: 1e4, power: 1e9 });

/**
 * Lowest peak efficiency a curve may state: 5 %. Our own judgement: the smallest fountain pumps
 * still reach some 10 % wire-to-water, so a lower peak is a typing slip; a peak of 1 % or less is
 * almost always a fraction typed under a percent unit (0.58 for 58 %).
 */
export const LEAST_PEAK_EFFICIENCY = 0.05;

/** Peak efficiency (fraction) at or below which the values look like fractions typed as percent. */
export const FRACTION_AS_PERCENT = 0.01;

/**
 * The points in increasing flow order: a curve typed from its largest flow down (every flow
 * below the one before) is reversed, as published tables often run that way; any other order is
 * left for the rules to refuse.
 * @param points - published points in the order given
 * @returns the points in increasing flow order, and whether they were reversed
 * @example
 * flowOrdered([{ flow: 0.01, head: 5 }, { flow: 0.005, head: 8 }, { flow: 0, head: 10 }]).reversed // => true
 */
export function flowOrdered<Point extends { flow: number }>(
  points: readonly Point[],
): { points: readonly Point[]; reversed: boolean } {
  const reversed =
    points.length >= 2 && points.every((point, index) => index === 0 || point.flow < points[index - 1].flow);
  return { points: reversed ? [...points].reverse() : points, reversed };
}

/**
 * Index of the first point of highest head of a drooping curve (head never falling before that
 * peak, rising to it at least once), where such a curve starts to be usable; 0 for any other
 * curve, whose rises the rules refuse.
 * @param points - published points in increasing flow order
 * @returns the index of the peak, or 0
 * @example
 * droopPeakIndex([{ flow: 0, head: 9 }, { flow: 0.002, head: 10 }, { flow: 0.004, head: 9 }, { flow: 0.006, head: 6 }]) // => 1
 * droopPeakIndex([{ flow: 0, head: 9 }, { flow: 0.002, head: 8 }, { flow: 0.004, head: 10 }, { flow: 0.006, head: 6 }]) // => 0
 */
export function droopPeakIndex(points: readonly { head: number }[]): number {
  let peak = 0;
  points.forEach((point, index) => {
    if (point.head > points[peak].head) peak = index;
  });
  const climbs = points.slice(1, peak + 1).every((point, index) => point.head >= points[index].head);
  return climbs ? peak : 0;
}

/**
 * A two-point sheet: the head at zero flow and the flow at zero head, all a cheap pump's box
 * prints; fitted by the stated fallback shape (estimatedTwoPointHead).
 * @param points - published points in increasing flow order
 * @returns true for exactly two points, the first at zero flow, the last at zero head
 * @example
 * isTwoPointSheet([{ flow: 0, head: 3 }, { flow: 0.001, head: 0 }]) // => true
 */
export function isTwoPointSheet(points: readonly PumpCurvePoint[]): boolean {
  return points.length === 2 && points[0].flow === 0 && points[1].head === 0 && points[0].head > 0;
}

/**
 * The rules every published pump curve must meet before it is fitted: three points or more, or a
 * two-point sheet (shut-off and open flow); flows strictly increasing from zero or more (a table
 * typed in falling flow order is reversed first, pointers still naming the points as typed); head
 * positive, zero allowed on the last point only (the open-flow point); head not rising after its
 * peak (a rise before it is a drooping curve, used right of the peak, which needs three points
 * there); power and efficiency on every point or on none, a peak efficiency of at least
 * LEAST_PEAK_EFFICIENCY; each value inside a generous physical limit. Our own rules (a fit
 * through fewer points or a rising curve cannot be ranked honestly); values SI.
 * @param points - published points: flow m3/s, head m, optional power W, efficiency 0-1, NPSH3 m
 * @returns nothing: it throws on the first rule broken
 * @throws HydraulicsInputError naming the point and field (`/points/2/head`)
 * @example
 * let field = null
 * try { validatePumpCurvePoints([{ flow: 0, head: 10 }, { flow: 0.005, head: 11 }, { flow: 0.01, head: 5 }, { flow: 0.015, head: 6 }]) } catch (error) { field = error.field }
 * field // => '/points/3/head'
 */
export function validatePumpCurvePoints(points: readonly PumpCurvePoint[]): void {
  const [first] = pumpCurvePointErrors(points);
  if (first) throw new HydraulicsInputError(first);
}

/**
 * Every breach of the rules above, and of NPSH required given on three points or more or on none,
 * in the order they are checked (the first is the one validatePumpCurvePoints throws), so a caller
 * reporting many at once (the curve-table import) applies the same rules. Our own rules; values SI.
 * @param points - published points: flow m3/s, head m, optional power W, efficiency 0-1, NPSH3 m
 * @returns the refusals, each with its code, values and pointer; empty when the points are good
 * @example
 * const errors = pumpCurvePointErrors([{ flow: 0, head: 10 }, { flow: 0, head: 11 }, { flow: 0.01, head: 5 }])
 * errors.length // => 2
 * errors[0].pointer // => '/points/1/flow'
 * errors[1].code // => 'droop-too-few-points'
 */
export function pumpCurvePointErrors(points: readonly PumpCurvePoint[]): EngineInputError[] {
  if (!Array.isArray(points)) return [{ code: 'too-few-points', params: { count: 0 }, pointer: '/points' }];
  const ordered = flowOrdered(points);
  const errors = orderedPointErrors(ordered.points);
  if (!ordered.reversed) return errors;
  const last = points.length - 1;
  return errors.map((error) => ({
    ...error,
    pointer: error.pointer.replace(/^\/points\/(\d+)/, (_, index: string) => `/points/${last - Number(index)}`),
  }));
}

function orderedPointErrors(points: readonly PumpCurvePoint[]): EngineInputError[] {
  if (points.length < 3 && !isTwoPointSheet(points)) {
    return [{ code: 'too-few-points', params: { count: points.length }, pointer: '/points' }];
  }
  const errors: (EngineInputError | null)[] = [];
  const last = points.length - 1;
  const peak = droopPeakIndex(points);
  points.forEach((point, index) => {
    const field = `/points/${index}`;
    errors.push(
      rangeError(point.flow, 0, POINT_LIMITS.flow, `${field}/flow`, 'flow (m3/s)'),
      index === last
        ? rangeError(point.head, 0, POINT_LIMITS.head, `${field}/head`, 'head (m)')
        : point.head === 0
          ? { code: 'zero-head-not-last', params: {}, pointer: `${field}/head` }
          : (positiveError(point.head, `${field}/head`, 'head') ??
            rangeError(point.head, 0, POINT_LIMITS.head, `${field}/head`, 'head (m)')),
      point.power === undefined ? null : rangeError(point.power, 0, POINT_LIMITS.power, `${field}/power`, 'power (W)'),
      point.efficiency === undefined
        ? null
        : rangeError(point.efficiency, 0, 1, `${field}/efficiency`, 'efficiency (fraction)'),
      point.npshRequired === undefined
        ? null
        : positiveError(point.npshRequired, `${field}/npshRequired`, 'NPSH required'),
    );
    const previous = points[index - 1];
    if (previous && !(point.flow > previous.flow)) {
      errors.push({
        code: 'flow-not-increasing',
        params: { flow: point.flow, previousFlow: previous.flow },
        pointer: `${field}/flow`,
      });
    }
    if (previous && index > peak && point.head > previous.head) {
      errors.push({
        code: 'head-rises',
        params: { head: point.head, previousHead: previous.head },
        pointer: `${field}/head`,
      });
    }
  });
  if (peak > 0 && points.length - peak < 3) {
    errors.push({
      code: 'droop-too-few-points',
      params: { count: points.length - peak },
      pointer: `/points/${peak}/head`,
    });
  }
  for (const key of ['power', 'efficiency'] as const) {
    const given = points.filter((point) => point[key] !== undefined).length;
    if (given > 0 && given < points.length) {
      const missing = points.findIndex((point) => point[key] === undefined);
      errors.push({
        code: 'not-on-every-point',
        params: { what: key, given, count: points.length },
        pointer: `/points/${missing}/${key}`,
      });
    }
  }
  errors.push(peakEfficiencyError(points));
  const npsh = points.filter((point) => point.npshRequired !== undefined).length;
  if (npsh > 0 && npsh < 3) {
    const first = points.findIndex((point) => point.npshRequired !== undefined);
    errors.push({ code: 'npsh-too-few-points', params: { count: npsh }, pointer: `/points/${first}/npshRequired` });
  }
  return errors.filter((error) => error !== null);
}

/** Efficiencies given on every point whose peak is implausibly low (LEAST_PEAK_EFFICIENCY), else null. */
function peakEfficiencyError(points: readonly PumpCurvePoint[]): EngineInputError | null {
  if (!points.every((point) => typeof point.efficiency === 'number' && Number.isFinite(point.efficiency))) return null;
  const efficiencies = points.map((point) => point.efficiency as number);
  const peak = Math.max(...efficiencies);
  if (peak >= LEAST_PEAK_EFFICIENCY) return null;
  const pointer = `/points/${efficiencies.indexOf(peak)}/efficiency`;
  return peak > 0 && peak <= FRACTION_AS_PERCENT
    ? { code: 'efficiency-looks-like-fraction', params: { peak }, pointer }
    : { code: 'efficiency-implausibly-low', params: { peak, least: LEAST_PEAK_EFFICIENCY }, pointer };
}
