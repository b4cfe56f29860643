/*
 * What the engine has to say about a result, as data: a code, its numbers (SI) and, where one
 * input is to blame, a JSON pointer into the engine's input. Sentences are made at the edge from
 * one table (shared/messages/engine-issue-text.ts), in the units the reader asked for.
 */

/** Why a Hazen-Williams segment is outside the range the formula is fitted to (system-breakdown HAZEN_WILLIAMS_RANGE). */
export type HazenWilliamsRangeReason = 'small-bore' | 'low-reynolds' | 'temperature';

/** The numbers each engine issue carries, by code (SI: m3/s, m/s, C). */
export interface EngineIssueParams {
  /** Hazen-Williams used outside the water temperatures it was fitted to. */
  'hazen-williams-temperature': { temperature: number };
  /** A segment's velocity above the common-practice limit for plastic pipe. */
  'segment-velocity': { segment: number; flow: number; velocity: number; limit: number };
  /** Darcy-Weisbach flow in the transition band Re 2300-4000, where the turbulent friction factor is taken. */
  'transitional-flow': { segment: number; flow: number; reynolds: number };
  /** A Hazen-Williams segment outside the formula's range, with the Darcy-Weisbach friction head (m) beside it. */
  'hazen-williams-out-of-range': {
    segment: number;
    flow: number;
    reynolds: number;
    reasons: HazenWilliamsRangeReason[];
    hazenWilliamsHead: number;
    darcyWeisbachHead: number;
    /** The segment has no roughness: the Darcy-Weisbach figure is for a smooth pipe. */
    smoothPipe: boolean;
  };
  /** The least-squares head fit would rise; a constrained one is used instead. */
  'head-fit-constrained': { leastSquaresDegree: 2 | 3; degree: 2 | 3; heldFlatAt: 'first' | 'last' | null };
  /** The published points ran from the largest flow down and were reversed. */
  'points-reversed': Record<string, never>;
  /** Head rises to a peak (m, at m3/s) before it falls: the curve is used from the peak on. */
  'drooping-curve': { peakFlow: number; peakHead: number };
  /** Only shut-off and open flow were published: the head curve is the fallback shape, not measured. */
  'curve-estimated-from-two-points': Record<string, never>;
  /** The first published point is not at zero flow. */
  'shut-off-extrapolated': { flowMin: number };
  /** A curve scaled by the affinity laws (speed ratio, 1 = nominal). */
  'affinity-scaled': { speedRatio: number };
  /** A point at a speed ratio below the low-speed caution ratio (LOW_SPEED_CAUTION_RATIO). */
  'low-speed': { speedRatio: number; cautionRatio: number };
  /** No operating point: the pump cannot lift the static head (m). */
  'shut-off-below-static-head': { shutOffHead: number; staticHead: number };
  /** No operating point inside the published flows. */
  'crosses-before-curve': Record<string, never>;
  'crosses-beyond-curve': Record<string, never>;
  /** No operating point for an arrangement: no pump lifts the static head (m). */
  'highest-shut-off-below-static-head': { shutOffHead: number; staticHead: number };
  'arrangement-run-out': Record<string, never>;
  /** A duty point reached by changing speed falls outside the published flows. */
  'duty-before-curve': Record<string, never>;
  'duty-beyond-curve': Record<string, never>;
  /** A branch whose outlet head (m) is above the head at the split (m) takes no flow: no back-flow is modelled. */
  'branch-no-flow': { branch: number; name: string; outletHead: number; junctionHead: number };
}

export type EngineIssueCode = keyof EngineIssueParams;

/** One engine issue; `pointer` names the input it concerns (e.g. `/segments/0`). */
export type EngineIssue = {
  [Code in EngineIssueCode]: { code: Code; params: EngineIssueParams[Code]; pointer?: string };
}[EngineIssueCode];

/** The numbers of each reason the engine refuses its input, by code (SI, or counts and names). */
export interface EngineInputErrorParams {
  'not-finite': { what: string; value: number };
  'not-positive': { what: string; value: number };
  negative: { what: string; value: number };
  'out-of-range': { what: string; value: number; min: number; max: number };
  'not-whole-number': { what: string; value: number; min: number };
  'trim-only': { ratio: number };
  'unknown-fitting-kind': { value: string; accepted: string[] };
  /** A reducer or expansion without its diameter ratio. */
  'no-diameter-ratio': { kind: string };
  'unknown-friction-method': { value: string; accepted: string[] };
  'unknown-material': { value: string; accepted: string[] };
  'unknown-unit': { quantity: string; value: string; accepted: string[] };
  'unknown-pipe-size': { value: string; series: string[] };
  'band-reversed': Record<string, never>;
  'allowable-region-reversed': Record<string, never>;
  'running-exceeds-installed': { running: number; installed: number };
  'no-pumps': Record<string, never>;
  'parallel-needs-shut-off': Record<string, never>;
  'no-segments': Record<string, never>;
  'pipe-size-and-diameter': Record<string, never>;
  'no-diameter': Record<string, never>;
  'no-hazen-williams-c': Record<string, never>;
  'no-roughness': Record<string, never>;
  'too-few-points': { count: number };
  'flow-not-increasing': { flow: number; previousFlow: number };
  'head-rises': { head: number; previousHead: number };
  'zero-head-not-last': Record<string, never>;
  /** Points left from the peak of a drooping curve on, fewer than three. */
  'droop-too-few-points': { count: number };
  /** The peak efficiency (fraction) is 1 % or less: a fraction typed under a percent unit. */
  'efficiency-looks-like-fraction': { peak: number };
  /** The peak efficiency (fraction) is below the least plausible one (fraction). */
  'efficiency-implausibly-low': { peak: number; least: number };
  'not-on-every-point': { what: 'power' | 'efficiency'; given: number; count: number };
  'no-falling-fit': Record<string, never>;
  'power-not-positive': Record<string, never>;
  'power-below-water-power': { power: number; waterPower: number };
  'npsh-too-few-points': { count: number };
  'flow-outside-curve': { flow: number; flowMin: number; flowMax: number };
  'branch-without-name': Record<string, never>;
  'branch-name-repeated': { name: string };
  'static-head-with-branches': Record<string, never>;
  'unknown-branch': { value: string; accepted: string[] };
  /** valveK 0: the branch already takes more with no valve; else not reached with that K on the others. */
  'branch-target-unreachable': { branch: string; valveK: number };
  'no-operating-point-with-valve': { valveK: number };
  'suction-after-discharge': { segment: number };
  'suction-needs-site': { what: 'siteElevation' | 'pumpElevation' };
  'pump-elevation-without-suction': Record<string, never>;
  /** A phase count other than 1 or 3 (two-phase supplies are not sized). */
  'unknown-phases': { value: number };
  'unknown-conductor': { value: string; accepted: string[] };
  /** Even the largest conductor of the series drops more than the limit (percent) on the run. */
  'no-conductor-meets-limit': {
    series: 'awg' | 'metric';
    maxDropPercent: number;
    largest: string;
    largestDropPercent: number;
  };
}

export type EngineInputErrorCode = keyof EngineInputErrorParams;

/** Why the engine refused its input; `pointer` names the input (e.g. `/points/2/head`). */
export type EngineInputError = {
  [Code in EngineInputErrorCode]: { code: Code; params: EngineInputErrorParams[Code]; pointer: string };
}[EngineInputErrorCode];
