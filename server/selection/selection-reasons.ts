import {
  annualEnergy,
  energyCost,
  lifeCycleCost,
  LOW_SPEED_CAUTION_RATIO,
  motorEfficiencyFor,
  preferredFlowRegion,
} from '../../shared/hydraulics';
import { dutyOfParallelPumps, type DutyOutcome, type DutyPoint } from '../calculations/arrangement-duty';
import type { CatalogPump } from '../catalog/catalog-snapshot';
import { npshOfPair, npshReason } from './npsh-ranking';
import type { Money, RankedCandidate, SelectionQuery, SelectionWarningCode } from './selection-query';
import { shortfallsOf, tierOfShortfalls, velocityExceeded } from './selection-shortfalls';

function percent(value: number | null): string {
  return value === null ? '' : ` (${Math.round(value)} % of BEP)`;
}

/** Where a point runs on its pump's curve, in words. */
export function regionReason(point: Pick<DutyPoint, 'region' | 'percentOfBep'>): string {
  if (point.region === 'preferred') return `in the preferred operating region${percent(point.percentOfBep)}`;
  if (point.region === 'allowable')
    return `outside POR, inside the maker's allowable region${percent(point.percentOfBep)}`;
  if (point.region === 'outside') return `outside POR${percent(point.percentOfBep)}`;
  return 'no efficiency data: the BEP and the preferred region are unknown';
}

/**
 * A set's running and first costs: annual energy from its input power (W), its cost at the
 * tariff, the list price of the pumps bought, and the life-cycle cost in the costs' currency
 * (a price in another currency is left out, which `reasons` gets told).
 */
export function setCosts(
  pump: CatalogPump,
  inputPower: number | null,
  bought: number,
  query: SelectionQuery,
  reasons: string[],
): { annualKWh: number | null; annualCost: number | null; firstCost: Money | null; lifeCycle: Money | null } {
  const annualKWh = inputPower === null ? null : annualEnergy(inputPower, query.hoursPerDay);
  const annualCost =
    annualKWh === null || query.tariffPerKWh === null ? null : energyCost(annualKWh, query.tariffPerKWh);
  const firstCost: Money | null = pump.listPrice
    ? { amount: pump.listPrice.amount * bought, currency: pump.listPrice.currency }
    : null;
  const costs = query.costs;
  const lifeCycle: Money | null =
    costs && firstCost?.currency === costs.currency && annualCost !== null
      ? {
          amount: lifeCycleCost({
            initialCost: firstCost.amount,
            annualEnergyCost: annualCost,
            years: costs.years,
            discountRate: costs.discountRate,
            energyPriceRise: costs.energyPriceRise,
          }),
          currency: costs.currency,
        }
      : null;
  if (costs && firstCost && firstCost.currency !== costs.currency)
    reasons.push(`priced in ${firstCost.currency}, not ${costs.currency}: left out of the life-cycle cost`);
  return { annualKWh, annualCost, firstCost, lifeCycle };
}

/**
 * A pair the engine has solved, worked out in full for the answer: band, region, one-failed
 * check, energy, warnings, tier and the reasons in words; null when a filter leaves it out.
 */
export function rankCandidate(
  pump: CatalogPump,
  running: number,
  point: DutyPoint,
  query: SelectionQuery,
): RankedCandidate | null {
  if (query.onlyPreferredRegion && point.region !== 'preferred') return null;
  const motor = motorEfficiencyFor(pump, query.motorEfficiency);
  if (
    query.maxInputPowerPerPump !== null &&
    point.inputPower !== null &&
    point.inputPower / running > query.maxInputPowerPerPump
  )
    return null;
  const inBand = point.flow >= query.flowMin * (1 - 1e-9) && point.flow <= query.flowMax * (1 + 1e-9);
  const reasons: string[] = [];
  if (inBand) reasons.push('in the duty band');
  else reasons.push(point.flow < query.flowMin ? 'below the duty band' : 'above the duty band');
  reasons.push(regionReason(point));

  let oneFailed: DutyPoint | null = null;
  let oneFailedMeetsMinimum: boolean | null = null;
  if (query.standby) {
    // the standby starts in the failed pump's place: the arrangement runs on at the same point
    oneFailed = point;
    oneFailedMeetsMinimum = point.flow >= query.flowMin * (1 - 1e-9);
    reasons.push(
      oneFailedMeetsMinimum
        ? 'one failed: the standby takes over at the same point'
        : 'below the band minimum even with the standby',
    );
  } else if (running >= 2) {
    const failed: DutyOutcome = dutyOfParallelPumps(
      pump,
      query.system,
      running - 1,
      query.band,
      query.density,
      motor.value,
    );
    if (failed.ok) {
      oneFailed = failed.point;
      oneFailedMeetsMinimum = failed.point.flow >= query.flowMin * (1 - 1e-9);
      reasons.push(
        oneFailedMeetsMinimum ? 'one failed: still at or above the band minimum' : 'below band with one failed',
      );
      if (failed.point.warnings.includes('run-out')) reasons.push('run-out with one failed');
    } else {
      oneFailedMeetsMinimum = false;
      reasons.push(
        failed.reason === 'beyond-curve'
          ? 'run-out with one failed: the rest run past their curve'
          : 'with one failed the rest deliver nothing',
      );
    }
  } else if (query.requireOneFailed) {
    reasons.push('a single pump: no flow at all when it fails');
  }
  const warnings: SelectionWarningCode[] = [...point.warnings];
  if (velocityExceeded(query.system, point.flow)) warnings.push('velocity');
  if (point.warnings.includes('run-out')) reasons.push('run-out');
  if (point.warnings.includes('dead-head')) reasons.push('near dead-head');
  if (pump.fit.curveBasis === 'estimated-from-two-points') {
    warnings.push('estimated-curve');
    reasons.push('estimated curve: only shut-off and open flow are published');
  }
  if (pump.atSpeed) {
    reasons.push(`at ${Math.round(pump.atSpeed.rpm)} rpm, ${(100 * pump.atSpeed.ratio).toFixed(0)} % of nominal speed`);
    if (pump.atSpeed.ratio < LOW_SPEED_CAUTION_RATIO) {
      warnings.push('low-speed');
      reasons.push(
        `below ${100 * LOW_SPEED_CAUTION_RATIO} % speed: efficiency, motor cooling and minimum flow to check`,
      );
    }
  }
  const npsh = npshOfPair(pump, running, point.flow, query);
  if (npsh) reasons.push(npshReason(npsh, query));

  const misses = shortfallsOf({
    inBand,
    redundancyMet: !query.requireOneFailed || oneFailedMeetsMinimum === true,
    preferred: point.region === 'preferred',
    velocityOk: !warnings.includes('velocity'),
    npshMarginMet: !npsh?.margin || npsh.margin.adequate,
  });
  const { annualKWh, annualCost, firstCost, lifeCycle } = setCosts(
    pump,
    point.inputPower,
    running + (query.standby ? 1 : 0),
    query,
    reasons,
  );
  const perPump = preferredFlowRegion(pump.fit, query.band, pump.declaredPreferred);
  return {
    pump,
    running,
    point,
    oneFailed,
    inBand,
    oneFailedMeetsMinimum,
    annualKWh,
    annualCost,
    warnings,
    misses,
    tier: tierOfShortfalls(misses),
    motor,
    firstCost,
    lifeCycleCost: lifeCycle,
    reasons,
    npsh,
    preferredRange: perPump ? { flowMin: perPump.flowMin * running, flowMax: perPump.flowMax * running } : null,
  };
}
