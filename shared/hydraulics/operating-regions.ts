import { HydraulicsInputError, requirePositive } from './hydraulics-error';
import type { PumpCurveFit } from './pump-curve-fit';

/*
 * Where an operating point sits relative to the pump's best efficiency point.
 * Preferred operating region (POR) default 70-120 % of BEP flow, per
 * ANSI/HI 9.6.3 (Rotodynamic Pumps - Guideline for Operating Regions) for
 * most rotodynamic pumps; narrower bands (e.g. 80-115 %) are used for high
 * specific speed, so the band is configurable. The allowable operating
 * region (AOR) is the supplier's, stored on the fit when given.
 */

export type OperatingRegion = 'preferred' | 'allowable' | 'outside' | 'unknown-bep';

export interface PreferredBand {
  /** Lower limit, percent of BEP flow. */
  minPercent: number;
  /** Upper limit, percent of BEP flow. */
  maxPercent: number;
}

export const DEFAULT_PREFERRED_BAND: PreferredBand = Object.freeze({ minPercent: 70, maxPercent: 120 });

export interface RegionClassification {
  region: OperatingRegion;
  /** Flow as percent of BEP flow; null when the BEP is unknown. */
  percentOfBep: number | null;
}

/** Throws unless the band is positive with min < max. */
export function checkPreferredBand(band: PreferredBand): PreferredBand {
  requirePositive(band.minPercent, '/preferredBand/minPercent', 'preferred band minimum');
  requirePositive(band.maxPercent, '/preferredBand/maxPercent', 'preferred band maximum');
  if (!(band.maxPercent > band.minPercent)) {
    throw new HydraulicsInputError({ code: 'band-reversed', params: {}, pointer: '/preferredBand/maxPercent' });
  }
  return band;
}

/** A flow range of one pump, m3/s. */
export interface FlowRegion {
  flowMin: number;
  flowMax: number;
}

/**
 * The preferred operating region of one pump in flow, m3/s: the supplier's declared range when
 * it states one, as declared; else `band` around the BEP (ANSI/HI 9.6.3), kept inside the
 * published flows [flowMin, flowMax]. Null when the BEP is unknown and nothing is declared, or
 * when the band misses the published flows.
 *
 * Why clipped: a curve says nothing past its published points, so a region drawn or reported
 * there would claim more than the data; and the operating point is itself held inside the
 * published flows (see solveOperatingPoint), so the clipped region classifies every point the
 * engine can answer exactly as the unclipped band does.
 */
export function preferredFlowRegion(
  fit: { bep: { flow: number } | null; flowMin: number; flowMax: number },
  band: PreferredBand = DEFAULT_PREFERRED_BAND,
  declared: FlowRegion | null = null,
): FlowRegion | null {
  if (declared) return declared;
  if (!fit.bep) return null;
  const flowMin = Math.max(fit.flowMin, (fit.bep.flow * band.minPercent) / 100);
  const flowMax = Math.min(fit.flowMax, (fit.bep.flow * band.maxPercent) / 100);
  return flowMax > flowMin ? { flowMin, flowMax } : null;
}

/**
 * Classifies a pump flow (m3/s): 'preferred' inside the POR (the supplier's
 * declared preferred range when given, else `band` around BEP), else
 * 'allowable' inside the supplier's AOR when one is stored, else 'outside';
 * 'unknown-bep' when the fit has no BEP and nothing is declared. Call checkPreferredBand once on a
 * caller-supplied band; this function is on the hot path and does not.
 */
export function classifyOperatingRegion(
  fit: Pick<PumpCurveFit, 'bep' | 'allowableRegion'>,
  flow: number,
  band: PreferredBand = DEFAULT_PREFERRED_BAND,
  declared: FlowRegion | null = null,
): RegionClassification {
  const percentOfBep = fit.bep ? (100 * flow) / fit.bep.flow : null;
  if (declared) {
    if (flow >= declared.flowMin && flow <= declared.flowMax) return { region: 'preferred', percentOfBep };
  } else if (percentOfBep === null) {
    return { region: 'unknown-bep', percentOfBep };
  } else if (percentOfBep >= band.minPercent && percentOfBep <= band.maxPercent) {
    return { region: 'preferred', percentOfBep };
  }
  const aor = fit.allowableRegion;
  if (aor && flow >= aor.flowMin && flow <= aor.flowMax) {
    return { region: 'allowable', percentOfBep };
  }
  return { region: 'outside', percentOfBep };
}
