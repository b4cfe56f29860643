import type { CalculationUnits, PipeSystem } from '../../shared/api/api-schemas';
import {
  checkPlausible,
  compileSystemCurve,
  diameterToSI,
  headToSI,
  lengthToSI,
  systemBreakdown,
  VELOCITY_WARNING_LIMIT,
  plausibilityMessage,
  SI_PLAUSIBLE_UNITS,
  waterDensity,
  type CompiledSystemCurve,
  type PipeSegmentInput,
  type PlausibleLimitName,
  type PlausibleUnits,
} from '../../shared/hydraulics';
import { pointerInto, unprocessable, withRequestPointers } from './engine-problem';
import { answerUnits } from './request-units';

/*
 * The request's `system` turned into the engine's SI input, checked against plausible sizes,
 * and compiled. The contract's names differ from the engine's in three places.
 */

const systemRenames = { temperature: 'waterTemperatureC', pipeSizeId: 'pipe', extraK: 'minorLossK' };

/** Refuses a value (SI) outside its plausible limit with a 422 stating the limit in the request's units. */
export function requirePlausible(
  limit: PlausibleLimitName,
  value: number,
  pointer: string,
  units: PlausibleUnits,
): void {
  const violation = checkPlausible(limit, value);
  if (violation) throw unprocessable(pointer, plausibilityMessage(violation, units));
}

export interface PreparedSystem {
  curve: CompiledSystemCurve;
  /** Water density at the system's temperature, kg/m3. */
  density: number;
}

/** Converts, checks and compiles `system`; every problem is a 422 pointing under `pointer`. */
export function prepareSystem(units: CalculationUnits, system: PipeSystem, pointer = '/body/system'): PreparedSystem {
  const staticHead = headToSI(system.staticHead, units.head);
  requirePlausible('staticHead', staticHead, `${pointer}/staticHead`, units);
  const outletPressureHead = headToSI(system.outletPressureHead ?? 0, units.head);
  requirePlausible('outletPressureHead', outletPressureHead, `${pointer}/outletPressureHead`, units);
  const segments = system.segments.map((segment, index): PipeSegmentInput => {
    const at = `${pointer}/segments/${index}`;
    const length = lengthToSI(segment.length, units.length);
    requirePlausible('segmentLength', length, `${at}/length`, units);
    const insideDiameter =
      segment.insideDiameter === undefined ? undefined : diameterToSI(segment.insideDiameter, units.diameter);
    if (insideDiameter !== undefined) requirePlausible('insideDiameter', insideDiameter, `${at}/insideDiameter`, units);
    const roughness = segment.roughness === undefined ? undefined : diameterToSI(segment.roughness, units.diameter);
    if (roughness !== undefined) requirePlausible('roughness', roughness, `${at}/roughness`, units);
    return {
      length,
      pipeSizeId: segment.pipe,
      insideDiameter,
      material: segment.material,
      hazenWilliamsC: segment.hazenWilliamsC,
      roughness,
      fittings: segment.fittings,
      extraK: segment.minorLossK,
    };
  });
  const temperature = system.waterTemperatureC ?? 20;
  return withRequestPointers(
    () => ({
      curve: compileSystemCurve({
        staticHead,
        outletPressureHead,
        segments,
        temperature,
        frictionMethod: system.frictionMethod,
      }),
      density: waterDensity(temperature),
    }),
    pointerInto(pointer, systemRenames),
  );
}

/** Checks a flow (already SI) against the plausible range. */
export function requirePlausibleFlow(flow: number, pointer: string, units: PlausibleUnits = SI_PLAUSIBLE_UNITS): void {
  requirePlausible('flow', flow, pointer, units);
}

/** Velocity warnings of the system at one flow (SI), in the request's units. */
export function velocityWarnings(curve: CompiledSystemCurve, flow: number, units: CalculationUnits): string[] {
  const to = answerUnits(units);
  const breakdown = systemBreakdown(curve, flow);
  const limit = to.length(VELOCITY_WARNING_LIMIT);
  return breakdown.segments
    .filter((segment) => segment.velocity > VELOCITY_WARNING_LIMIT)
    .map(
      (segment) =>
        `at ${round(to.flow(flow))} ${units.flow} segment ${segment.index}: velocity ${round(to.length(segment.velocity))} ${units.length}/s exceeds ${round(limit)} ${units.length}/s, the common-practice limit for plastic pipe`,
    );
}

/** Two decimals for messages; answers themselves carry full precision. */
export function round(value: number): number {
  return Math.round(value * 100) / 100;
}
