import {
  HAZEN_WILLIAMS_FLOW_EXPONENT,
  LAMINAR_REYNOLDS_LIMIT,
  TURBULENT_REYNOLDS_LIMIT,
  hazenWilliamsResistance,
  headLossDarcyWeisbach,
} from './friction';
import { finiteError, HydraulicsInputError } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';
import type { EngineIssue, HazenWilliamsRangeReason } from './engine-issues';
import type { CompiledSystemCurve } from './system-curve';
import type { ResolvedSegment } from './system-input';

/**
 * Velocity above which plastic pipe risks water hammer: 5 ft/s (common practice for plastic pipe), in m/s.
 * @example
 * velocityFromSI(VELOCITY_WARNING_LIMIT, 'ft/s') // => 5
 */
export const VELOCITY_WARNING_LIMIT = 1.524;

/**
 * The range Hazen-Williams is fitted to, as common practice states it: bores from 2 in (50 mm),
 * water at 4-25 C (40-75 F), turbulent flow (Re from 4000; the formula has no viscosity term, so
 * it cannot follow the rise of f at low Reynolds numbers: C. P. Liou, "Limitations and proper use
 * of the Hazen-Williams equation", J. Hydraulic Eng. 124(9), 951-954, 1998). SI.
 * @example
 * HAZEN_WILLIAMS_RANGE.minInsideDiameter // => 0.05
 */
export const HAZEN_WILLIAMS_RANGE = Object.freeze({
  minInsideDiameter: 0.05,
  minReynolds: TURBULENT_REYNOLDS_LIMIT,
  minTemperature: 4,
  maxTemperature: 25,
});

/** One piece of equipment's head at the flow, m. */
export interface EquipmentBreakdown {
  name: string;
  headLoss: number;
}

export interface SegmentBreakdown {
  index: number;
  /** m/s */
  velocity: number;
  /** V^2/2g, m */
  velocityHead: number;
  /** Reynolds number V D / nu at the system's water temperature. */
  reynolds: number;
  frictionHead: number;
  minorHead: number;
  totalK: number;
  /** Sum of the segment's equipment heads, m. */
  equipmentHead: number;
  equipment: EquipmentBreakdown[];
}

export interface SystemBreakdown {
  flow: number;
  /** TDH = staticHead + outletPressureHead + frictionHead + minorHead + equipmentHead, m */
  totalHead: number;
  /** Static lift, m */
  staticHead: number;
  outletPressureHead: number;
  frictionHead: number;
  minorHead: number;
  equipmentHead: number;
  segments: SegmentBreakdown[];
  /**
   * Hazen-Williams outside 4-25 C or, per segment, outside HAZEN_WILLIAMS_RANGE; every segment
   * above VELOCITY_WARNING_LIMIT; every Darcy-Weisbach segment in the transition band.
   */
  issues: EngineIssue[];
}

/** Why a Hazen-Williams segment is outside HAZEN_WILLIAMS_RANGE at this Reynolds number; empty when inside. */
function hazenWilliamsReasons(
  segment: ResolvedSegment,
  reynolds: number,
  temperature: number,
): HazenWilliamsRangeReason[] {
  const reasons: HazenWilliamsRangeReason[] = [];
  if (segment.insideDiameter < HAZEN_WILLIAMS_RANGE.minInsideDiameter) reasons.push('small-bore');
  if (reynolds < HAZEN_WILLIAMS_RANGE.minReynolds) reasons.push('low-reynolds');
  if (temperature < HAZEN_WILLIAMS_RANGE.minTemperature || temperature > HAZEN_WILLIAMS_RANGE.maxTemperature)
    reasons.push('temperature');
  return reasons;
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
 * 5 ft/s (VELOCITY_WARNING_LIMIT, common practice), Reynolds number Re = V D / nu and each
 * equipment's head c Q^2 (system-input resolveEquipment). TDH = static + outlet pressure +
 * friction + minor + equipment head (the handbook's TDH with the exit K counting the outlet
 * velocity head, Crane TP-410 A-29); friction by friction.ts (Hazen & Williams 1920;
 * Darcy-Weisbach with Colebrook 1939). Also reports Hazen-Williams used outside 4-25 C, a
 * Hazen-Williams segment outside HAZEN_WILLIAMS_RANGE with the Darcy-Weisbach friction beside it
 * (the segment's roughness, or a smooth pipe where none is known), and Darcy-Weisbach flow in the
 * transition band Re 2300-4000 (friction.ts: the turbulent value is used). Validity as
 * compileSystemCurve.
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
  const isHazenWilliams = system.frictionMethod === 'hazen-williams';
  if (
    isHazenWilliams &&
    (system.temperature < HAZEN_WILLIAMS_RANGE.minTemperature ||
      system.temperature > HAZEN_WILLIAMS_RANGE.maxTemperature)
  ) {
    issues.push({
      code: 'hazen-williams-temperature',
      params: { temperature: system.temperature },
      pointer: '/temperature',
    });
  }
  const segments = system.segments.map((segment, index): SegmentBreakdown => {
    const velocity = flow / segment.area;
    const velocityHead = (velocity * velocity) / (2 * STANDARD_GRAVITY);
    const reynolds = (velocity * segment.insideDiameter) / system.kinematicViscosity;
    const darcyWeisbachHead = (roughness: number) =>
      headLossDarcyWeisbach(segment.length, flow, segment.insideDiameter, roughness, system.kinematicViscosity);
    const frictionHead = isHazenWilliams
      ? hazenWilliamsResistance(segment.length, segment.insideDiameter, segment.hazenWilliamsC) *
        Math.pow(flow, HAZEN_WILLIAMS_FLOW_EXPONENT)
      : darcyWeisbachHead(segment.roughness);
    const pointer = `/segments/${index}`;
    if (velocity > VELOCITY_WARNING_LIMIT) {
      issues.push({
        code: 'segment-velocity',
        params: { segment: index, flow, velocity, limit: VELOCITY_WARNING_LIMIT },
        pointer,
      });
    }
    if (flow > 0 && isHazenWilliams) {
      const reasons = hazenWilliamsReasons(segment, reynolds, system.temperature);
      if (reasons.length > 0) {
        const smooth = Number.isNaN(segment.roughness);
        issues.push({
          code: 'hazen-williams-out-of-range',
          params: {
            segment: index,
            flow,
            reynolds,
            reasons,
            hazenWilliamsHead: frictionHead,
            darcyWeisbachHead: darcyWeisbachHead(smooth ? 0 : segment.roughness),
            smoothPipe: smooth,
          },
          pointer,
        });
      }
    }
    if (!isHazenWilliams && reynolds >= LAMINAR_REYNOLDS_LIMIT && reynolds < TURBULENT_REYNOLDS_LIMIT) {
      issues.push({ code: 'transitional-flow', params: { segment: index, flow, reynolds }, pointer });
    }
    const equipment = segment.equipment.map((entry): EquipmentBreakdown => ({
      name: entry.name,
      headLoss: entry.coefficient * flow * flow,
    }));
    return {
      index,
      velocity,
      velocityHead,
      reynolds,
      frictionHead,
      minorHead: segment.totalK * velocityHead,
      totalK: segment.totalK,
      equipmentHead: equipment.reduce((sum, entry) => sum + entry.headLoss, 0),
      equipment,
    };
  });
  const frictionHead = segments.reduce((sum, segment) => sum + segment.frictionHead, 0);
  const minorHead = segments.reduce((sum, segment) => sum + segment.minorHead, 0);
  const equipmentHead = segments.reduce((sum, segment) => sum + segment.equipmentHead, 0);
  return {
    flow,
    totalHead: system.staticHead + frictionHead + minorHead + equipmentHead,
    staticHead: system.staticLift,
    outletPressureHead: system.outletPressureHead,
    frictionHead,
    minorHead,
    equipmentHead,
    segments,
    issues,
  };
}
