import { expect } from 'chai';
import {
  fitPumpCurve,
  fitPumpCurveWithIssues,
  HydraulicsInputError,
  pumpCurvePointErrors,
  pumpCurveAtSpeed,
  solveOperatingPoint,
  compileSystemCurve,
  type EngineInputErrorCode,
  type EngineInputErrorParams,
  type EngineIssueCode,
  type EngineIssueParams,
} from '../../shared/hydraulics';
import { engineInputErrorText, engineIssueText, type IssueValueText } from '../../shared/messages/engine-issue-text';

/*
 * Each engine refusal and each engine issue as a code with SI values, and the sentence the one
 * table makes of it. The samples are typed by code, so a code without a sample does not compile.
 */

const inputSamples: { [Code in EngineInputErrorCode]: [EngineInputErrorParams[Code], string] } = {
  'not-finite': [{ what: 'head', value: Number.NaN }, 'head must be a finite number, got NaN'],
  'not-positive': [{ what: 'inside diameter', value: 0 }, 'inside diameter must be greater than zero, got 0'],
  negative: [{ what: 'length', value: -1 }, 'length must not be negative, got -1'],
  'out-of-range': [
    { what: 'altitude (m)', value: 12000, min: -500, max: 11000 },
    'altitude (m) must be between -500 and 11000, got 12000',
  ],
  'not-whole-number': [
    { what: 'running pumps', value: 1.5, min: 1 },
    'running pumps must be a whole number of at least 1, got 1.5',
  ],
  'trim-only': [{ ratio: 1.1 }, 'an impeller can only be trimmed (ratio <= 1), got 1.1'],
  'unknown-fitting-kind': [
    { value: 'x', accepted: ['elbow', 'tee'] },
    "unknown fitting kind 'x'; valid kinds: elbow, tee",
  ],
  'no-diameter-ratio': [
    { kind: 'reducer' },
    "a reducer needs its diameterRatio, this segment's bore over the larger bore (between 0 and 1)",
  ],
  'unknown-friction-method': [
    { value: 'x', accepted: ['darcy-weisbach'] },
    "unknown friction method 'x'; valid methods: darcy-weisbach",
  ],
  'unknown-material': [{ value: 'x', accepted: ['pvc'] }, "unknown material 'x'; valid materials: pvc"],
  'unknown-unit': [{ quantity: 'flow', value: 'x', accepted: ['gpm'] }, "unknown flow unit 'x'; accepted units: gpm"],
  'unknown-pipe-size': [
    { value: 'x', series: ['pvc-sch40'] },
    "unknown pipe size id 'x'; ids are '<series>-<nominal inches>' such as 'pvc-sch40-1.5' or '<series>-<outside mm>' such as 'pe100-sdr11-63', series: pvc-sch40; PIPE_SIZES lists every id",
  ],
  'band-reversed': [{}, 'preferred band maximum must exceed its minimum'],
  'allowable-region-reversed': [{}, 'allowable region maximum flow must exceed its minimum'],
  'running-exceeds-installed': [{ running: 3, installed: 2 }, 'running pumps (3) cannot exceed installed pumps (2)'],
  'no-pumps': [{}, 'at least one pump is needed'],
  'parallel-needs-shut-off': [
    {},
    'parallel operation of unequal pumps needs curves that start at zero flow (shut-off)',
  ],
  'no-segments': [{}, 'a system needs at least one pipe segment'],
  'pipe-size-and-diameter': [{}, 'give either pipeSizeId or insideDiameter, not both'],
  'no-diameter': [{}, 'a segment needs pipeSizeId or insideDiameter'],
  'no-hazen-williams-c': [{}, 'give hazenWilliamsC, a material or a pipeSizeId'],
  'no-roughness': [{}, 'give roughness, a material or a pipeSizeId'],
  'too-few-points': [
    { count: 2 },
    'a pump curve needs at least three points, or exactly two: shut-off (zero flow) and open flow (zero head); got 2',
  ],
  'zero-head-not-last': [{}, 'only the last point (the open-flow point) may have zero head'],
  'droop-too-few-points': [
    { count: 2 },
    'the curve is used from its highest head on, and only 2 point(s) lie there; at least three are needed',
  ],
  'efficiency-looks-like-fraction': [
    { peak: 0.0058 },
    'efficiency looks like a fraction: the highest is 0.58 %; did you mean 58 %?',
  ],
  'efficiency-implausibly-low': [
    { peak: 0.03, least: 0.05 },
    'the highest efficiency is 3 %, below the least plausible 5 %; check the efficiency values',
  ],
  'flow-not-increasing': [
    { flow: 0.01, previousFlow: 0.02 },
    'flows must be strictly increasing: 0.01 m3/s follows 0.02 m3/s',
  ],
  'head-rises': [
    { head: 12, previousHead: 10 },
    'head rises from 10.00 m to 12.00 m; Riffle accepts only curves whose head does not rise with flow',
  ],
  'not-on-every-point': [
    { what: 'power', given: 2, count: 4 },
    'power must be given on every point or on none (given on 2 of 4)',
  ],
  'npsh-too-few-points': [{ count: 2 }, 'NPSH required needs at least three points when given, got 2'],
  'no-falling-fit': [
    {},
    'no quadratic or cubic through these points keeps head from rising with flow; add points near shut-off or check the data',
  ],
  'power-not-positive': [{}, 'power must be greater than zero'],
  'power-below-water-power': [
    { power: 100, waterPower: 150.25 },
    'power 100.0 W is less than the water power 150.3 W at this point',
  ],
  'flow-outside-curve': [
    { flow: 0.05, flowMin: 0, flowMax: 0.04 },
    "flow 0.05 m3/s is outside the curve's published range 0 m3/s to 0.04 m3/s",
  ],
  'branch-without-name': [{}, 'a branch needs a name'],
  'branch-name-repeated': [{ name: 'falls' }, "two branches are named 'falls'"],
  'static-head-with-branches': [{}, 'a branched system states a static head per branch, not for the system'],
  'unknown-branch': [
    { value: 'lake', accepted: ['falls', 'stream'] },
    "no branch is named 'lake'; the branches are falls, stream",
  ],
  'branch-target-unreachable': [
    { branch: 'falls', valveK: 0 },
    "branch 'falls' already takes more than that with no valve; throttle it instead",
  ],
  'no-operating-point-with-valve': [
    { valveK: 10 },
    'with a valve K of 10 on the other branches the pump meets the system nowhere on its published curve',
  ],
  'suction-after-discharge': [
    { segment: 2 },
    'segment 2 is on the suction side after a discharge segment; suction segments come first, from the intake to the pump',
  ],
  'suction-needs-site': [
    { what: 'siteElevation' },
    'a system with a suction side needs the site elevation (for the atmospheric pressure on the intake)',
  ],
  'pump-elevation-without-suction': [
    {},
    'a pump elevation needs suction segments (side: suction); a submersible pump needs neither',
  ],
  'unknown-phases': [{ value: 2 }, 'phases must be 1 (single phase) or 3 (three phase), got 2'],
  'unknown-conductor': [
    { value: 'awg-13', accepted: ['awg-12', 'mm2-2.5'] },
    "unknown conductor 'awg-13'; conductors are 'awg-<size>' or 'mm2-<area>': awg-12, mm2-2.5",
  ],
  'no-conductor-meets-limit': [
    { series: 'awg', maxDropPercent: 3, largest: '4/0 AWG', largestDropPercent: 4.123 },
    'no AWG conductor keeps the voltage drop at or under 3 %: even 4/0 AWG drops 4.12 %; shorten the run, raise the supply voltage or split the load',
  ],
};

const issueSamples: { [Code in EngineIssueCode]: [EngineIssueParams[Code], string] } = {
  'hazen-williams-temperature': [
    { temperature: 2 },
    'Hazen-Williams is fitted to water at about 4-25 C; at 2 C prefer Darcy-Weisbach',
  ],
  'segment-velocity': [
    { segment: 0, flow: 0.001, velocity: 3.183, limit: 1.524 },
    'at 0.001 m3/s segment 0: velocity 3.18 m/s exceeds 1.52 m/s, the common-practice limit for plastic pipe',
  ],
  'transitional-flow': [
    { segment: 1, flow: 0.0001, reynolds: 3123.4 },
    'at 0.0001 m3/s segment 1: Reynolds number 3123 is in the transition band 2300-4000, where flow is unsteady; friction is taken at its turbulent value, the higher one',
  ],
  'hazen-williams-out-of-range': [
    {
      segment: 0,
      flow: 0.0005,
      reynolds: 25000,
      reasons: ['small-bore', 'temperature'],
      hazenWilliamsHead: 1.234,
      darcyWeisbachHead: 1.5,
      smoothPipe: true,
    },
    'at 0.0005 m3/s segment 0: Hazen-Williams is outside its range (bore under 50 mm, water outside 4-25 C; Reynolds number 25000); friction 1.23 m, Darcy-Weisbach gives 1.50 m for a smooth pipe',
  ],
  'head-fit-constrained': [
    { leastSquaresDegree: 3, degree: 3, heldFlatAt: 'first' },
    'the cubic least-squares fit would rise within the data range; head is fitted as a cubic held flat at the first point so that it does not rise',
  ],
  'points-reversed': [{}, 'the points were given from the largest flow down; they are used in increasing flow order'],
  'drooping-curve': [
    { peakFlow: 0.002, peakHead: 10.5 },
    'head rises to 10.50 m at 0.002 m3/s before it falls (a drooping curve): only the curve from that peak on is used',
  ],
  'curve-estimated-from-two-points': [
    {},
    'estimated curve: only shut-off and open flow are published, so head between them follows H = H0 (1 - (Q/Qmax)^2), an assumed shape; no efficiency or BEP',
  ],
  'shut-off-extrapolated': [{ flowMin: 0.001 }, 'shut-off head is extrapolated: the first point is not at zero flow'],
  'affinity-scaled': [{ speedRatio: 0.8 }, 'scaled to 80.0 % speed by the affinity laws'],
  'low-speed': [
    { speedRatio: 0.5, cautionRatio: 0.6 },
    "at 50.0 % speed, below 60 %: the efficiency the affinity laws hold may fall, a fan-cooled motor may run hot and the flow may be under the pump's minimum; check with its maker",
  ],
  'shut-off-below-static-head': [
    { shutOffHead: 8, staticHead: 10 },
    "shut-off head 8.00 m is below the system's static head 10.00 m",
  ],
  'crosses-before-curve': [{}, 'the curves would cross before the first published point of the pump curve'],
  'crosses-beyond-curve': [{}, 'the curves would cross past the last published point of the pump curve (run-out)'],
  'highest-shut-off-below-static-head': [
    { shutOffHead: 8, staticHead: 10 },
    'the highest shut-off head 8.00 m does not exceed the static head 10.00 m',
  ],
  'arrangement-run-out': [{}, 'at least one pump would run past the last published point of its curve (run-out)'],
  'duty-before-curve': [{}, 'the duty point maps onto the curve left of its first point'],
  'duty-beyond-curve': [{}, 'the duty point maps onto the curve past its last point'],
  'branch-no-flow': [
    { branch: 1, name: 'return', outletHead: 4, junctionHead: 3.5 },
    'branch "return" takes no flow: its outlet head 4.00 m is above the head at the split 3.50 m',
  ],
};

describe('engine refusals and issues as codes', () => {
  for (const [code, [params, sentence]] of Object.entries(inputSamples)) {
    it(`refusal ${code}: its sentence from the one table`, () => {
      const error = { code, params, pointer: '/x' } as Parameters<typeof engineInputErrorText>[0];
      expect(engineInputErrorText(error)).to.equal(sentence);
      expect(new HydraulicsInputError(error)).to.include({ message: sentence, field: '/x' });
    });
  }

  for (const [code, [params, sentence]] of Object.entries(issueSamples)) {
    it(`issue ${code}: its sentence from the one table`, () => {
      expect(engineIssueText({ code, params } as Parameters<typeof engineIssueText>[0])).to.equal(sentence);
    });
  }

  it('writes refusal values in the units the reader asks for', () => {
    const feet: IssueValueText = {
      flow: (flow) => `${(flow * 15850.3).toFixed(0)} gpm`,
      velocity: (velocity) => `${(velocity / 0.3048).toFixed(1)} ft/s`,
      head: (head) => `${(head / 0.3048).toFixed(1)} ft`,
      power: (power) => `${(power / 745.7).toFixed(2)} hp`,
    };
    const error = {
      code: 'head-rises',
      params: { head: 3.048, previousHead: 1.524 },
      pointer: '/points/1/head',
    } as const;
    expect(engineInputErrorText(error, feet)).to.match(/^head rises from 5\.0 ft to 10\.0 ft;/);
  });

  it('a refused curve carries its code, values and pointer, not only a sentence', () => {
    const points = [
      { flow: 0, head: 10 },
      { flow: 0.01, head: 9 },
      { flow: 0.005, head: 8 },
    ];
    expect(() => fitPumpCurve(points))
      .to.throw(HydraulicsInputError)
      .with.property('issue')
      .that.deep.equals({
        code: 'flow-not-increasing',
        params: { flow: 0.005, previousFlow: 0.01 },
        pointer: '/points/2/flow',
      });
  });

  it('the point rules list every breach, in the order the fit refuses them', () => {
    const points = [
      { flow: 0, head: 10, power: 500 },
      { flow: 0, head: 11 },
      { flow: 0.02, head: 9, npshRequired: 2 },
    ];
    expect(pumpCurvePointErrors(points).map((error) => [error.code, error.pointer])).to.deep.equal([
      ['flow-not-increasing', '/points/1/flow'],
      ['droop-too-few-points', '/points/1/head'],
      ['not-on-every-point', '/points/1/power'],
      ['npsh-too-few-points', '/points/2/npshRequired'],
    ]);
    expect(() => fitPumpCurve(points))
      .to.throw(HydraulicsInputError)
      .with.nested.property('issue.code', 'flow-not-increasing');
  });

  it("gives the fit's warnings as issues, and the stored warnings as their sentences", () => {
    const { fit, issues } = fitPumpCurveWithIssues([
      { flow: 0.002, head: 10 },
      { flow: 0.01, head: 9 },
      { flow: 0.02, head: 6 },
    ]);
    expect(issues).to.deep.include({ code: 'shut-off-extrapolated', params: { flowMin: 0.002 } });
    expect(fit.warnings).to.deep.equal(issues.map((issue) => engineIssueText(issue)));
    const scaled = pumpCurveAtSpeed(fit, 0.9);
    expect(scaled.warnings.at(-1)).to.equal('scaled to 90.0 % speed by the affinity laws');
  });

  it('says why there is no operating point as an issue with SI values', () => {
    const fit = fitPumpCurve([
      { flow: 0, head: 10 },
      { flow: 0.01, head: 9 },
      { flow: 0.02, head: 6 },
    ]);
    const system = compileSystemCurve({
      staticHead: 12,
      frictionMethod: 'darcy-weisbach',
      segments: [{ length: 10, insideDiameter: 0.1, roughness: 1.5e-6 }],
    });
    const point = solveOperatingPoint(fit, system);
    expect(point.ok).to.equal(false);
    if (point.ok) return;
    expect(point.issue.code).to.equal('shut-off-below-static-head');
    expect(engineIssueText(point.issue)).to.equal("shut-off head 10.00 m is below the system's static head 12.00 m");
  });
});
