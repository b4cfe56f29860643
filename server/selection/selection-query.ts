import type {
  CompiledSystemCurve,
  NpshAtDuty,
  NpshGuidance,
  PreferredBand,
  SuctionSide,
} from '../../shared/hydraulics';
import type { DutyPoint, DutyWarning } from '../calculations/arrangement-duty';
import type { CatalogPump } from '../catalog/catalog-snapshot';

/* What a selection search is asked (SI throughout) and what it answers. */

export type SelectionWarningCode = DutyWarning | 'velocity';

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
  motorEfficiency: number;
  /** W per pump, or null for no limit. */
  maxInputPowerPerPump: number | null;
  onlyPreferredRegion: boolean;
  accepts: (pump: CatalogPump) => boolean;
  limit: number;
  /** The system's suction side, or null without one. */
  suction: SuctionSide | null;
  npshGuidance: NpshGuidance;
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
  /** 0 best: in band, preferred and one-failed as required; 1 in band with a shortfall; 2 outside the band. */
  tier: number;
  reasons: string[];
  /** NPSH at the duty; null without a suction side or for a submersible pump. */
  npsh: NpshAtDuty | null;
  /** The combined curve's preferred region, total flow, m3/s. */
  preferredRange: { flowMin: number; flowMax: number } | null;
}

export interface SelectionOutcome {
  considered: number;
  inBand: number;
  candidates: RankedCandidate[];
}
