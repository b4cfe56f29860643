import type { SelectionCandidate } from '../../shared/api/api-schemas';

/** Years of running a life-cycle cost adds to the first cost (common practice for small pumps). */
export const LIFE_CYCLE_YEARS = 10;

/** A pump's list price from the catalog. */
export interface PumpPrice {
  listPrice: number;
  currency: string;
}

/** A figure as the proposal prints it: fixed decimals, or a dash when unknown. */
export function figure(value: number | null | undefined, decimals: number): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '-' : value.toFixed(decimals);
}

export interface CandidateCosts {
  /** List price of every installed pump, or null when the catalog has no price. */
  firstCost: number | null;
  currency: string | null;
  /**
   * First cost plus LIFE_CYCLE_YEARS of energy, undiscounted: the initial and energy terms of
   * LCC = Cic + Cin + Ce + Co + Cm + Cs + Cenv + Cd (Hydraulic Institute and Europump, "Pump
   * Life Cycle Costs: A Guide to LCC Analysis for Pumping Systems", 2001, section 2); null
   * without a price or a tariff.
   */
  lifeCycleCost: number | null;
}

export function candidateCosts(candidate: SelectionCandidate, prices: ReadonlyMap<number, PumpPrice>): CandidateCosts {
  const price = prices.get(candidate.pumpId);
  if (!price) return { firstCost: null, currency: null, lifeCycleCost: null };
  const firstCost = price.listPrice * candidate.arrangement.installed;
  return {
    firstCost,
    currency: price.currency,
    lifeCycleCost: candidate.annualCost === null ? null : firstCost + LIFE_CYCLE_YEARS * candidate.annualCost,
  };
}
