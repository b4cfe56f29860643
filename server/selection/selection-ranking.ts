import { annualEnergyUnchecked, preferredFlowRegion, STANDARD_GRAVITY } from '../../shared/hydraulics';
import { cubicAt, type PackedCurves } from './packed-curves';
import type { SelectionQuery } from './selection-query';
import {
  distanceFromBand,
  OUT_OF_BAND_TIER,
  shortfallsOf,
  tierOfShortfalls,
  velocityExceeded,
} from './selection-shortfalls';
import type { BandSystemTable } from './system-table';
import type { PumpTerms } from './pump-terms';

/** Rank keys are tier x TIER_SPAN + the rank value: no water-feature set costs or uses 1e12 a year. */
export const TIER_SPAN = 1e12;

/**
 * Added to the key of a pump whose curve is estimated from two points, so that it ranks below a
 * measured curve of equal merit: 0.01 kWh a year, below any difference an answer shows, yet
 * above the keys' rounding (about 2e-3 at 1e13, the largest key with an NPSH shortfall).
 */
const ESTIMATED_CURVE_PENALTY = 0.01;

/**
 * Redundancy as asked: none needed, a standby that takes over, or, with one pump off, the rest
 * still reaching the band's minimum (the sign test at Qmin with running - 1 pumps).
 */
function redundancyMetBySignTest(
  packed: PackedCurves,
  index: number,
  running: number,
  query: SelectionQuery,
  table: BandSystemTable,
): boolean {
  if (!query.requireOneFailed || query.standby) return true;
  const remaining = running - 1;
  if (remaining < 1) return false;
  const low = Math.max(query.flowMin, remaining * packed.flowMin[index]);
  if (low > remaining * packed.flowMax[index]) return false;
  return cubicAt(packed.coefficients, index * 4, low / remaining) >= table.head(low);
}

/**
 * What ranks a pair within its tier, as the designer picks: annual energy (kWh), the set's first
 * cost (list price x pumps installed) or its life-cycle cost (first cost + the energy's present
 * value, lifeCycleCost's rule with the factor precomputed); NaN when a figure is unknown.
 */
export function rankValue(
  totalPower: number,
  index: number,
  running: number,
  query: SelectionQuery,
  terms: PumpTerms,
): number {
  const energy = annualEnergyUnchecked(totalPower, query.hoursPerDay);
  if (query.rankBy === 'energy') return energy;
  const firstCost = terms.price[index] * (running + (query.standby ? 1 : 0));
  if (query.rankBy === 'first-cost') return firstCost;
  return firstCost + energy * (query.tariffPerKWh ?? Number.NaN) * (query.costs?.energyFactor ?? Number.NaN);
}

/**
 * The rank key of a solved pair (tier x TIER_SPAN + rank value; an unknown value ranks last in
 * its tier; outside the band, the distance from it; an estimated curve just below a measured one
 * of equal merit), or null when a filter leaves it out. Read
 * from the packed arrays without the engine's checks, as this runs for every pair in band, but
 * with the same region rule as dutyOfParallelPumps and the same power rule as
 * powerAtOperatingPoint (fitted power, else water power over fitted efficiency; divided by the
 * pump's motor efficiency, which is 1 for an electrical curve: wire-to-water.ts).
 */
export function screenPoint(
  packed: PackedCurves,
  index: number,
  running: number,
  flow: number,
  head: number,
  query: SelectionQuery,
  table: BandSystemTable,
  terms: PumpTerms,
): number | null {
  const flowPerPump = Math.min(Math.max(flow / running, packed.flowMin[index]), packed.flowMax[index]);
  const declaredMin = packed.declaredMin[index];
  const percentOfBep = (100 * flowPerPump) / packed.bepFlow[index];
  const preferred =
    declaredMin === declaredMin
      ? flowPerPump >= declaredMin && flowPerPump <= packed.declaredMax[index]
      : percentOfBep >= query.band.minPercent && percentOfBep <= query.band.maxPercent;
  if (query.onlyPreferredRegion && !preferred) return null;
  const source = packed.powerSource[index];
  const losses = terms.motor[index];
  let power = Number.NaN;
  if (source >= 2) power = cubicAt(packed.power, index * 4, flowPerPump) / losses;
  else if (source === 1) {
    const efficiency = cubicAt(packed.efficiency, index * 4, flowPerPump);
    if (efficiency > 0) power = (query.density * STANDARD_GRAVITY * flowPerPump * head) / (efficiency * losses);
  }
  if (query.maxInputPowerPerPump !== null && power > query.maxInputPowerPerPump) return null;
  const inBand = flow >= query.flowMin * (1 - 1e-9) && flow <= query.flowMax * (1 + 1e-9);
  const tier = tierOfShortfalls(
    shortfallsOf({
      inBand,
      redundancyMet: redundancyMetBySignTest(packed, index, running, query, table),
      preferred,
      velocityOk: !velocityExceeded(query.system, flow),
      // an NPSH shortfall moves the key past every tier instead (withNpshShortfall)
      npshMarginMet: true,
    }),
  );
  const value =
    tier === OUT_OF_BAND_TIER
      ? 1e6 * distanceFromBand(flow, query.flowMin, query.flowMax)
      : rankValue(power * running, index, running, query, terms);
  return (
    tier * TIER_SPAN +
    (value === value ? Math.min(value, TIER_SPAN - 1) : TIER_SPAN - 1) +
    packed.estimated[index] * ESTIMATED_CURVE_PENALTY
  );
}

/**
 * The least tier of a pair known to run in band, without solving: the redundancy and preferred
 * region it misses (velocity needs the flow, so the solved key may rank a tier lower). Preferred
 * when the crossing lies inside the preferred region too (the same sign test on the region's
 * flows clipped to the bracket), redundant by the one-failed sign test.
 */
export function tierInBand(
  packed: PackedCurves,
  index: number,
  running: number,
  low: number,
  high: number,
  query: SelectionQuery,
  table: BandSystemTable,
): number {
  const missed = redundancyMetBySignTest(packed, index, running, query, table) ? 0 : 1;
  const declaredMin = packed.declaredMin[index];
  const bepFlow = packed.bepFlow[index];
  const perPump = preferredFlowRegion(
    {
      bep: bepFlow === bepFlow ? { flow: bepFlow } : null,
      flowMin: packed.flowMin[index],
      flowMax: packed.flowMax[index],
    },
    query.band,
    declaredMin === declaredMin ? { flowMin: declaredMin, flowMax: packed.declaredMax[index] } : null,
  );
  if (!perPump) return missed + 1;
  const preferredLow = Math.max(low, running * perPump.flowMin);
  const preferredHigh = Math.min(high, running * perPump.flowMax);
  if (!(preferredLow <= preferredHigh)) return missed + 1;
  const offset = index * 4;
  const crossesAfterLow = cubicAt(packed.coefficients, offset, preferredLow / running) >= table.head(preferredLow);
  const crossesBeforeHigh = cubicAt(packed.coefficients, offset, preferredHigh / running) <= table.head(preferredHigh);
  return crossesAfterLow && crossesBeforeHigh ? missed : missed + 1;
}

/**
 * The `limit` best pairs by rank key (tier, then rank value), kept sorted while offers stream
 * in, so the thousands of pairs in a wide band are never sorted as a whole. Ties go to the pair
 * offered first (lower pump index).
 */
export class TopPairs {
  private readonly keys: number[] = [];
  private readonly pairs: Array<[number, number]> = [];

  constructor(private readonly limit: number) {}

  get size(): number {
    return this.keys.length;
  }

  /** Whether a pair with a key of at least `least` could still enter. */
  admits(least: number): boolean {
    return this.keys.length < this.limit || this.keys[this.keys.length - 1] > least;
  }

  /** How many kept pairs have a key below `key`. */
  countBelow(key: number): number {
    return this.keys.filter((kept) => kept < key).length;
  }

  /** `key` is null for a pair the filters leave out. */
  offer(index: number, running: number, key: number | null): void {
    if (key === null) return;
    if (this.keys.length === this.limit && key >= this.keys[this.keys.length - 1]) return;
    let at = this.keys.length;
    while (at > 0 && this.keys[at - 1] > key) at -= 1;
    this.keys.splice(at, 0, key);
    this.pairs.splice(at, 0, [index, running]);
    if (this.keys.length > this.limit) {
      this.keys.pop();
      this.pairs.pop();
    }
  }

  /** The key a pair must beat to enter: Infinity while there is room. */
  worst(): number {
    return this.keys.length < this.limit ? Number.POSITIVE_INFINITY : this.keys[this.keys.length - 1];
  }

  best(): Array<[number, number]> {
    return this.pairs;
  }

  /** The kept pairs' keys, in the order of best(). */
  bestKeys(): readonly number[] {
    return this.keys;
  }
}
