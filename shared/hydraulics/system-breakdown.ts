import { HAZEN_WILLIAMS_FLOW_EXPONENT, hazenWilliamsResistance, headLossDarcyWeisbach } from './friction';
import { finiteError, HydraulicsInputError } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';
import type { EngineIssue } from './engine-issues';
import type { CompiledSystemCurve } from './system-curve';

/**
 * Velocity above which plastic pipe risks water hammer: 5 ft/s (common practice for plastic pipe), in m/s.
 * @example
 * velocityFromSI(VELOCITY_WARNING_LIMIT, 'ft/s') // => 5
 */
export const VELOCITY_WARNING_LIMIT = 1.524;

export interface SegmentBreakdown {
  index: number;
  /** m/s */
  velocity: number;
  /** V^2/2g, m */
  velocityHead: number;
  /** Reynolds number (Darcy-Weisbach only, else null). */
  reynolds: number | null;
  frictionHead: number;
  minorHead: number;
  totalK: number;
}

export interface SystemBreakdown {
  flow: number;
  /** TDH = staticHead + outletPressureHead + frictionHead + minorHead, m */
  totalHead: number;
  /** Static lift, m */
  staticHead: number;
  outletPressureHead: number;
  frictionHead: number;
  minorHead: number;
  segments: SegmentBreakdown[];
  /** Hazen-Williams outside 4-25 C, and every segment above VELOCITY_WARNING_LIMIT. */
  issues: EngineIssue[];
}

function checkFlow(flow: number): void {
  if (!(flow >= 0) || flow === Number.POSITIVE_INFINITY) {
    throw new HydraulicsInputError(
      finiteError(flow, '/flow', 'flow') ?? {
        code: 'negative',
        params: { what: 'flow', value: flow },
        pointer: '/flow',
      },
    );
  }
}

/**
 * Head breakdown at one flow, computed exactly (Colebrook solved, not
 * tabulated): static, outlet pressure, friction and minor head, and per
 * segment velocity V = Q/A, velocity head V^2/2g, minor head K V^2/2g and a warning above
 * 5 ft/s (VELOCITY_WARNING_LIMIT, common practice). TDH = static + outlet pressure + friction
 * + minor head (the handbook's TDH with the exit K counting the outlet velocity head, Crane
 * TP-410 A-29); friction by friction.ts (Hazen & Williams 1920; Darcy-Weisbach with Colebrook
 * 1939). Also reports Hazen-Williams used outside 4-25 C. Validity as compileSystemCurve.
 * @param system - a compiled system curve (compileSystemCurve)
 * @param flow - volumetric flow, m3/s (>= 0)
 * @returns the heads in m, per-segment velocities in m/s, and the issues found
 * @example
 * const system = compileSystemCurve({ staticHead: 3, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 4 }, { kind: 'exit', count: 1 }] }], frictionMethod: 'hazen-williams' })
 * const budget = systemBreakdown(system, 0.003)
 * // agrees with system.evaluate(0.003); python3 with the same formulas gives V = 1.3857 m/s,
 * // friction 1.0866 m and minor 0.32103 m
 * budget.totalHead // => 4.4076
 * budget.segments[0].velocity // => 1.3857
 * budget.frictionHead // => 1.0866
 * budget.minorHead // => 0.32103
 * budget.issues.length // => 0
 */
export function systemBreakdown(system: CompiledSystemCurve, flow: number): SystemBreakdown {
  checkFlow(flow);
  const issues: EngineIssue[] = [];
  if (system.frictionMethod === 'hazen-williams' && (system.temperature < 4 || system.temperature > 25)) {
    issues.push({
      code: 'hazen-williams-temperature',
      params: { temperature: system.temperature },
      pointer: '/temperature',
    });
  }
  const segments = system.segments.map((segment, index): SegmentBreakdown => {
    const velocity = flow / segment.area;
    const velocityHead = (velocity * velocity) / (2 * STANDARD_GRAVITY);
    const isHazenWilliams = system.frictionMethod === 'hazen-williams';
    const frictionHead = isHazenWilliams
      ? hazenWilliamsResistance(segment.length, segment.insideDiameter, segment.hazenWilliamsC) *
        Math.pow(flow, HAZEN_WILLIAMS_FLOW_EXPONENT)
      : headLossDarcyWeisbach(
          segment.length,
          flow,
          segment.insideDiameter,
          segment.roughness,
          system.kinematicViscosity,
        );
    if (velocity > VELOCITY_WARNING_LIMIT) {
      issues.push({
        code: 'segment-velocity',
        params: { segment: index, flow, velocity, limit: VELOCITY_WARNING_LIMIT },
        pointer: `/segments/${index}`,
      });
    }
    return {
      index,
      velocity,
      velocityHead,
      reynolds: isHazenWilliams ? null : (velocity * segment.insideDiameter) / system.kinematicViscosity,
      frictionHead,
      minorHead: segment.totalK * velocityHead,
      totalK: segment.totalK,
    };
  });
  const frictionHead = segments.reduce((sum, segment) => sum + segment.frictionHead, 0);
  const minorHead = segments.reduce((sum, segment) => sum + segment.minorHead, 0);
  return {
    flow,
    totalHead: system.staticHead + frictionHead + minorHead,
    staticHead: system.staticLift,
    outletPressureHead: system.outletPressureHead,
    frictionHead,
    minorHead,
    segments,
    issues,
  };
}
