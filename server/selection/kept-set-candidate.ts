import { motorEfficiencyFor, npshAtDuty, preferredFlowRegion } from '../../shared/hydraulics';
import type { MixedSetOutcome, MixedSetPoint } from '../calculations/mixed-set-duty';
import type { CatalogPump } from '../catalog/catalog-snapshot';
import { NPSH_SHORTFALL_OFFSET, npshReason } from './npsh-ranking';
import type { KeptSetDuty, RankedCandidate, SelectionQuery, SelectionWarningCode } from './selection-query';
import { regionReason, setCosts } from './selection-reasons';
import { TIER_SPAN } from './selection-ranking';
import {
  distanceFromBand,
  OUT_OF_BAND_TIER,
  shortfallsOf,
  tierOfShortfalls,
  velocityExceeded,
} from './selection-shortfalls';

/*
 * One candidate beside a kept pump, worked out in full: the set's band, energy and costs, the
 * added pump's region and warnings, both single failures, and its rank key (the same tiers and
 * rank values as the plain search: selection-ranking.ts).
 */

/** Below this share of the band minimum counts as reaching it, as in the plain search. */
const BAND_EDGE = 1e-9;

/** Added to the key of an estimated curve, as in the plain search (selection-ranking.ts). */
const ESTIMATED_CURVE_PENALTY = 0.01;

const roleWords = { kept: 'the kept pump', added: 'the added pump' } as const;

/** The set with the kept pump stopped, then the added one, from each other pump's outcome alone. */
export function stoppedCases(
  outcomes: readonly [MixedSetOutcome, MixedSetOutcome],
  query: SelectionQuery,
): KeptSetDuty['stopped'] {
  return (['kept', 'added'] as const).map((role, at) => {
    const outcome = outcomes[at];
    const point = outcome.ok ? outcome.point : null;
    return { role, point, meetsMinimum: point !== null && point.flow >= query.flowMin * (1 - BAND_EDGE) };
  });
}

function stoppedReason(stopped: KeptSetDuty['stopped'][number]): string {
  const other = stopped.role === 'kept' ? 'the added pump' : 'the kept pump';
  const start = `with ${roleWords[stopped.role]} stopped`;
  if (stopped.point === null) return `${start}: ${other} alone has no operating point`;
  return stopped.meetsMinimum
    ? `${start}: ${other} alone still at or above the band minimum`
    : `${start}: ${other} alone falls below the band minimum`;
}

function rankValueOf(candidate: RankedCandidate, query: SelectionQuery): number {
  if (candidate.tier === OUT_OF_BAND_TIER)
    return 1e6 * distanceFromBand(candidate.point.flow, query.flowMin, query.flowMax);
  if (query.rankBy === 'energy') return candidate.annualKWh ?? Number.NaN;
  if (query.rankBy === 'first-cost') return candidate.firstCost?.amount ?? Number.NaN;
  return candidate.lifeCycleCost?.amount ?? Number.NaN;
}

/** The rank key: tier, then rank value (unknown last), an NPSH shortfall past every tier. */
function keyOf(candidate: RankedCandidate, query: SelectionQuery): number {
  const value = rankValueOf(candidate, query);
  return (
    candidate.tier * TIER_SPAN +
    (value === value ? Math.min(value, TIER_SPAN - 1) : TIER_SPAN - 1) +
    (candidate.warnings.includes('estimated-curve') ? ESTIMATED_CURVE_PENALTY : 0) +
    (candidate.npsh?.margin && !candidate.npsh.margin.adequate ? NPSH_SHORTFALL_OFFSET : 0)
  );
}

/**
 * `pump` added beside the kept one at the set's `point` (members: kept, added), with the set
 * with either one stopped (stoppedCases); null when a filter leaves it out (the added pump's
 * region and input power are what the filters read).
 */
export function rankKeptSet(
  pump: CatalogPump,
  point: MixedSetPoint,
  stopped: KeptSetDuty['stopped'],
  query: SelectionQuery,
): { candidate: RankedCandidate; key: number } | null {
  const kept = point.members[0].point;
  const added = point.members[1].point;
  if (query.onlyPreferredRegion && added.region !== 'preferred') return null;
  if (query.maxInputPowerPerPump !== null && added.inputPower !== null && added.inputPower > query.maxInputPowerPerPump)
    return null;
  const inBand = point.flow >= query.flowMin * (1 - BAND_EDGE) && point.flow <= query.flowMax * (1 + BAND_EDGE);
  const reasons = [
    inBand ? 'in the duty band' : point.flow < query.flowMin ? 'below the duty band' : 'above the duty band',
  ];
  if (added.flowPerPump === 0)
    reasons.push('the added pump delivers nothing: its shut-off head is not above the common head');
  else reasons.push(`added pump ${regionReason(added)}`);
  if (kept.flowPerPump === 0)
    reasons.push('the kept pump delivers nothing beside it: its shut-off head is not above the common head');
  else reasons.push(`kept pump ${regionReason(kept)}`);
  stopped.forEach((each) => reasons.push(stoppedReason(each)));
  const bothMeet = stopped.every((each) => each.meetsMinimum);

  const warnings: SelectionWarningCode[] = [...added.warnings];
  if (velocityExceeded(query.system, point.flow)) warnings.push('velocity');
  if (added.warnings.includes('run-out')) reasons.push('run-out');
  if (added.warnings.includes('dead-head')) reasons.push('near dead-head');
  if (pump.fit.curveBasis === 'estimated-from-two-points') {
    warnings.push('estimated-curve');
    reasons.push('estimated curve: only shut-off and open flow are published');
  }
  const npsh =
    query.suction && pump.kind !== 'submersible'
      ? npshAtDuty(query.suction, pump.fit, point.flow, added.flowPerPump, query.npshGuidance)
      : null;
  if (npsh) reasons.push(npshReason(npsh, query));
  const misses = shortfallsOf({
    inBand,
    redundancyMet: !query.requireOneFailed || bothMeet,
    preferred: added.region === 'preferred',
    velocityOk: !warnings.includes('velocity'),
    npshMarginMet: !npsh?.margin || npsh.margin.adequate,
  });
  // the kept pump is installed already: only the added one is bought
  const { annualKWh, annualCost, firstCost, lifeCycle } = setCosts(pump, point.inputPower, 1, query, reasons);
  const region = preferredFlowRegion(pump.fit, query.band, pump.declaredPreferred);
  const candidate: RankedCandidate = {
    pump,
    running: 1,
    point: { ...added, flow: point.flow, head: point.head, inputPower: point.inputPower },
    oneFailed: null,
    inBand,
    oneFailedMeetsMinimum: bothMeet,
    annualKWh,
    annualCost,
    warnings,
    misses,
    tier: tierOfShortfalls(misses),
    motor: motorEfficiencyFor(pump, query.motorEfficiency),
    firstCost,
    lifeCycleCost: lifeCycle,
    reasons,
    npsh,
    preferredRange: region,
    set: { point, stopped },
  };
  return { candidate, key: keyOf(candidate, query) };
}
