import { HAZEN_WILLIAMS_FLOW_EXPONENT, hazenWilliamsResistance, headLossDarcyWeisbach } from './friction';
import { finiteError, HydraulicsInputError } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';
import type { EngineIssue } from './engine-issues';
import type { CompiledSystemCurve } from './system-curve';

/** Velocity above which plastic pipe risks water hammer: 5 ft/s (common practice for plastic pipe). */
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
 * segment velocity, velocity head and a warning above 5 ft/s.
 * @param flow m3/s (>= 0)
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
