import type { CalculationUnits, NpshCheck } from '../../shared/api/api-schemas';
import { DEFAULT_NPSH_GUIDANCE, type NpshAtDuty, type NpshGuidance, type SuctionSide } from '../../shared/hydraulics';
import { answerUnits, requestValueText } from './request-units';

/*
 * The suction side and gravity flow in an answer's words and units: the NPSH check, the
 * suction-lift and priming caution, and what gravity alone delivers.
 */

/**
 * The NPSH margin a request asks for: its ratio, or the ANSI/HI 9.6.1 clean-water default of
 * 1.1, always with the 0.6 m least difference of the same guidance (DEFAULT_NPSH_GUIDANCE).
 */
export function npshGuidanceOf(marginRatio: number | undefined): NpshGuidance {
  return marginRatio === undefined ? DEFAULT_NPSH_GUIDANCE : { ...DEFAULT_NPSH_GUIDANCE, ratio: marginRatio };
}

/** The NPSH check as the answer shows it, in the request's head unit. */
export function npshCheckAnswer(npsh: NpshAtDuty, guidance: NpshGuidance, units: CalculationUnits): NpshCheck {
  const to = answerUnits(units);
  return {
    available: to.head(npsh.available),
    required: npsh.required === null ? null : to.head(npsh.required),
    ratio: npsh.margin?.ratio ?? null,
    difference: npsh.margin ? to.head(npsh.margin.difference) : null,
    adequate: npsh.margin?.adequate ?? null,
    marginRatio: guidance.ratio,
    marginDifference: to.head(guidance.difference),
  };
}

/** What the NPSH check says in words: a shortfall, an unknown NPSH required, or nothing when the margin is met. */
export function npshMessage(npsh: NpshAtDuty, guidance: NpshGuidance, units: CalculationUnits): string | null {
  const text = requestValueText(units);
  const { required, margin } = npsh;
  if (required === null || margin === null)
    return `NPSH required unknown: the curve gives no NPSH3 at this flow; NPSH available is ${text.head(npsh.available)}`;
  if (margin.adequate) return null;
  return (
    `NPSH shortfall: NPSH available ${text.head(npsh.available)} against NPSH required ${text.head(required)}` +
    ` (ratio ${margin.ratio.toFixed(2)}; at least ${guidance.ratio} and ${text.head(guidance.difference)} more` +
    ' are needed, ANSI/HI 9.6.1): the pump may cavitate'
  );
}

/**
 * The suction-lift and priming caution for a pump standing above the intake water, or null for a
 * flooded suction: the pump must prime itself or be kept full, and only its maker can say how
 * high it lifts.
 */
export function suctionLiftCaution(suction: SuctionSide | null, units: CalculationUnits): string | null {
  if (!suction || suction.pumpElevation <= 0) return null;
  const height = Math.round(answerUnits(units).length(suction.pumpElevation) * 100) / 100;
  return (
    `the pump stands ${height} ${units.length} above the intake water: a suction lift. It must be self-priming or be` +
    " primed (a foot valve holds the suction pipe full); defer to the maker's data for the lift it allows"
  );
}

/** What gravity alone delivers when the outlet is below the intake, in words. */
export function gravityFlowMessage(flow: number, units: CalculationUnits): string {
  return (
    `the outlet is below the intake: gravity alone delivers ${requestValueText(units).flow(flow)}` +
    ' (system head zero); a pump is needed only for more than that'
  );
}
