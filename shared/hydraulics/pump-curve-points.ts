import type { EngineInputError } from './engine-issues';
import { HydraulicsInputError, positiveError, rangeError } from './hydraulics-error';
import type { PumpCurvePoint } from './pump-curve-fit';

/** Largest flow (m3/s), head (m) and power (W) a curve point may carry: far beyond any pump Riffle selects. */
const POINT_LIMITS = Object.freeze({ flow: 100, head: 1e4, power: 1e9 });

/**
 * The rules every published pump curve must meet before it is fitted: at least three points, flows
 * strictly increasing from zero or more, head positive and not rising with flow, power and
 * efficiency on every point or on none, each value inside a generous physical limit. Our own rules
 * (a fit through fewer points or a rising curve cannot be ranked honestly); values SI.
 * @param points - published points: flow m3/s, head m, optional power W, efficiency 0-1, NPSH3 m
 * @returns nothing: it throws on the first rule broken
 * @throws HydraulicsInputError naming the point and field (`/points/2/head`)
 * @example
 * let field = null
 * try { validatePumpCurvePoints([{ flow: 0, head: 10 }, { flow: 0.005, head: 11 }, { flow: 0.01, head: 5 }]) } catch (error) { field = error.field }
 * field // => '/points/1/head'
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
 * errors[1].code // => 'head-rises'
 */
export function pumpCurvePointErrors(points: readonly PumpCurvePoint[]): EngineInputError[] {
  if (!Array.isArray(points) || points.length < 3) {
    const count = Array.isArray(points) ? points.length : 0;
    return [{ code: 'too-few-points', params: { count }, pointer: '/points' }];
  }
  const errors: (EngineInputError | null)[] = [];
  points.forEach((point, index) => {
    const field = `/points/${index}`;
    errors.push(
      rangeError(point.flow, 0, POINT_LIMITS.flow, `${field}/flow`, 'flow (m3/s)'),
      positiveError(point.head, `${field}/head`, 'head') ??
        rangeError(point.head, 0, POINT_LIMITS.head, `${field}/head`, 'head (m)'),
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
    if (previous && point.head > previous.head) {
      errors.push({
        code: 'head-rises',
        params: { head: point.head, previousHead: previous.head },
        pointer: `${field}/head`,
      });
    }
  });
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
  const npsh = points.filter((point) => point.npshRequired !== undefined).length;
  if (npsh > 0 && npsh < 3) {
    const first = points.findIndex((point) => point.npshRequired !== undefined);
    errors.push({ code: 'npsh-too-few-points', params: { count: npsh }, pointer: `/points/${first}/npshRequired` });
  }
  return errors.filter((error) => error !== null);
}
