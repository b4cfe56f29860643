import { npshAtDuty, type NpshAtDuty } from '../../shared/hydraulics';
import type { CatalogPump } from '../catalog/catalog-snapshot';
import type { SelectionQuery } from './selection-query';
import { TIER_SPAN } from './selection-ranking';
import { OUT_OF_BAND_TIER } from './selection-shortfalls';

/*
 * NPSH in the ranking: a pair whose NPSH available falls short of the margin asked for over its
 * NPSH required (ANSI/HI 9.6.1 guidance by default) would cavitate at its duty, so it ranks below
 * every pair with enough margin, whatever their tiers; among themselves the short pairs keep the
 * order of their tiers and energy. A pump without NPSH data is not moved, and says so.
 */

/** Added to the rank key of a pair short of NPSH margin: past every tier of every other pair. */
export const NPSH_SHORTFALL_OFFSET = (OUT_OF_BAND_TIER + 1) * TIER_SPAN;

/**
 * NPSH at a pair's duty, or null when there is nothing to check: no suction side, or a
 * submersible pump (it sits in the water it draws, with no suction pipe of its own).
 */
export function npshOfPair(pump: CatalogPump, running: number, flow: number, query: SelectionQuery): NpshAtDuty | null {
  if (!query.suction || pump.kind === 'submersible') return null;
  const { fit } = pump;
  const flowPerPump = Math.min(Math.max(flow / running, fit.flowMin), fit.flowMax);
  return npshAtDuty(query.suction, fit, flow, flowPerPump, query.npshGuidance);
}

/** The rank key with the shortfall offset added when the pair lacks NPSH margin; null stays null. */
export function withNpshShortfall(
  key: number | null,
  pump: CatalogPump,
  running: number,
  flow: number,
  query: SelectionQuery,
): number | null {
  if (key === null) return null;
  const npsh = npshOfPair(pump, running, flow, query);
  return npsh?.margin && !npsh.margin.adequate ? key + NPSH_SHORTFALL_OFFSET : key;
}

/** The reason a candidate's NPSH gives for its place. */
export function npshReason(npsh: NpshAtDuty, query: SelectionQuery): string {
  if (!npsh.margin) return 'NPSH required unknown: the curve gives no NPSH3 at this flow';
  const ratio = npsh.margin.ratio.toFixed(2);
  return npsh.margin.adequate
    ? `NPSH margin met (NPSHa / NPSH3 ${ratio})`
    : `NPSH shortfall: NPSHa / NPSH3 ${ratio}, short of the ${query.npshGuidance.ratio} ratio and ${query.npshGuidance.difference} m asked for; it may cavitate, so it ranks below pumps with enough margin`;
}
