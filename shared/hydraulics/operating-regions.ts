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

/**
 * The default preferred operating region, 70-120 % of BEP flow (ANSI/HI 9.6.3, for most
 * rotodynamic pumps; see the top of this file).
 * @example
 * DEFAULT_PREFERRED_BAND.minPercent // => 70
 * DEFAULT_PREFERRED_BAND.maxPercent // => 120
 */
export const DEFAULT_PREFERRED_BAND: PreferredBand = Object.freeze({ minPercent: 70, maxPercent: 120 });

export interface RegionClassification {
  region: OperatingRegion;
  /** Flow as percent of BEP flow; null when the BEP is unknown. */
  percentOfBep: number | null;
}

/**
 * Throws unless the band is positive with min < max (a caller-supplied band is checked once, off
 * the hot path).
 * @param band - lower and upper limit, percent of BEP flow
 * @returns the band, unchanged
 * @example
 * checkPreferredBand({ minPercent: 80, maxPercent: 115 }).maxPercent // => 115
 */
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
 * @param fit - the BEP (flow m3/s) or null, and the published flow range, m3/s
 * @param band - percent of BEP flow (default 70-120 %, ANSI/HI 9.6.3)
 * @param declared - the supplier's declared preferred range, m3/s, or null
 * @returns the preferred flow range, m3/s, or null
 * @example
 * // BEP 7.5 L/s: 70 % is 5.25 L/s; 120 % (9 L/s) is clipped to a curve published to 8 L/s; by hand
 * preferredFlowRegion({ bep: { flow: 0.0075 }, flowMin: 0, flowMax: 0.01 }).flowMin // => 0.00525
 * preferredFlowRegion({ bep: { flow: 0.0075 }, flowMin: 0, flowMax: 0.008 }).flowMax // => 0.008
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
 * caller-supplied band; this function is on the hot path and does not. Source: ANSI/HI 9.6.3
 * (POR and AOR).
 * @param fit - the BEP (flow m3/s, or null) and the supplier's allowable region, m3/s
 * @param flow - the pump's flow, m3/s
 * @param band - percent of BEP flow (default 70-120 %)
 * @param declared - the supplier's declared preferred range, m3/s, or null
 * @returns the region and the flow as percent of BEP flow (null without a BEP)
 * @example
 * // BEP 7.5 L/s: 6 L/s is 80 % (preferred); 4.5 L/s is 60 %, inside an AOR from 3 L/s (allowable)
 * const fit = { bep: { flow: 0.0075, head: 7.1875, efficiency: 0.72 }, allowableRegion: { flowMin: 0.003, flowMax: 0.01 } }
 * classifyOperatingRegion(fit, 0.006).region // => 'preferred'
 * classifyOperatingRegion(fit, 0.006).percentOfBep // => 80
 * classifyOperatingRegion(fit, 0.0045).region // => 'allowable'
 * classifyOperatingRegion({ bep: null, allowableRegion: null }, 0.0045).region // => 'unknown-bep'
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
