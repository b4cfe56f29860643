import { motorEfficiencyFor, polynomialValue, solveOperatingPoint } from '../../shared/hydraulics';
import { dutyOfParallelPumps } from '../calculations/arrangement-duty';
import type { CatalogPump, CatalogState } from '../catalog/catalog-snapshot';
import { crossingInBracket } from './band-crossing';
import { searchBesideKeptPump } from './kept-set-search';
import { withNpshShortfall } from './npsh-ranking';
import { combinedCurves, cubicAt, packedCurves } from './packed-curves';
import type { RankedCandidate, SelectionOutcome, SelectionQuery } from './selection-query';
import { rankCandidate } from './selection-reasons';
import { screenPoint, TIER_SPAN, tierInBand, TopPairs } from './selection-ranking';
import { OUT_OF_BAND_TIER } from './selection-shortfalls';
import { BandSystemTable } from './system-table';
import { pumpTermsOf, type PumpTerms } from './pump-terms';
import { speedVariantState, variableSpeedIndexes } from './speed-variants';

/*
 * The duty-point search over the catalog snapshot, in SI. For each pump and each number of
 * identical pumps in parallel, the operating point lies in the duty band [Qmin, Qmax] exactly
 * when d(Q) = h(Q/m) - H_sys(Q), which falls with Q (pump head non-increasing, system rising),
 * is >= 0 at the band's low end and <= 0 at its high end, both clipped to the combined curve's
 * published range. That sign test costs two polynomial evaluations; the pairs that pass it (and a
 * few near misses when too few pass) are solved and ranked on numbers alone (the one-failed check
 * is the same sign test at Qmin with one pump fewer), and only the few that make the answer are
 * worked out in full, with their reasons.
 */

/**
 * Ranks the catalog's pumps for one system and duty band (see the note at the top). Pumps with a
 * speed range or fixed speeds are searched apart, at the speed their duty asks for
 * (speed-variants.ts), and their candidates merged with the rest by rank key; a catalog without
 * them is searched exactly as before. Beside a kept pump, the search is kept-set-search.ts's.
 */
export function searchCatalog(state: CatalogState, query: SelectionQuery): SelectionOutcome {
  if (query.keep) return searchBesideKeptPump(state, query, query.keep);
  const variable = variableSpeedIndexes(state);
  if (variable.length === 0) return searchPumps(state, query);
  const varying = new Set(variable.map((index) => state.pumps[index]));
  const outcomes = [
    searchPumps(state, { ...query, accepts: (pump) => !varying.has(pump) && query.accepts(pump) }),
    ...query.arrangements.map((running) =>
      searchPumps(speedVariantState(state, variable, running, query), { ...query, arrangements: [running] }),
    ),
  ];
  const ranked = outcomes
    .flatMap((outcome) => outcome.candidates.map((candidate, at) => ({ candidate, key: outcome.keys[at] })))
    .sort((a, b) => a.key - b.key)
    .slice(0, query.limit);
  return {
    considered: outcomes.reduce((sum, outcome) => sum + outcome.considered, 0),
    inBand: outcomes.reduce((sum, outcome) => sum + outcome.inBand, 0),
    candidates: ranked.map(({ candidate }) => candidate),
  };
}

function searchPumps(state: CatalogState, query: SelectionQuery): SelectionOutcome & { keys: number[] } {
  const packed = packedCurves(state);
  const { coefficients, flowMin, flowMax } = packed;
  const { system, arrangements } = query;
  const table = new BandSystemTable(system, query.flowMin, query.flowMax);
  const terms = pumpTermsOf(state, query);
  const systemAtMin = table.head(query.flowMin);
  const systemAtMax = table.head(query.flowMax);
  const accepted = new Uint8Array(state.pumps.length);
  const inBand = inBandBuffer(4 * state.pumps.length * arrangements.length);
  let inBandCount = 0;
  let considered = 0;

  for (let index = 0; index < state.pumps.length; index += 1) {
    if (!query.accepts(state.pumps[index])) continue;
    accepted[index] = 1;
    const offset = index * 4;
    for (let arrangement = 0; arrangement < arrangements.length; arrangement += 1) {
      const running = arrangements[arrangement];
      considered += 1;
      const low = Math.max(query.flowMin, running * flowMin[index]);
      const high = Math.min(query.flowMax, running * flowMax[index]);
      if (low > high) continue;
      if (cubicAt(coefficients, offset, low / running) < (low === query.flowMin ? systemAtMin : table.head(low)))
        continue;
      if (cubicAt(coefficients, offset, high / running) > (high === query.flowMax ? systemAtMax : table.head(high)))
        continue;
      const at = 4 * inBandCount;
      inBand[at] = index;
      inBand[at + 1] = running;
      inBand[at + 2] = low;
      inBand[at + 3] = high;
      inBandCount += 1;
    }
  }

  // Least tiers first, by sign tests alone; pairs of a tier are solved only while the answer has
  // room or holds a key they might beat, since a pair's key is at least its least tier's.
  const tiers = tierBuffer(inBandCount);
  for (let pair = 0; pair < inBandCount; pair += 1) {
    const at = 4 * pair;
    tiers[pair] = tierInBand(packed, inBand[at], inBand[at + 1], inBand[at + 2], inBand[at + 3], query, table);
  }
  const ranking = new TopPairs(query.limit);
  for (let tier = 0; tier <= 2 && ranking.admits(tier * TIER_SPAN); tier += 1) {
    for (let pair = 0; pair < inBandCount; pair += 1) {
      if (tiers[pair] !== tier) continue;
      const at = 4 * pair;
      const index = inBand[at];
      const running = inBand[at + 1];
      const flow = crossingInBracket(coefficients, index * 4, running, table, inBand[at + 2], inBand[at + 3]);
      const head = cubicAt(coefficients, index * 4, flow / running);
      const key = screenPoint(packed, index, running, flow, head, query, table, terms);
      ranking.offer(index, running, withNpshShortfall(key, state.pumps[index], running, flow, query));
    }
  }
  const adequateInBand = ranking.countBelow(OUT_OF_BAND_TIER * TIER_SPAN);
  if (ranking.admits(OUT_OF_BAND_TIER * TIER_SPAN))
    nearMisses(state, query, accepted, 2 * (query.limit - adequateInBand), ranking, table, terms);
  const keys: number[] = [];
  const bestKeys = ranking.bestKeys();
  const candidates = ranking
    .best()
    .map(([index, running], at) => {
      const pump = state.pumps[index];
      const motor = motorEfficiencyFor(pump, query.motorEfficiency).value;
      const duty = dutyOfParallelPumps(pump, system, running, query.band, query.density, motor);
      const candidate = duty.ok ? rankCandidate(pump, running, duty.point, query) : null;
      if (candidate) keys.push(bestKeys[at]);
      return candidate;
    })
    .filter((candidate): candidate is RankedCandidate => candidate !== null);
  return { considered, inBand: inBandCount, candidates, keys };
}

let sharedInBand = new Float64Array(0);
let sharedTiers = new Uint8Array(0);

function tierBuffer(length: number): Uint8Array {
  if (sharedTiers.length < length) sharedTiers = new Uint8Array(length);
  return sharedTiers;
}

/**
 * Pairs in band, four numbers each (pump index, number running, bracket of the crossing), in one
 * buffer reused by every search: a search runs to its end without yielding, and a fresh buffer
 * per request would be a megabyte of garbage at 10,000 pumps.
 */
function inBandBuffer(length: number): Float64Array {
  if (sharedInBand.length < length) sharedInBand = new Float64Array(length);
  return sharedInBand;
}

/**
 * When too few pairs run in band: the `count` out-of-band pairs whose head at the band's middle
 * comes closest to the system's, solved on their whole published range and ranked by how far they
 * fall from the band.
 */
function nearMisses(
  state: CatalogState,
  query: SelectionQuery,
  accepted: Uint8Array,
  count: number,
  ranking: TopPairs,
  table: BandSystemTable,
  terms: PumpTerms,
): void {
  const packed = packedCurves(state);
  const { coefficients, flowMin, flowMax } = packed;
  const middle = (query.flowMin + query.flowMax) / 2;
  const systemAtMiddle = query.system.evaluate(middle);
  const gaps: Array<{ index: number; running: number; gap: number }> = [];
  for (let index = 0; index < state.pumps.length; index += 1) {
    if (!accepted[index]) continue;
    for (const running of query.arrangements) {
      const perPump = Math.min(Math.max(middle / running, flowMin[index]), flowMax[index]);
      gaps.push({ index, running, gap: Math.abs(cubicAt(coefficients, index * 4, perPump) - systemAtMiddle) });
    }
  }
  gaps.sort((a, b) => a.gap - b.gap);
  for (const { index, running } of gaps.slice(0, count)) {
    const solved = solveOperatingPoint(combinedCurves(state, running)[index], query.system);
    if (!solved.ok) continue;
    const key = screenPoint(packed, index, running, solved.flow, solved.head, query, table, terms);
    if (key !== null && key >= OUT_OF_BAND_TIER * TIER_SPAN)
      ranking.offer(index, running, withNpshShortfall(key, state.pumps[index], running, solved.flow, query));
  }
}

/** The combined curve of `running` pumps sampled at `count` flows over its published range, SI. */
export function sampledCombinedCurve(
  pump: CatalogPump,
  running: number,
  count = 17,
): Array<{ flow: number; head: number }> {
  const { fit } = pump;
  return Array.from({ length: count }, (_, step) => {
    const perPump = fit.flowMin + ((fit.flowMax - fit.flowMin) * step) / (count - 1);
    return { flow: perPump * running, head: polynomialValue(fit.headCoefficients, perPump) };
  });
}
