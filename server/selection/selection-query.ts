import type { SelectionRequest } from '../../shared/api/api-schemas';
import {
  presentValueOfGrowingAnnuity,
  type CompiledSystemCurve,
  type MotorEfficiencyUsed,
  type NpshAtDuty,
  type NpshGuidance,
  type PreferredBand,
  type SuctionSide,
} from '../../shared/hydraulics';
import type { DutyPoint, DutyWarning, PumpOnFile } from '../calculations/arrangement-duty';
import type { MixedSetPoint } from '../calculations/mixed-set-duty';
import type { CatalogPump } from '../catalog/catalog-snapshot';
import type { SelectionRequirement } from './selection-shortfalls';

/* What a selection search is asked (SI throughout) and what it answers. */

export type SelectionWarningCode = DutyWarning | 'velocity' | 'estimated-curve' | 'low-speed';

/** What ranks candidates within a tier: annual energy, the set's first cost, or its life-cycle cost. */
export type RankBy = 'energy' | 'first-cost' | 'life-cycle-cost';

/** The terms costs are reckoned on; rates are fractions a year. */
export interface CostTerms {
  currency: string;
  years: number;
  discountRate: number;
  energyPriceRise: number;
  /** The present value of 1 a year of energy over the life (presentValueOfGrowingAnnuity(1, ...)). */
  energyFactor: number;
}

/** The request's costs (rates in percent) as the search reckons them. */
export function costTermsOf(costs: SelectionRequest['costs']): CostTerms | null {
  if (!costs) return null;
  const discountRate = costs.discountRate / 100;
  const energyPriceRise = (costs.energyPriceRise ?? 0) / 100;
  return {
    currency: costs.currency,
    years: costs.years,
    discountRate,
    energyPriceRise,
    energyFactor: presentValueOfGrowingAnnuity(1, discountRate, energyPriceRise, costs.years),
  };
}

export interface Money {
  amount: number;
  currency: string;
}

export interface SelectionQuery {
  system: CompiledSystemCurve;
  density: number;
  /** m3/s */
  flowMin: number;
  flowMax: number;
  arrangements: readonly number[];
  requireOneFailed: boolean;
  /** One more pump installed idle per arrangement, taking over when a running one fails. */
  standby: boolean;
  band: PreferredBand;
  hoursPerDay: number;
  tariffPerKWh: number | null;
  /** 0-1, the designer's figure for pumps the catalog gives none; null for the pump kind's. */
  motorEfficiency: number | null;
  rankBy: RankBy;
  costs: CostTerms | null;
  /** W per pump, or null for no limit. */
  maxInputPowerPerPump: number | null;
  onlyPreferredRegion: boolean;
  accepts: (pump: CatalogPump) => boolean;
  limit: number;
  /** The system's suction side, or null without one. */
  suction: SuctionSide | null;
  npshGuidance: NpshGuidance;
  /** The pump kept beside each candidate, or null to search the arrangements alone. */
  keep: KeptPump | null;
}

/** A pump already installed that stays, ready for the engine. */
export interface KeptPump {
  pump: PumpOnFile;
  /** The catalog pump's id; null for an inline curve. */
  pumpId: number | null;
  /** 0-1, the motor efficiency its curve power is divided by. */
  motorEfficiency: number;
}

/** A kept pump and a candidate at the set's duty, and the set with either one stopped. */
export interface KeptSetDuty {
  /** Members: the kept pump (entry 0), then the added one (entry 1). */
  point: MixedSetPoint;
  /** The kept pump stopped, then the added one; point null when the other alone has none. */
  stopped: Array<{ role: 'kept' | 'added'; point: MixedSetPoint | null; meetsMinimum: boolean }>;
}

export interface RankedCandidate {
  pump: CatalogPump;
  running: number;
  point: DutyPoint;
  oneFailed: DutyPoint | null;
  inBand: boolean;
  oneFailedMeetsMinimum: boolean | null;
  annualKWh: number | null;
  annualCost: number | null;
  warnings: SelectionWarningCode[];
  /** The requirements it misses; its tier is tierOfShortfalls of these. */
  misses: SelectionRequirement[];
  tier: number;
  motor: MotorEfficiencyUsed;
  /** List price of the set (duty plus standby), in the pump's currency. */
  firstCost: Money | null;
  /** In the cost currency; null without costs, a tariff, a price in that currency or energy. */
  lifeCycleCost: Money | null;
  reasons: string[];
  /** NPSH at the duty; null without a suction side or for a submersible pump. */
  npsh: NpshAtDuty | null;
  /** The combined curve's preferred region, total flow, m3/s. */
  preferredRange: { flowMin: number; flowMax: number } | null;
  /** With a kept pump: the set's duty; `point` then holds the set's flow, head and power. */
  set?: KeptSetDuty;
}

export interface SelectionOutcome {
  considered: number;
  inBand: number;
  candidates: RankedCandidate[];
  /** Beside a kept pump: accepted pumps left out because their curve does not start at zero flow. */
  leftOut?: number;
}
