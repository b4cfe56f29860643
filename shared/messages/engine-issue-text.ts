import type {
  EngineInputError,
  EngineInputErrorCode,
  EngineInputErrorParams,
  EngineIssue,
  EngineIssueCode,
  EngineIssueParams,
  HazenWilliamsRangeReason,
} from '../hydraulics/engine-issues';

/** How a reader wants SI values written: each gives the number with its unit, e.g. `150 gpm`. */
export interface IssueValueText {
  /** A flow given in m3/s. */
  flow(flow: number): string;
  /** A velocity given in m/s. */
  velocity(velocity: number): string;
  /** A head given in m. */
  head(head: number): string;
  /** A power given in W. */
  power(power: number): string;
}

/** SI values written plainly: flows to three significant figures, velocities to 0.01 m/s. */
export const SI_VALUE_TEXT: IssueValueText = {
  flow: (flow) => `${Number(flow.toPrecision(3))} m3/s`,
  velocity: (velocity) => `${velocity.toFixed(2)} m/s`,
  head: (head) => `${head.toFixed(2)} m`,
  power: (power) => `${power.toFixed(1)} W`,
};

/** Each reason Hazen-Williams is outside its range, as a phrase. */
const HAZEN_WILLIAMS_REASON_TEXT: Readonly<Record<HazenWilliamsRangeReason, string>> = {
  'small-bore': 'bore under 50 mm',
  'low-reynolds': 'flow not fully turbulent',
  temperature: 'water outside 4-25 C',
};

/** The one sentence of every engine issue, from its numbers and the reader's units. */
const ENGINE_ISSUE_TEXT: {
  [Code in EngineIssueCode]: (params: EngineIssueParams[Code], units: IssueValueText) => string;
} = {
  'hazen-williams-temperature': ({ temperature }) =>
    `Hazen-Williams is fitted to water at about 4-25 C; at ${temperature} C prefer Darcy-Weisbach`,
  'segment-velocity': ({ segment, flow, velocity, limit }, units) =>
    `at ${units.flow(flow)} segment ${segment}: velocity ${units.velocity(velocity)} exceeds ${units.velocity(limit)}, the common-practice limit for plastic pipe`,
  'transitional-flow': ({ segment, flow, reynolds }, units) =>
    `at ${units.flow(flow)} segment ${segment}: Reynolds number ${Math.round(reynolds)} is in the transition band 2300-4000, where flow is unsteady; friction is taken at its turbulent value, the higher one`,
  'hazen-williams-out-of-range': (
    { segment, flow, reynolds, reasons, hazenWilliamsHead, darcyWeisbachHead, smoothPipe },
    units,
  ) =>
    `at ${units.flow(flow)} segment ${segment}: Hazen-Williams is outside its range (${reasons
      .map((reason) => HAZEN_WILLIAMS_REASON_TEXT[reason])
      .join(
        ', ',
      )}; Reynolds number ${Math.round(reynolds)}); friction ${units.head(hazenWilliamsHead)}, Darcy-Weisbach gives ${units.head(darcyWeisbachHead)}${smoothPipe ? ' for a smooth pipe' : ''}`,
  'head-fit-constrained': ({ leastSquaresDegree, degree, heldFlatAt }) =>
    `the ${degreeName(leastSquaresDegree)} least-squares fit would rise within the data range; head is fitted as a ${degreeName(degree)}${heldFlatAt ? ` held flat at the ${heldFlatAt} point` : ''} so that it does not rise`,
  'points-reversed': () => 'the points were given from the largest flow down; they are used in increasing flow order',
  'drooping-curve': ({ peakFlow, peakHead }, units) =>
    `head rises to ${units.head(peakHead)} at ${units.flow(peakFlow)} before it falls (a drooping curve): only the curve from that peak on is used`,
  'curve-estimated-from-two-points': () =>
    'estimated curve: only shut-off and open flow are published, so head between them follows H = H0 (1 - (Q/Qmax)^2), an assumed shape; no efficiency or BEP',
  'shut-off-extrapolated': () => 'shut-off head is extrapolated: the first point is not at zero flow',
  'affinity-scaled': ({ speedRatio }) => `scaled to ${(100 * speedRatio).toFixed(1)} % speed by the affinity laws`,
  'low-speed': ({ speedRatio, cautionRatio }) =>
    `at ${(100 * speedRatio).toFixed(1)} % speed, below ${(100 * cautionRatio).toFixed(0)} %: the efficiency the affinity laws hold may fall, a fan-cooled motor may run hot and the flow may be under the pump's minimum; check with its maker`,
  'shut-off-below-static-head': ({ shutOffHead, staticHead }, units) =>
    `shut-off head ${units.head(shutOffHead)} is below the system's static head ${units.head(staticHead)}`,
  'crosses-before-curve': () => 'the curves would cross before the first published point of the pump curve',
  'crosses-beyond-curve': () => 'the curves would cross past the last published point of the pump curve (run-out)',
  'highest-shut-off-below-static-head': ({ shutOffHead, staticHead }, units) =>
    `the highest shut-off head ${units.head(shutOffHead)} does not exceed the static head ${units.head(staticHead)}`,
  'arrangement-run-out': () => 'at least one pump would run past the last published point of its curve (run-out)',
  'duty-before-curve': () => 'the duty point maps onto the curve left of its first point',
  'duty-beyond-curve': () => 'the duty point maps onto the curve past its last point',
  'branch-no-flow': ({ name, outletHead, junctionHead }, units) =>
    `branch "${name}" takes no flow: its outlet head ${units.head(outletHead)} is above the head at the split ${units.head(junctionHead)}`,
};

/** Two decimals at most, for percentages in sentences. */
function round(value: number): number {
  return Math.round(value * 100) / 100;
}

function degreeName(degree: 2 | 3): string {
  return degree === 3 ? 'cubic' : 'quadratic';
}

/** The sentence a reader sees for one engine issue, with values written by `units`. */
export function engineIssueText(issue: EngineIssue, units: IssueValueText = SI_VALUE_TEXT): string {
  const text = ENGINE_ISSUE_TEXT[issue.code] as (params: EngineIssue['params'], units: IssueValueText) => string;
  return text(issue.params, units);
}

/** The one sentence of every reason the engine refuses its input. */
const ENGINE_INPUT_ERROR_TEXT: {
  [Code in EngineInputErrorCode]: (params: EngineInputErrorParams[Code], units: IssueValueText) => string;
} = {
  'not-finite': ({ what, value }) => `${what} must be a finite number, got ${String(value)}`,
  'not-positive': ({ what, value }) => `${what} must be greater than zero, got ${value}`,
  negative: ({ what, value }) => `${what} must not be negative, got ${value}`,
  'out-of-range': ({ what, value, min, max }) => `${what} must be between ${min} and ${max}, got ${value}`,
  'not-whole-number': ({ what, value, min }) => `${what} must be a whole number of at least ${min}, got ${value}`,
  'trim-only': ({ ratio }) => `an impeller can only be trimmed (ratio <= 1), got ${ratio}`,
  'unknown-fitting-kind': ({ value, accepted }) =>
    `unknown fitting kind '${value}'; valid kinds: ${accepted.join(', ')}`,
  'no-diameter-ratio': ({ kind }) =>
    `a ${kind} needs its diameterRatio, this segment's bore over the larger bore (between 0 and 1)`,
  'unknown-friction-method': ({ value, accepted }) =>
    `unknown friction method '${value}'; valid methods: ${accepted.join(', ')}`,
  'unknown-material': ({ value, accepted }) => `unknown material '${value}'; valid materials: ${accepted.join(', ')}`,
  'unknown-unit': ({ quantity, value, accepted }) =>
    `unknown ${quantity} unit '${value}'; accepted units: ${accepted.join(', ')}`,
  'unknown-pipe-size': ({ value, series }) =>
    `unknown pipe size id '${value}'; ids are '<series>-<nominal inches>' such as 'pvc-sch40-1.5' or '<series>-<outside mm>' such as 'pe100-sdr11-63', series: ${series.join(', ')}; PIPE_SIZES lists every id`,
  'band-reversed': () => 'preferred band maximum must exceed its minimum',
  'allowable-region-reversed': () => 'allowable region maximum flow must exceed its minimum',
  'running-exceeds-installed': ({ running, installed }) =>
    `running pumps (${running}) cannot exceed installed pumps (${installed})`,
  'no-pumps': () => 'at least one pump is needed',
  'parallel-needs-shut-off': () =>
    'parallel operation of unequal pumps needs curves that start at zero flow (shut-off)',
  'no-segments': () => 'a system needs at least one pipe segment',
  'pipe-size-and-diameter': () => 'give either pipeSizeId or insideDiameter, not both',
  'no-diameter': () => 'a segment needs pipeSizeId or insideDiameter',
  'no-hazen-williams-c': () => 'give hazenWilliamsC, a material or a pipeSizeId',
  'no-roughness': () => 'give roughness, a material or a pipeSizeId',
  'too-few-points': ({ count }) =>
    `a pump curve needs at least three points, or exactly two: shut-off (zero flow) and open flow (zero head); got ${count}`,
  'flow-not-increasing': ({ flow, previousFlow }, units) =>
    `flows must be strictly increasing: ${units.flow(flow)} follows ${units.flow(previousFlow)}`,
  'head-rises': ({ head, previousHead }, units) =>
    `head rises from ${units.head(previousHead)} to ${units.head(head)}; Riffle accepts only curves whose head does not rise with flow`,
  'zero-head-not-last': () => 'only the last point (the open-flow point) may have zero head',
  'droop-too-few-points': ({ count }) =>
    `the curve is used from its highest head on, and only ${count} point(s) lie there; at least three are needed`,
  'efficiency-looks-like-fraction': ({ peak }) =>
    `efficiency looks like a fraction: the highest is ${round(peak * 100)} %; did you mean ${round(peak * 10000)} %?`,
  'efficiency-implausibly-low': ({ peak, least }) =>
    `the highest efficiency is ${round(peak * 100)} %, below the least plausible ${round(least * 100)} %; check the efficiency values`,
  'not-on-every-point': ({ what, given, count }) =>
    `${what} must be given on every point or on none (given on ${given} of ${count})`,
  'npsh-too-few-points': ({ count }) => `NPSH required needs at least three points when given, got ${count}`,
  'no-falling-fit': () =>
    'no quadratic or cubic through these points keeps head from rising with flow; add points near shut-off or check the data',
  'power-not-positive': () => 'power must be greater than zero',
  'power-below-water-power': ({ power, waterPower }, units) =>
    `power ${units.power(power)} is less than the water power ${units.power(waterPower)} at this point`,
  'flow-outside-curve': ({ flow, flowMin, flowMax }, units) =>
    `flow ${units.flow(flow)} is outside the curve's published range ${units.flow(flowMin)} to ${units.flow(flowMax)}`,
  'branch-without-name': () => 'a branch needs a name',
  'branch-name-repeated': ({ name }) => `two branches are named '${name}'`,
  'static-head-with-branches': () => 'a branched system states a static head per branch, not for the system',
  'unknown-branch': ({ value, accepted }) => `no branch is named '${value}'; the branches are ${accepted.join(', ')}`,
  'branch-target-unreachable': ({ branch, valveK }) =>
    valveK === 0
      ? `branch '${branch}' already takes more than that with no valve; throttle it instead`
      : `branch '${branch}' does not reach that even with a valve K of ${valveK} on the other branches`,
  'no-operating-point-with-valve': ({ valveK }) =>
    `with a valve K of ${valveK} on the other branches the pump meets the system nowhere on its published curve`,
  'suction-after-discharge': ({ segment }) =>
    `segment ${segment} is on the suction side after a discharge segment; suction segments come first, from the intake to the pump`,
  'suction-needs-site': ({ what }) =>
    what === 'siteElevation'
      ? 'a system with a suction side needs the site elevation (for the atmospheric pressure on the intake)'
      : 'a system with a suction side needs the pump elevation above the intake water surface (negative when flooded)',
  'pump-elevation-without-suction': () =>
    'a pump elevation needs suction segments (side: suction); a submersible pump needs neither',
  'unknown-phases': ({ value }) => `phases must be 1 (single phase) or 3 (three phase), got ${value}`,
  'unknown-conductor': ({ value, accepted }) =>
    `unknown conductor '${value}'; conductors are 'awg-<size>' or 'mm2-<area>': ${accepted.join(', ')}`,
  'no-conductor-meets-limit': ({ series, maxDropPercent, largest, largestDropPercent }) =>
    `no ${series === 'awg' ? 'AWG' : 'metric'} conductor keeps the voltage drop at or under ${round(maxDropPercent)} %: even ${largest} drops ${round(largestDropPercent)} %; shorten the run, raise the supply voltage or split the load`,
};

/** The sentence for one refused input, with values written by `units`. */
export function engineInputErrorText(error: EngineInputError, units: IssueValueText = SI_VALUE_TEXT): string {
  const text = ENGINE_INPUT_ERROR_TEXT[error.code] as (
    params: EngineInputError['params'],
    units: IssueValueText,
  ) => string;
  return text(error.params, units);
}
