import {
  hasSpeedChoice,
  parallelHeadCurve,
  speedRatioForDutyPoint,
  speedRatioToRun,
  type PumpSpeeds,
} from '../../shared/hydraulics';
import { pumpOnFileAtSpeed } from '../calculations/pump-at-speed';
import type { CatalogPump, CatalogState } from '../catalog/catalog-snapshot';
import type { SelectionQuery } from './selection-query';

/*
 * Variable- and multi-speed pumps in the search: each such pump is searched once per number in
 * parallel at the speed its duty asks for, as a copy whose fit is moved there by the affinity laws
 * (pumpCurveAtSpeed; Q ~ N, H ~ N^2, P ~ N^3, efficiency held).
 *
 * The speed chosen is the lowest whose operating point reaches the band's bottom flow Qmin (kept
 * within the pump's range; with fixed speeds, the lowest of them, or the nominal one, at or above
 * it). Why the bottom of the band: the system head rises with flow, so the hydraulic power
 * rho g Q H_sys(Q) is least at Qmin, and the band says Qmin is enough; a drive is bought to save
 * that energy, which is what the search ranks by by default. The speed that puts the point
 * nearest BEP was the other choice: it can cost more energy for the same duty, and the ranking's
 * tiers already mark a point outside the preferred region. On a system with much static head the
 * point at low speed runs left of BEP; the candidate then says so (region) and carries the
 * low-speed caution below 60 % speed.
 */

/** Above the exact speed by this share, so the point sits inside the band rather than on its edge. */
const BAND_EDGE_MARGIN = 1e-6;

/** Indexes of the pumps with a speed range or fixed speeds, once per catalog state. */
export function variableSpeedIndexes(state: CatalogState): readonly number[] {
  let indexes = state.derived.get('variable-speed') as number[] | undefined;
  if (!indexes) {
    indexes = state.pumps.flatMap((pump, index) => (hasSpeedChoice(pump.speeds) ? [index] : []));
    state.derived.set('variable-speed', indexes);
  }
  return indexes;
}

/** The ratio N / N_nominal that `running` of `pump` need to put the point at the band's bottom flow. */
function neededRatio(pump: CatalogPump, running: number, query: SelectionQuery): number {
  const head = query.system.evaluate(query.flowMin);
  // gravity alone reaches the band's bottom: the lowest speed the pump has
  if (!(head > 0)) return 0;
  const found = speedRatioForDutyPoint(parallelHeadCurve(pump.fit, running), query.flowMin, head);
  if (found.ok) return found.speedRatio * (1 + BAND_EDGE_MARGIN);
  // the affinity parabola meets the curve before its first published flow: as fast as it goes;
  // past its last: the lowest speed, whose point the search then finds where it is
  return found.reason === 'before-curve' ? Number.POSITIVE_INFINITY : 0;
}

/** The pump at the speed its duty asks for, `running` in parallel, marked with that speed. */
export function pumpAtDutySpeed(pump: CatalogPump, running: number, query: SelectionQuery): CatalogPump {
  const speeds = pump.speeds as PumpSpeeds & { nominalRpm: number };
  const ratio = speedRatioToRun(speeds, neededRatio(pump, running, query));
  return { ...pumpOnFileAtSpeed(pump, ratio), atSpeed: { ratio, rpm: ratio * speeds.nominalRpm } };
}

/**
 * A catalog state of its own holding the variable-speed pumps at the speed `running` of them need
 * for this query: a few pumps, built per request, searched like the rest.
 */
export function speedVariantState(
  state: CatalogState,
  indexes: readonly number[],
  running: number,
  query: SelectionQuery,
): CatalogState {
  const pumps = indexes
    .map((index) => state.pumps[index])
    .filter((pump) => query.accepts(pump))
    .map((pump) => pumpAtDutySpeed(pump, running, query));
  return {
    stamp: `${state.stamp}/speed-${running}`,
    pumps,
    byId: new Map(pumps.map((pump) => [pump.pumpId, pump])),
    derived: new Map(),
  };
}
