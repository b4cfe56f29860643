import type { CalculationUnits, CurveFitSummary, InlinePump, PreferredBandInput } from '../../shared/api/api-schemas';
import {
  checkPreferredBand,
  DEFAULT_PREFERRED_BAND,
  fitPumpCurve,
  flowToSI,
  headToSI,
  powerToSI,
  type PreferredBand,
  type PumpCurveFit,
} from '../../shared/hydraulics';
import { pointerInto, withRequestPointers } from './engine-problem';
import { answerUnits, powerUnitOf, requestValueText } from './request-units';
import { requirePlausible } from './system-request';

/** Fits an inline published curve; every problem is a 422 pointing under `pointer` (`/body/pump`). */
export function fitInlinePump(units: CalculationUnits, pump: InlinePump, pointer = '/body/pump'): PumpCurveFit {
  const power = powerUnitOf(units);
  const points = pump.curve.map((point, index) => {
    const at = `${pointer}/curve/${index}`;
    const flow = flowToSI(point.flow, units.flow);
    requirePlausible('pumpCurveFlow', flow, `${at}/flow`, units);
    const head = headToSI(point.head, units.head);
    requirePlausible('pumpCurveHead', head, `${at}/head`, units);
    return {
      flow,
      head,
      ...(point.power === undefined ? {} : { power: powerToSI(point.power, power) }),
      ...(point.efficiency === undefined ? {} : { efficiency: point.efficiency / 100 }),
      ...(point.npshRequired === undefined ? {} : { npshRequired: headToSI(point.npshRequired, units.head) }),
    };
  });
  return withRequestPointers(
    () => fitPumpCurve(points, { powerBasis: pump.powerBasis }),
    (field) => field.replace(/^\/points/, `${pointer}/curve`),
    requestValueText(units),
  );
}

/** The request's preferred band, checked, or the ANSI/HI 9.6.3 default of 70-120 % of BEP flow. */
export function preferredBandOf(band: PreferredBandInput | undefined, pointer = '/body'): PreferredBand {
  if (!band) return DEFAULT_PREFERRED_BAND;
  return withRequestPointers(() => checkPreferredBand(band), pointerInto(pointer));
}

/** A fit as the answer shows it, in the request's units; efficiencies in percent. */
export function summarizeFit(
  fit: PumpCurveFit,
  units: CalculationUnits,
  preferredRegion: { flowMin: number; flowMax: number } | null,
): CurveFitSummary {
  const to = answerUnits(units);
  return {
    degree: fit.degree,
    shutOffHead: to.head(fit.shutOffHead),
    flowMin: to.flow(fit.flowMin),
    flowMax: to.flow(fit.flowMax),
    bep: fit.bep
      ? { flow: to.flow(fit.bep.flow), head: to.head(fit.bep.head), efficiency: fit.bep.efficiency * 100 }
      : null,
    preferredRegion: preferredRegion
      ? { flowMin: to.flow(preferredRegion.flowMin), flowMax: to.flow(preferredRegion.flowMax) }
      : null,
    rmsHead: to.head(fit.statistics.rmsHead),
    warnings: fit.warnings,
  };
}
