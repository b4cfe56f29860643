import { annualEnergyUnchecked, preferredFlowRegion, STANDARD_GRAVITY } from '../../shared/hydraulics';
import { cubicAt, type PackedCurves } from './packed-curves';
import type { SelectionQuery } from './selection-query';
import type { BandSystemTable } from './system-table';

/** 0: in band, preferred and redundant as required; 1: in band with a shortfall; 2: outside the band. */
export function tierOf(inBand: boolean, preferred: boolean, redundancyMet: boolean): number {
  if (!inBand) return 2;
  return preferred && redundancyMet ? 0 : 1;
}

/** Rank keys are tier x TIER_SPAN + annual kWh: no water-feature pump uses 1e12 kWh a year. */
export const TIER_SPAN = 1e12;

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
 * The rank key of a solved pair (tier x TIER_SPAN + annual kWh; unknown energy ranks last in its
 * tier), or null when a filter leaves it out. Read from the packed arrays without the engine's
 * checks, as this runs for every pair in band, but with the same region rule as
 * dutyOfParallelPumps and the same power rule as powerAtOperatingPoint (fitted power, else water
 * power over fitted efficiency; motor efficiency applied unless the curve's power is electrical).
 */
export function screenPoint(
  packed: PackedCurves,
  index: number,
  running: number,
  flow: number,
  head: number,
  query: SelectionQuery,
  table: BandSystemTable,
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
  const losses = packed.electricalEfficiency[index] === 1 ? 1 : query.motorEfficiency;
  let power = Number.NaN;
  if (source >= 2) power = cubicAt(packed.power, index * 4, flowPerPump) / losses;
  else if (source === 1) {
    const efficiency = cubicAt(packed.efficiency, index * 4, flowPerPump);
    if (efficiency > 0) power = (query.density * STANDARD_GRAVITY * flowPerPump * head) / (efficiency * losses);
  }
  if (query.maxInputPowerPerPump !== null && power > query.maxInputPowerPerPump) return null;
  const inBand = flow >= query.flowMin * (1 - 1e-9) && flow <= query.flowMax * (1 + 1e-9);
  const redundancyMet = redundancyMetBySignTest(packed, index, running, query, table);
  const energy =
    power === power
      ? Math.min(annualEnergyUnchecked(power * running, query.hoursPerDay), TIER_SPAN - 1)
      : TIER_SPAN - 1;
  return tierOf(inBand, preferred, redundancyMet) * TIER_SPAN + energy;
}

/**
 * The tier of a pair known to run in band, without solving: preferred when the crossing lies
 * inside the preferred region too (the same sign test on the region's flows clipped to the
 * bracket), redundant by the one-failed sign test.
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
  if (!redundancyMetBySignTest(packed, index, running, query, table)) return 1;
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
  if (!perPump) return 1;
  const preferredLow = Math.max(low, running * perPump.flowMin);
  const preferredHigh = Math.min(high, running * perPump.flowMax);
  if (!(preferredLow <= preferredHigh)) return 1;
  const offset = index * 4;
  const crossesAfterLow = cubicAt(packed.coefficients, offset, preferredLow / running) >= table.head(preferredLow);
  const crossesBeforeHigh = cubicAt(packed.coefficients, offset, preferredHigh / running) <= table.head(preferredHigh);
  return crossesAfterLow && crossesBeforeHigh ? 0 : 1;
}

/**
 * The `limit` best pairs by rank key (tier, then annual energy), kept sorted while offers stream
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

  best(): Array<[number, number]> {
    return this.pairs;
  }
}
