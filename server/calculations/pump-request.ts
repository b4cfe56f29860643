import type {
  CalculationUnits,
  CatalogPump,
  CurveFitSummary,
  InlinePump,
  PreferredBandInput,
} from '../../shared/api/api-schemas';
import {
  checkPreferredBand,
  DEFAULT_PREFERRED_BAND,
  fitPumpCurveWithIssues,
  flowToSI,
  headToSI,
  motorEfficiencyFor,
  powerToSI,
  type PreferredBand,
  type PumpCurveFit,
  type PumpSpeeds,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { ProblemError } from '../api/problem-details';
import type { PumpOnFile } from './arrangement-duty';
import { pointerInto, withRequestPointers } from './engine-problem';
import { answerUnits, powerUnitOf, requestValueText } from './request-units';
import { requirePlausible } from './system-request';

/** A catalog pump's current curve with what the wire-to-water rule reads of it. */
export interface CatalogPumpOnFile extends PumpOnFile {
  kind: string;
  /** The catalog's motor efficiency, 0-1, or null. */
  motorEfficiency: number | null;
  speeds: PumpSpeeds;
}

/** Where the calculations find a catalog pump's current curve. */
export interface CurrentPumpCurves {
  findPump(pumpId: number): Promise<CatalogPumpOnFile | undefined>;
}

/** A pump of a request, ready for the engine, with the motor efficiency its curve power is divided by. */
export interface RequestPump {
  pump: PumpOnFile;
  /** 0-1 (motorEfficiencyFor); 1 for an inline curve, whose power is taken as published. */
  motorEfficiency: number;
  /** A catalog pump's speeds; an inline curve's nominal speed (speedRpm) only. */
  speeds: PumpSpeeds;
  fromCatalog: boolean;
}

/**
 * The pump at `pointer` (`/body/pump`): an inline curve, fitted, or a catalog pump by id (a 404
 * naming `pointer/pumpId` when no pump with a current curve has it). Power is wire-to-water as in
 * the selection: a catalog pump's shaft power is divided by its catalog motor efficiency, else its
 * kind's (motorEfficiencyFor); an inline curve's power is taken as its `powerBasis` says.
 */
export async function requestPump(
  pumps: CurrentPumpCurves,
  units: CalculationUnits,
  spec: InlinePump | CatalogPump,
  pointer = '/body/pump',
): Promise<RequestPump> {
  if (!('pumpId' in spec))
    return {
      pump: { fit: fitInlinePump(units, spec, pointer) },
      motorEfficiency: 1,
      speeds: { nominalRpm: spec.speedRpm ?? null, rangeRpm: null, fixedRpm: null },
      fromCatalog: false,
    };
  const found = await pumps.findPump(spec.pumpId);
  if (!found) {
    throw new ProblemError(404, 'Pump not found', `No pump with a current curve has id ${spec.pumpId}`, [
      { pointer: `${pointer}/pumpId`, detail: 'no pump with a current curve has this id' },
    ]);
  }
  return {
    pump: found,
    motorEfficiency: motorEfficiencyFor(found, null).value,
    speeds: found.speeds,
    fromCatalog: true,
  };
}

/**
 * Fits an inline published curve, its warnings in the request's units; every problem is a 422
 * pointing under `pointer` (`/body/pump`).
 */
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
  const valueText = requestValueText(units);
  const { fit, issues } = withRequestPointers(
    () => fitPumpCurveWithIssues(points, { powerBasis: pump.powerBasis }),
    (field) => field.replace(/^\/points/, `${pointer}/curve`),
    valueText,
  );
  return { ...fit, warnings: issues.map((issue) => engineIssueText(issue, valueText)) };
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
    // fits stored before the basis was recorded are all published
    curveBasis: fit.curveBasis === 'estimated-from-two-points' ? fit.curveBasis : 'published',
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
