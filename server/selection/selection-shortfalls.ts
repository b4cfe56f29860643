import { VELOCITY_WARNING_LIMIT, type CompiledSystemCurve } from '../../shared/hydraulics';

/*
 * The designer's requirements a candidate may miss, and the rank tier they make. In band, a pair's
 * tier is the number of requirements it misses, so the answer lists first those that miss fewest;
 * a pair outside the band ranks after every pair in it, nearest the band first. The NPSH margin is
 * listed as a miss but not counted in the tier: a pair that would cavitate ranks below every pair
 * with margin, whatever their tiers (npsh-ranking.ts). A new requirement is one more code here and
 * one more check in `shortfallsOf`.
 */

export const SELECTION_REQUIREMENTS = ['band', 'redundancy', 'preferred-region', 'velocity', 'npsh-margin'] as const;
export type SelectionRequirement = (typeof SELECTION_REQUIREMENTS)[number];

/** What was checked of one pair; `redundancyMet` is true when no redundancy was asked. */
export interface RequirementChecks {
  inBand: boolean;
  redundancyMet: boolean;
  preferred: boolean;
  velocityOk: boolean;
  /** True as well when there is nothing to check (no suction side, a submersible, no NPSH data). */
  npshMarginMet: boolean;
}

/** The requirements a pair misses, in SELECTION_REQUIREMENTS order. */
export function shortfallsOf(checks: RequirementChecks): SelectionRequirement[] {
  const misses: SelectionRequirement[] = [];
  if (!checks.inBand) misses.push('band');
  if (!checks.redundancyMet) misses.push('redundancy');
  if (!checks.preferred) misses.push('preferred-region');
  if (!checks.velocityOk) misses.push('velocity');
  if (!checks.npshMarginMet) misses.push('npsh-margin');
  return misses;
}

/** The requirements counted in an in-band tier. */
const TIER_REQUIREMENTS: readonly SelectionRequirement[] = ['redundancy', 'preferred-region', 'velocity'];

/** Above every in-band tier (at most one per counted requirement). */
export const OUT_OF_BAND_TIER = TIER_REQUIREMENTS.length + 1;

/** In band: the number of counted requirements missed; outside: OUT_OF_BAND_TIER. */
export function tierOfShortfalls(misses: readonly SelectionRequirement[]): number {
  if (misses.includes('band')) return OUT_OF_BAND_TIER;
  return misses.filter((requirement) => TIER_REQUIREMENTS.includes(requirement)).length;
}

/** Velocity over the warning limit at a total flow: the smallest bore carries the highest velocity. */
export function velocityExceeded(system: CompiledSystemCurve, flow: number): boolean {
  return system.segments.some((segment) => flow / segment.area > VELOCITY_WARNING_LIMIT);
}

/**
 * How far a total flow falls from the band, as a fraction of the nearer end (0 inside), the order
 * of pairs outside the band.
 */
export function distanceFromBand(flow: number, flowMin: number, flowMax: number): number {
  if (flow < flowMin) return (flowMin - flow) / flowMin;
  if (flow > flowMax) return (flow - flowMax) / flowMax;
  return 0;
}

const requirementWords: Record<SelectionRequirement, string> = {
  band: 'the duty band',
  redundancy: 'redundancy (the band still reached with one pump failed)',
  'preferred-region': 'the preferred operating region',
  velocity: 'the pipe velocity limit',
  'npsh-margin': 'the NPSH margin (NPSH available over NPSH required)',
};

export interface UnmetSummary {
  requirements: SelectionRequirement[];
  noneInBand: boolean;
  summary: string;
  whatWould: string[];
}

/** What a near miss tells of the way out when no pair reaches the band. */
export interface BandMissFacts {
  /** Most of the nearest pairs run below the band (too little flow) rather than above it. */
  below: boolean;
  /** Pairs of three in parallel that reach the band, or null when three were tried already. */
  threeInParallelInBand: number | null;
  /** The pairs were a kept pump and one added beside it: more in parallel was not tried. */
  besideKeptPump?: boolean;
}

/**
 * The answer's plain word when the best candidate misses something: which requirements no
 * candidate meets and, with none in band, what would reach it. Null when the best meets all.
 */
export function unmetSummary(
  candidateMisses: ReadonlyArray<readonly SelectionRequirement[]>,
  noneInBand: BandMissFacts | null,
): UnmetSummary | null {
  if (candidateMisses.length === 0 || candidateMisses[0].length === 0) return null;
  const requirements = SELECTION_REQUIREMENTS.filter((requirement) =>
    candidateMisses.every((misses) => misses.includes(requirement)),
  );
  const words = requirements.map((requirement) => requirementWords[requirement]).join(', ');
  if (noneInBand) {
    // what was tried and failed goes in the summary; the list holds only what would reach the band
    const threeInParallel = noneInBand.threeInParallelInBand;
    const tried = noneInBand.besideKeptPump
      ? ''
      : noneInBand.below && threeInParallel !== null && threeInParallel === 0
        ? ' Three pumps in parallel do not reach it either.'
        : noneInBand.below && threeInParallel === null
          ? ' Three pumps in parallel were among the arrangements and do not reach it either.'
          : '';
    const whatWould = noneInBand.below
      ? [
          ...(threeInParallel !== null && threeInParallel > 0
            ? [`three pumps in parallel: ${threeInParallel} pump and arrangement pairs of the catalog reach the band`]
            : []),
          'a larger pipe: less friction lowers the head the system needs at the band',
          'a bigger class of pump: more flow at this head than any in the catalog gives',
        ]
      : [
          'a smaller class of pump, or fewer in parallel',
          'a valve to throttle the flow, or a smaller pipe, raises the head the system needs',
        ];
    return {
      requirements,
      noneInBand: true,
      summary: `No pump in the catalog reaches the duty band in the arrangements asked for. The nearest are listed by how far they fall ${noneInBand.below ? 'below' : 'above'} it.${tried}`,
      whatWould,
    };
  }
  return {
    requirements,
    noneInBand: false,
    summary:
      requirements.length > 0
        ? `No candidate meets ${words}. Candidates are ordered by how many requirements they miss; each lists what it misses.`
        : 'No candidate meets every requirement. Candidates are ordered by how many requirements they miss; each lists what it misses.',
    whatWould: [],
  };
}
