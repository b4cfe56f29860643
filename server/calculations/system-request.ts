import type { CalculationUnits, PipeSystem } from '../../shared/api/api-schemas';
import {
  checkPlausible,
  compileBranchedSystem,
  compileSuctionSide,
  compileSystemCurve,
  gravityFlow,
  lengthToSI,
  systemBreakdown,
  plausibilityMessage,
  SI_PLAUSIBLE_UNITS,
  waterDensity,
  type CompiledBranchedSystem,
  type CompiledSystemCurve,
  type PipeSegmentInput,
  type PlausibleLimitName,
  type PlausibleUnits,
  type SuctionSide,
} from '../../shared/hydraulics';
import { branchedSystemInputOf, SYSTEM_FIELD_RENAMES, systemInputOf } from '../../shared/api/system-input';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { checkedName } from '../api/checked-text';
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
  /** The curve the pump sees: for a branched system, its CompiledBranchedSystem. */
  curve: CompiledSystemCurve;
  /** The branched system, or null for a single route. */
  branched: CompiledBranchedSystem | null;
  /** Water density at the system's temperature, kg/m3. */
  density: number;
  /** The suction side, or null when no segment is on it. */
  suction: SuctionSide | null;
  /** With the outlet below the intake, the flow gravity alone delivers, m3/s; else null. */
  gravityFlow: number | null;
}

function requirePlausibleSegments(
  segments: readonly PipeSegmentInput[],
  pointer: string,
  units: CalculationUnits,
): void {
  segments.forEach((segment, index) => {
    const at = `${pointer}/segments/${index}`;
    requirePlausible('segmentLength', segment.length, `${at}/length`, units);
    if (segment.insideDiameter !== undefined)
      requirePlausible('insideDiameter', segment.insideDiameter, `${at}/insideDiameter`, units);
    if (segment.roughness !== undefined) requirePlausible('roughness', segment.roughness, `${at}/roughness`, units);
    if (segment.extraK !== undefined) requirePlausible('extraK', segment.extraK, `${at}/minorLossK`, units);
    segment.equipment?.forEach((entry, entryIndex) => checkedName(entry.name, `${at}/equipment/${entryIndex}/name`));
  });
}

/**
 * Converts, checks and compiles `system` (a single route, or a common run and branches); every
 * problem is a 422 pointing under `pointer`.
 */
export function prepareSystem(units: CalculationUnits, system: PipeSystem, pointer = '/body/system'): PreparedSystem {
  const translate = pointerInto(pointer, SYSTEM_FIELD_RENAMES);
  const valueText = requestValueText(units);
  const branchedInput = withRequestPointers(() => branchedSystemInputOf(system, units), translate, valueText);
  if (branchedInput !== null) {
    requirePlausibleSegments(branchedInput.segments, pointer, units);
    branchedInput.branches.forEach((branch, index) => {
      const at = `${pointer}/branches/${index}`;
      requirePlausible('staticHead', branch.staticHead, `${at}/staticHead`, units);
      requirePlausible('outletPressureHead', branch.outletPressureHead ?? 0, `${at}/outletPressureHead`, units);
      requirePlausibleSegments(branch.segments, at, units);
    });
    return withRequestPointers(
      () => {
        const branched = compileBranchedSystem(branchedInput);
        // the suction side is the start of the common run: its losses are the common run's own
        const suction = compileSuctionSide({
          ...branchedInput,
          staticHead: 0,
          siteElevation:
            system.siteElevation === undefined ? undefined : lengthToSI(system.siteElevation, units.length),
          pumpElevation:
            system.pumpElevation === undefined ? undefined : lengthToSI(system.pumpElevation, units.length),
        });
        return {
          curve: branched,
          branched,
          density: waterDensity(branched.temperature),
          suction,
          gravityFlow: gravityFlow(branched),
        };
      },
      translate,
      valueText,
    );
  }
  const input = withRequestPointers(() => systemInputOf(system, units), translate, valueText);
  requirePlausible('staticHead', input.staticHead, `${pointer}/staticHead`, units);
  requirePlausible('outletPressureHead', input.outletPressureHead ?? 0, `${pointer}/outletPressureHead`, units);
  requirePlausibleSegments(input.segments, pointer, units);
  return withRequestPointers(
    () => {
      const curve = compileSystemCurve(input);
      const suction = compileSuctionSide(input);
      return {
        curve,
        branched: null,
        density: waterDensity(curve.temperature),
        suction,
        gravityFlow: gravityFlow(curve),
      };
    },
    translate,
    valueText,
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
