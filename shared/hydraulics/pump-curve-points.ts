import { HydraulicsInputError, requireInRange, requirePositive } from './hydraulics-error';
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
  if (!Array.isArray(points) || points.length < 3) {
    throw new HydraulicsInputError(
      '/points',
      `a pump curve needs at least three points, got ${Array.isArray(points) ? points.length : 0}`,
    );
  }
  points.forEach((point, index) => {
    const field = `/points/${index}`;
    requireInRange(point.flow, 0, POINT_LIMITS.flow, `${field}/flow`, 'flow (m3/s)');
    requirePositive(point.head, `${field}/head`, 'head');
    requireInRange(point.head, 0, POINT_LIMITS.head, `${field}/head`, 'head (m)');
    if (point.power !== undefined) {
      requireInRange(point.power, 0, POINT_LIMITS.power, `${field}/power`, 'power (W)');
    }
    if (point.efficiency !== undefined) {
      requireInRange(point.efficiency, 0, 1, `${field}/efficiency`, 'efficiency (fraction)');
    }
    if (point.npshRequired !== undefined) {
      requirePositive(point.npshRequired, `${field}/npshRequired`, 'NPSH required');
    }
    if (index > 0) {
      const previous = points[index - 1];
      if (!(point.flow > previous.flow)) {
        throw new HydraulicsInputError(
          `${field}/flow`,
          `flows must be strictly increasing: ${point.flow} follows ${previous.flow}`,
        );
      }
      if (point.head > previous.head) {
        throw new HydraulicsInputError(
          `${field}/head`,
          `head rises from ${previous.head} m to ${point.head} m; Riffle accepts only curves whose head does not rise with flow`,
        );
      }
    }
  });
  for (const key of ['power', 'efficiency'] as const) {
    const given = points.filter((point) => point[key] !== undefined).length;
    if (given > 0 && given < points.length) {
      const missing = points.findIndex((point) => point[key] === undefined);
      throw new HydraulicsInputError(`/points/${missing}/${key}`, `${key} must be given on every point or on none`);
    }
  }
}
