import type { CalculationUnits, PipeSystem } from '../../shared/api/api-schemas';
import {
  checkPlausible,
  compileSuctionSide,
  compileSystemCurve,
  gravityFlow,
  systemBreakdown,
  plausibilityMessage,
  SI_PLAUSIBLE_UNITS,
  waterDensity,
  type CompiledSystemCurve,
  type PlausibleLimitName,
  type PlausibleUnits,
  type SuctionSide,
} from '../../shared/hydraulics';
import { SYSTEM_FIELD_RENAMES, systemInputOf } from '../../shared/api/system-input';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { pointerInto, unprocessable, withRequestPointers } from './engine-problem';
import { requestValueText } from './request-units';

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
  /** The suction side, or null when no segment is on it. */
  suction: SuctionSide | null;
  /** With the outlet below the intake, the flow gravity alone delivers, m3/s; else null. */
  gravityFlow: number | null;
}

/** Converts, checks and compiles `system`; every problem is a 422 pointing under `pointer`. */
export function prepareSystem(units: CalculationUnits, system: PipeSystem, pointer = '/body/system'): PreparedSystem {
  const input = systemInputOf(system, units);
  requirePlausible('staticHead', input.staticHead, `${pointer}/staticHead`, units);
  requirePlausible('outletPressureHead', input.outletPressureHead ?? 0, `${pointer}/outletPressureHead`, units);
  input.segments.forEach((segment, index) => {
    const at = `${pointer}/segments/${index}`;
    requirePlausible('segmentLength', segment.length, `${at}/length`, units);
    if (segment.insideDiameter !== undefined)
      requirePlausible('insideDiameter', segment.insideDiameter, `${at}/insideDiameter`, units);
    if (segment.roughness !== undefined) requirePlausible('roughness', segment.roughness, `${at}/roughness`, units);
    if (segment.extraK !== undefined) requirePlausible('extraK', segment.extraK, `${at}/minorLossK`, units);
  });
  return withRequestPointers(
    () => {
      const curve = compileSystemCurve(input);
      const suction = compileSuctionSide(input);
      return { curve, density: waterDensity(curve.temperature), suction, gravityFlow: gravityFlow(curve) };
    },
    pointerInto(pointer, SYSTEM_FIELD_RENAMES),
    requestValueText(units),
  );
}

/** Checks a flow (already SI) against the plausible range. */
export function requirePlausibleFlow(flow: number, pointer: string, units: PlausibleUnits = SI_PLAUSIBLE_UNITS): void {
  requirePlausible('flow', flow, pointer, units);
}

/** Velocity warnings of the system at one flow (SI), in the request's units. */
export function velocityWarnings(curve: CompiledSystemCurve, flow: number, units: CalculationUnits): string[] {
  const valueText = requestValueText(units);
  return systemBreakdown(curve, flow)
    .issues.filter((issue) => issue.code === 'segment-velocity')
    .map((issue) => engineIssueText(issue, valueText));
}
