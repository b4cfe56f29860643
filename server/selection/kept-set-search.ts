import { motorEfficiencyFor, polynomialValue, type PumpCurveFit } from '../../shared/hydraulics';
import {
  dutyOfMixedSet,
  withOnePumpStopped,
  type MixedSetMember,
  type MixedSetPoint,
} from '../calculations/mixed-set-duty';
import type { CatalogPump, CatalogState } from '../catalog/catalog-snapshot';
import { rankKeptSet, stoppedCases } from './kept-set-candidate';
import { cubicAt, packedCurves } from './packed-curves';
import type { KeptPump, SelectionOutcome, SelectionQuery } from './selection-query';
import { OUT_OF_BAND_TIER } from './selection-shortfalls';
import { TIER_SPAN } from './selection-ranking';

/*
 * The search beside a kept pump, in SI: each catalog pump as the one added in parallel to it, the
 * pair solved as a mixed set (dutyOfMixedSet, on the engine's solveParallelUnequal).
 *
 * The pre-screen. Let H1 = H_sys(Qmin) and H2 = H_sys(Qmax), and K(H) the kept pump's flow at
 * head H (0 at or above its shut-off head). The set's total flow at a common head, K(H) + A(H)
 * with A the added pump's, falls as the head rises, and the system's rises with flow, so the
 * set's point lies in the band exactly when K(H1) + A(H1) >= Qmin and K(H2) + A(H2) <= Qmax.
 * With the added pump's head h(Q) non-increasing, A(H1) >= Qmin - K(H1) holds when that need is
 * at most 0, or inside the pump's range with h(need) >= H1; A(H2) <= Qmax - K(H2) when that room
 * is at least the pump's last flow, or h(room) <= H2 (and never when the room is negative: the
 * kept pump alone runs past the band). K is worked out once per request, so each pump costs two
 * cubic evaluations, the sign test of the plain search moved by the kept pump's flow. Only the
 * pumps that pass are solved; when too few do, the nearest misses are solved too.
 */

/** Flow of a non-increasing head curve at `head`, by bisection on its published range: 0 at or above shut-off. */
function flowAtHead(fit: PumpCurveFit, head: number): number {
  let low = 0;
  let high = fit.flowMax;
  if (polynomialValue(fit.headCoefficients, low) <= head) return 0;
  if (polynomialValue(fit.headCoefficients, high) >= head) return high;
  for (let step = 0; step < 60; step += 1) {
    const middle = (low + high) / 2;
    if (polynomialValue(fit.headCoefficients, middle) > head) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}

function keptMember(keep: KeptPump): MixedSetMember {
  return { entry: 0, pump: keep.pump, running: 1, motorEfficiency: keep.motorEfficiency };
}

function addedMember(pump: CatalogPump, query: SelectionQuery): MixedSetMember {
  return { entry: 1, pump, running: 1, motorEfficiency: motorEfficiencyFor(pump, query.motorEfficiency).value };
}

/** Ranks the catalog's pumps as the one added beside `query.keep` (see the note at the top). */
export function searchBesideKeptPump(state: CatalogState, query: SelectionQuery, keep: KeptPump): SelectionOutcome {
  const { coefficients, flowMin, flowMax } = packedCurves(state);
  const headAtMin = query.system.evaluate(query.flowMin);
  const headAtMax = query.system.evaluate(query.flowMax);
  const need = query.flowMin - flowAtHead(keep.pump.fit, headAtMin);
  const room = query.flowMax - flowAtHead(keep.pump.fit, headAtMax);
  const kept = keptMember(keep);
  const keptAlone = dutyOfMixedSet([kept], query.system, query.band, query.density);
  const accepted: number[] = [];
  const inBand: number[] = [];
  let leftOut = 0;
  for (let index = 0; index < state.pumps.length; index += 1) {
    if (!query.accepts(state.pumps[index])) continue;
    // a mixed set needs each curve from zero flow (its shut-off head)
    if (flowMin[index] !== 0) {
      leftOut += 1;
      continue;
    }
    accepted.push(index);
    const offset = index * 4;
    const reachesMin = need <= 0 || (need <= flowMax[index] && cubicAt(coefficients, offset, need) >= headAtMin);
    const staysBelowMax = room >= 0 && (room >= flowMax[index] || cubicAt(coefficients, offset, room) <= headAtMax);
    if (reachesMin && staysBelowMax) inBand.push(index);
  }

  // Ranked first on the added pump alone by the sign test at Qmin (as the plain search ranks
  // redundancy); only the answer's few have that pump alone solved, for their figures.
  const keptMeets = keptAlone.ok && keptAlone.point.flow >= query.flowMin * (1 - 1e-9);
  const headAtMinIsMet = (index: number) =>
    query.flowMin <= flowMax[index] && cubicAt(coefficients, index * 4, query.flowMin) >= headAtMin;
  const ranked: Array<{ index: number; point: MixedSetPoint; key: number }> = [];
  const solve = (index: number) => {
    const pump = state.pumps[index];
    const duty = dutyOfMixedSet([kept, addedMember(pump, query)], query.system, query.band, query.density);
    if (!duty.ok) return;
    const screened = rankKeptSet(
      pump,
      duty.point,
      [
        { role: 'kept', point: null, meetsMinimum: headAtMinIsMet(index) },
        { role: 'added', point: null, meetsMinimum: keptMeets },
      ],
      query,
    );
    if (screened) ranked.push({ index, point: duty.point, key: screened.key });
  };
  inBand.forEach(solve);
  const adequate = ranked.filter(({ key }) => key < OUT_OF_BAND_TIER * TIER_SPAN).length;
  if (adequate < query.limit) {
    const solvedAlready = new Set(inBand);
    const middle = (query.flowMin + query.flowMax) / 2;
    const headAtMiddle = query.system.evaluate(middle);
    const needAtMiddle = middle - flowAtHead(keep.pump.fit, headAtMiddle);
    accepted
      .filter((index) => !solvedAlready.has(index))
      .map((index) => {
        const flow = Math.min(Math.max(needAtMiddle, 0), flowMax[index]);
        return { index, gap: Math.abs(cubicAt(coefficients, index * 4, flow) - headAtMiddle) };
      })
      .sort((a, b) => a.gap - b.gap)
      .slice(0, 2 * (query.limit - adequate))
      .forEach(({ index }) => solve(index));
  }
  ranked.sort((a, b) => a.key - b.key);
  const candidates = ranked.slice(0, query.limit).flatMap(({ index, point }) => {
    const pump = state.pumps[index];
    const members = [kept, addedMember(pump, query)];
    const addedAlone = dutyOfMixedSet(withOnePumpStopped(members, 0), query.system, query.band, query.density);
    const full = rankKeptSet(pump, point, stoppedCases([addedAlone, keptAlone], query), query);
    return full ? [full.candidate] : [];
  });
  return { considered: accepted.length, inBand: inBand.length, candidates, leftOut };
}
