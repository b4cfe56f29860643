import type { CalculationUnits, PipeSystem } from '../../shared/api/api-schemas';
import {
  compileSystemCurve,
  diameterToSI,
  headToSI,
  lengthToSI,
  systemBreakdown,
  waterDensity,
  type CompiledSystemCurve,
  type PipeSegmentInput,
} from '../../shared/hydraulics';
import { engineIssueText, type IssueValueText } from '../../shared/messages/engine-issue-text';
import { pointerInto, unprocessable, withRequestPointers } from './engine-problem';
import { answerUnits } from './request-units';

/*
 * The request's `system` turned into the engine's SI input, checked against plausible sizes,
 * and compiled. The contract's names differ from the engine's in three places.
 */

const systemRenames = { temperature: 'waterTemperatureC', pipeSizeId: 'pipe', extraK: 'minorLossK' };

/**
 * Riffle's own plausibility limits, SI: the contract accepts any positive number, but a 40 km
 * pipe or a 1 mm bore in a water feature is a typing slip (a unit mix-up, a lost decimal point),
 * so it is refused with the field named instead of computed.
 */
export const plausibleLimits = Object.freeze({
  staticHead: 500,
  outletPressureHead: 500,
  segmentLength: 20_000,
  insideDiameterMin: 0.003,
  insideDiameterMax: 2,
  roughnessMax: 0.01,
  flowMax: 10,
});

function requirePlausible(value: number, min: number, max: number, pointer: string, what: string): void {
  if (value < min || value > max)
    throw unprocessable(pointer, `${what} is outside the plausible range for a water feature`);
}

export interface PreparedSystem {
  curve: CompiledSystemCurve;
  /** Water density at the system's temperature, kg/m3. */
  density: number;
}

/** Converts, checks and compiles `system`; every problem is a 422 pointing under `pointer`. */
export function prepareSystem(units: CalculationUnits, system: PipeSystem, pointer = '/body/system'): PreparedSystem {
  const staticHead = headToSI(system.staticHead, units.head);
  requirePlausible(Math.abs(staticHead), 0, plausibleLimits.staticHead, `${pointer}/staticHead`, 'static head');
  const outletPressureHead = headToSI(system.outletPressureHead ?? 0, units.head);
  requirePlausible(
    outletPressureHead,
    0,
    plausibleLimits.outletPressureHead,
    `${pointer}/outletPressureHead`,
    'outlet pressure head',
  );
  const segments = system.segments.map((segment, index): PipeSegmentInput => {
    const at = `${pointer}/segments/${index}`;
    const length = lengthToSI(segment.length, units.length);
    requirePlausible(length, 0, plausibleLimits.segmentLength, `${at}/length`, 'segment length');
    const insideDiameter =
      segment.insideDiameter === undefined ? undefined : diameterToSI(segment.insideDiameter, units.diameter);
    if (insideDiameter !== undefined) {
      requirePlausible(
        insideDiameter,
        plausibleLimits.insideDiameterMin,
        plausibleLimits.insideDiameterMax,
        `${at}/insideDiameter`,
        'inside diameter',
      );
    }
    const roughness = segment.roughness === undefined ? undefined : diameterToSI(segment.roughness, units.diameter);
    if (roughness !== undefined)
      requirePlausible(roughness, 0, plausibleLimits.roughnessMax, `${at}/roughness`, 'roughness');
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
export function requirePlausibleFlow(flow: number, pointer: string): void {
  requirePlausible(flow, 0, plausibleLimits.flowMax, pointer, 'flow');
}

/** Velocity warnings of the system at one flow (SI), in the request's units. */
export function velocityWarnings(curve: CompiledSystemCurve, flow: number, units: CalculationUnits): string[] {
  const to = answerUnits(units);
  const valueText: IssueValueText = {
    flow: (value) => `${round(to.flow(value))} ${units.flow}`,
    velocity: (value) => `${round(to.length(value))} ${units.length}/s`,
  };
  return systemBreakdown(curve, flow)
    .issues.filter((issue) => issue.code === 'segment-velocity')
    .map((issue) => engineIssueText(issue, valueText));
}

/** Two decimals for messages; answers themselves carry full precision. */
export function round(value: number): number {
  return Math.round(value * 100) / 100;
}
