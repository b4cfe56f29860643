import { expect } from 'chai';
import fc from 'fast-check';
import { spawnSync } from 'node:child_process';
import {
  STANDARD_GRAVITY,
  balancingValveK,
  branchDutyBand,
  branchFlowsAt,
  compileBranchedSystem,
  compileSystemCurve,
  fitPumpCurve,
  headLossHazenWilliams,
  HydraulicsInputError,
  polynomialValue,
  solveOperatingPoint,
  solveParallelIdentical,
  waterKinematicViscosity,
  type BranchInput,
  type BranchedSystemInput,
  type CompiledBranchedSystem,
  type HeadCurve,
  type PipeSegmentInput,
} from '../../shared/hydraulics';

const area = (bore: number) => (Math.PI * bore * bore) / 4;
const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

function splitOf(system: CompiledBranchedSystem, totalFlow: number): { head: number; flows: number[] } {
  const flows = new Float64Array(system.branches.length);
  const head = system.splitAt(totalFlow, flows);
  return { head, flows: [...flows] };
}

/** A pump curve H = shutOff (1 - (Q/runOut)^2) fitted from 9 points and stored as JSON, as the catalogue keeps it. */
function storedPump(shutOff: number, runOut: number): HeadCurve {
  const points = Array.from({ length: 9 }, (_, i) => {
    const flow = (i / 8) * runOut * 0.95;
    return { flow, head: shutOff * (1 - (flow / runOut) ** 2) };
  });
  return JSON.parse(JSON.stringify(fitPumpCurve(points))) as HeadCurve;
}

/*
 * An independent solve in python3-fluids (Debian; apt-get install -y python3-fluids): Colebrook
 * friction factors from fluids.friction.Colebrook, each branch flow and the split head by
 * scipy's brentq, the operating point of the pump H = h0 - a Q^2 likewise. Outlets, pipes and K
 * are the test's; the water's kinematic viscosity is passed in from the engine.
 */
const FLUIDS_SPLIT = `
import json, math, sys
import fluids
from fluids.friction import Colebrook
from scipy.optimize import brentq
g = 9.80665
r = json.load(sys.stdin)
nu = r["nu"]
def loss(segments, q):
    total = 0.0
    for L, D, eps, K in segments:
        V = q / (math.pi * D * D / 4)
        f = Colebrook(V * D / nu, eps / D) if q > 0 else 0.0
        total += (f * L / D + K) * V * V / (2 * g)
    return total
def needed(b, q): return b["z"] + loss(b["segments"], q)
def branch_flow(b, H):
    if H <= b["z"]: return 0.0
    hi = 1e-3
    while needed(b, hi) < H: hi *= 2
    return brentq(lambda q: needed(b, q) - H, 0.0, hi, xtol=1e-16, rtol=1e-15)
bs = r["branches"]
def split(Q):
    lo = min(b["z"] for b in bs)
    hi = min(needed(b, Q) for b in bs) + 1e-9
    H = brentq(lambda H: sum(branch_flow(b, H) for b in bs) - Q, lo, hi, xtol=1e-14, rtol=1e-15)
    return {"head": H, "flows": [branch_flow(b, H) for b in bs]}
h0, a = r["pump"]
op = brentq(lambda Q: h0 - a * Q * Q - loss(r["common"], Q) - split(Q)["head"], 1e-4, math.sqrt(h0 / a), xtol=1e-15, rtol=1e-15)
json.dump({"fluidsVersion": fluids.__version__, "splits": [split(Q) for Q in r["flows"]], "operatingFlow": op}, sys.stdout)
`;

interface FluidsSplitAnswer {
  fluidsVersion: string;
  splits: { head: number; flows: number[] }[];
  operatingFlow: number;
}

function fluidsSplit(request: object): FluidsSplitAnswer {
  const run = spawnSync('/usr/bin/python3', ['-c', FLUIDS_SPLIT], { input: JSON.stringify(request), encoding: 'utf8' });
  if (run.error || run.status !== 0) {
    throw new Error(
      `python3-fluids reference failed (apt-get install -y python3-fluids): ${run.error?.message ?? run.stderr}`,
    );
  }
  return JSON.parse(run.stdout) as FluidsSplitAnswer;
}

describe('branched system', () => {
  describe('closed forms', () => {
    it('two identical branches split the flow equally; TDH = common run at Q + one branch at Q/2 (both friction methods)', () => {
      for (const frictionMethod of ['hazen-williams', 'darcy-weisbach'] as const) {
        const branchPipe: PipeSegmentInput[] = [
          { length: 35, pipeSizeId: 'pvc-sch40-1.5', fittings: [{ kind: 'elbow-90-standard', count: 3 }] },
        ];
        const commonPipe: PipeSegmentInput[] = [{ length: 12, pipeSizeId: 'pvc-sch40-2' }];
        const system = compileBranchedSystem({
          frictionMethod,
          temperature: 15,
          segments: commonPipe,
          branches: [
            { name: 'east', staticHead: 2.5, outletPressureHead: 0.5, segments: branchPipe },
            { name: 'west', staticHead: 2.5, outletPressureHead: 0.5, segments: branchPipe },
          ],
        });
        const common = compileSystemCurve({ staticHead: 0, frictionMethod, temperature: 15, segments: commonPipe });
        const one = compileSystemCurve({
          staticHead: 2.5,
          outletPressureHead: 0.5,
          frictionMethod,
          temperature: 15,
          segments: branchPipe,
        });
        for (const flow of [1e-4, 1e-3, 4e-3, 1.2e-2]) {
          const { head, flows } = splitOf(system, flow);
          expect(relative(flows[0], flow / 2), `${frictionMethod} ${flow}`).to.be.below(1e-10);
          expect(relative(flows[1], flow / 2)).to.be.below(1e-10);
          expect(relative(head, one.evaluate(flow / 2))).to.be.below(1e-12);
          expect(relative(system.evaluate(flow), common.evaluate(flow) + one.evaluate(flow / 2))).to.be.below(1e-12);
        }
      }
    });

    it('branches that are a fixed K alone take q = A sqrt(2 g (H_j - z) / K) at outlets on three levels', () => {
      // Negligible pipe (1e-9 m) with all resistance in extraK: h = K V^2 / 2g exactly (definition of K).
      const bore = 0.04;
      const levels = [1, 2.5, 4];
      const ks = [8, 3, 20];
      const system = compileBranchedSystem({
        frictionMethod: 'darcy-weisbach',
        segments: [],
        branches: levels.map((staticHead, i) => ({
          name: `outlet ${i}`,
          staticHead,
          segments: [{ length: 1e-9, insideDiameter: bore, roughness: 0, extraK: ks[i] }],
        })),
      });
      const closedForm = (head: number) =>
        levels.map((z, i) => (head > z ? area(bore) * Math.sqrt((2 * STANDARD_GRAVITY * (head - z)) / ks[i]) : 0));
      for (const junctionHead of [1.7, 3.1, 4.6, 9]) {
        const expected = closedForm(junctionHead);
        const total = expected.reduce((sum, flow) => sum + flow, 0);
        const { head, flows } = splitOf(system, total);
        expect(head, `H_j ${junctionHead}`).to.be.closeTo(junctionHead, 1e-9);
        flows.forEach((flow, i) => expect(flow).to.be.closeTo(expected[i], 1e-10 * total));
      }
    });
  });

  describe('against a brute-force solve written here (Hazen-Williams, three branches, common run)', () => {
    const bores = [0.0409, 0.0351, 0.0266];
    const lengths = [25, 40, 10];
    const ks = [3, 4, 1];
    const outletHeads = [3, 0.8, 3.2];
    const input: BranchedSystemInput = {
      frictionMethod: 'hazen-williams',
      segments: [{ length: 15, insideDiameter: 0.0525, hazenWilliamsC: 150, extraK: 2.5 }],
      branches: ['falls', 'stream', 'fountain'].map((name, i) => ({
        name,
        staticHead: i === 2 ? 1.2 : outletHeads[i],
        outletPressureHead: i === 2 ? 2 : undefined,
        segments: [{ length: lengths[i], insideDiameter: bores[i], hazenWilliamsC: 150, extraK: ks[i] }],
      })),
    };
    // Head branch i needs at flow q, from the formulas themselves (friction.ts and K V^2/2g).
    const needed = (i: number, q: number) =>
      outletHeads[i] +
      headLossHazenWilliams(lengths[i], q, bores[i], 150) +
      (ks[i] * (q / area(bores[i])) ** 2) / (2 * STANDARD_GRAVITY);
    const bisect = (fn: (x: number) => number, low: number, high: number) => {
      for (let step = 0; step < 200; step += 1) {
        const middle = 0.5 * (low + high);
        if (fn(middle) > 0) high = middle;
        else low = middle;
      }
      return 0.5 * (low + high);
    };
    const branchFlow = (i: number, head: number) =>
      head <= outletHeads[i] ? 0 : bisect((q) => needed(i, q) - head, 0, 1);
    const totalAt = (head: number) => [0, 1, 2].reduce((sum, i) => sum + branchFlow(i, head), 0);
    /** Dense scan of H_j over 0-60 m in 6000 steps for the step where the total crosses Q, then bisection in it. */
    const bruteForceHead = (flow: number) => {
      for (let step = 0; step < 6000; step += 1) {
        const low = step * 0.01;
        if (totalAt(low + 0.01) >= flow) return bisect((head) => totalAt(head) - flow, low, low + 0.01);
      }
      throw new Error('no crossing below 60 m');
    };

    for (const flow of [0.5e-3, 2e-3, 4e-3, 7e-3]) {
      it(`Q = ${flow * 1000} L/s: the same split head and branch flows`, () => {
        const system = compileBranchedSystem(input);
        const head = bruteForceHead(flow);
        const split = splitOf(system, flow);
        expect(split.head).to.be.closeTo(head, 1e-9);
        split.flows.forEach((q, i) => expect(q).to.be.closeTo(branchFlow(i, head), 1e-9 * flow));
        const commonLoss =
          headLossHazenWilliams(15, flow, 0.0525, 150) + (2.5 * (flow / area(0.0525)) ** 2) / (2 * STANDARD_GRAVITY);
        expect(system.evaluate(flow)).to.be.closeTo(commonLoss + head, 1e-9);
      });
    }
  });

  describe('against python3-fluids (Darcy-Weisbach with Colebrook, solved independently there)', () => {
    // [length m, bore m, roughness m, K]; outlet heads in m.
    const common: [number, number, number, number][] = [[15, 0.0525, 1.5e-6, 2.5]];
    const branchPipes: [number, number, number, number][][] = [
      [[25, 0.0409, 1.5e-6, 3]],
      [
        [40, 0.0351, 4.5e-5, 4],
        [5, 0.0266, 1.5e-6, 1],
      ],
      [[10, 0.0266, 1.5e-6, 1]],
    ];
    const levels = [3, 0.8, 1.2];
    const pressures = [0, 0, 2];
    const segmentsOf = (pipes: [number, number, number, number][]): PipeSegmentInput[] =>
      pipes.map(([length, insideDiameter, roughness, extraK]) => ({ length, insideDiameter, roughness, extraK }));
    const system = compileBranchedSystem({
      frictionMethod: 'darcy-weisbach',
      temperature: 15,
      segments: segmentsOf(common),
      branches: ['falls', 'stream', 'fountain'].map((name, i) => ({
        name,
        staticHead: levels[i],
        outletPressureHead: pressures[i],
        segments: segmentsOf(branchPipes[i]),
      })),
    });
    const nu = waterKinematicViscosity(15);
    const flows = [3e-3, 5e-3, 8e-3];
    const pump = { shutOff: 16, runOut: 0.012 };
    const reference = fluidsSplit({
      nu,
      common,
      branches: branchPipes.map((segments, i) => ({ z: levels[i] + pressures[i], segments })),
      flows,
      pump: [pump.shutOff, pump.shutOff / pump.runOut ** 2],
    });

    flows.forEach((flow, k) => {
      it(`Q = ${flow * 1000} L/s: split head and branch flows within 1e-7 (fluids ${reference.fluidsVersion})`, () => {
        const split = branchFlowsAt(system, flow);
        expect(relative(split.junctionHead, reference.splits[k].head)).to.be.below(1e-7);
        split.branches.forEach((branch, i) => {
          expect(branch.flow).to.be.closeTo(reference.splits[k].flows[i], 1e-7 * flow);
          // The reference is Colebrook throughout: every flowing segment must be turbulent (Re >= 4000).
          branch.velocities.forEach((velocity, j) => {
            if (branch.flow > 0) expect((velocity * branchPipes[i][j][1]) / nu).to.be.at.least(4000);
          });
        });
      });
    });

    it('the operating point with a stored pump curve is the one python3-fluids finds, and lies on both curves', () => {
      const fit = storedPump(pump.shutOff, pump.runOut);
      const point = solveOperatingPoint(fit, system);
      if (!point.ok) throw new Error(point.issue.code);
      expect(relative(point.flow, reference.operatingFlow)).to.be.below(1e-7);
      expect(point.head).to.be.closeTo(system.evaluate(point.flow), 1e-9);
      expect(point.head).to.be.closeTo(polynomialValue(fit.headCoefficients, point.flow), 1e-9);
      expect(branchFlowsAt(system, point.flow).totalHead).to.be.closeTo(point.head, 1e-9);
    });

    it('two such pumps in parallel deliver more at a higher head, each half of it', () => {
      const fit = storedPump(pump.shutOff, pump.runOut);
      const one = solveOperatingPoint(fit, system);
      const two = solveParallelIdentical(fit, system, 2, 2);
      if (!one.ok || !two.ok) throw new Error('no operating point');
      expect(two.totalFlow).to.be.above(one.flow);
      expect(two.head).to.be.above(one.head);
      expect(two.head).to.be.closeTo(system.evaluate(two.totalFlow), 1e-9);
      expect(two.pumpFlows[0]).to.equal(two.totalFlow / 2);
    });
  });

  describe('no back-flow', () => {
    const pipe = (length: number) => [{ length, insideDiameter: 0.05, hazenWilliamsC: 140 }];
    const system = compileBranchedSystem({
      frictionMethod: 'hazen-williams',
      segments: pipe(10),
      branches: [
        { name: 'falls', staticHead: 4, segments: pipe(30) },
        { name: 'stream', staticHead: 1, segments: pipe(60) },
      ],
    });
    // The total flow at which the split reaches the falls' outlet: the stream alone at 4 m.
    const onset = system.flowsAtJunctionHead(4, new Float64Array(2));

    it('a branch whose outlet is above the split head takes nothing and says so', () => {
      const split = branchFlowsAt(system, 0.8 * onset);
      expect(split.junctionHead).to.be.below(4);
      expect(split.branches[0].flow).to.equal(0);
      expect(split.branches[1].flow).to.be.closeTo(0.8 * onset, 1e-12);
      expect(split.branches[0].issues).to.deep.equal([
        {
          code: 'branch-no-flow',
          params: { branch: 0, name: 'falls', outletHead: 4, junctionHead: split.junctionHead },
          pointer: '/branches/0',
        },
      ]);
      expect(split.branches[1].issues.map((issue) => issue.code)).to.not.include('branch-no-flow');
    });

    it('the branch starts to flow once the total passes the flow that lifts the split to its outlet', () => {
      const split = branchFlowsAt(system, 1.2 * onset);
      expect(split.junctionHead).to.be.above(4);
      expect(split.branches[0].flow).to.be.above(0);
      expect(split.branches[0].issues.map((issue) => issue.code)).to.not.include('branch-no-flow');
      expect(split.branches[0].flow + split.branches[1].flow).to.be.closeTo(1.2 * onset, 1e-12);
      expect(split.totalHead).to.be.closeTo(system.evaluate(1.2 * onset), 1e-9);
    });

    it('reports velocities per segment and the velocity issue under the branch', () => {
      const split = branchFlowsAt(system, 0.009);
      split.branches.forEach((branch, i) => {
        expect(branch.velocities[0]).to.be.closeTo(branch.flow / area(0.05), 1e-12);
        expect(branch.maxVelocity).to.equal(branch.velocities[0]);
        expect(branch.issues.map((issue) => issue.pointer)).to.deep.equal([`/branches/${i}/segments/0`]);
      });
      expect(split.commonVelocities[0]).to.be.closeTo(0.009 / area(0.05), 1e-12);
      expect(split.issues.map((issue) => issue.pointer)).to.deep.equal(['/segments/0']);
    });
  });

  describe('balancing and duty band', () => {
    const branch = (name: string, staticHead: number, length: number, bore: number): BranchInput => ({
      name,
      staticHead,
      segments: [
        { length: 2, insideDiameter: 0.05, hazenWilliamsC: 150 },
        { length, insideDiameter: bore, hazenWilliamsC: 150, extraK: 1 },
      ],
    });
    const input = (extraK: number[]): BranchedSystemInput => ({
      frictionMethod: 'hazen-williams',
      segments: [{ length: 10, insideDiameter: 0.0525, hazenWilliamsC: 150 }],
      branches: [branch('falls', 3, 30, 0.0409), branch('stream', 1, 20, 0.0351), branch('spray', 1.5, 15, 0.0266)].map(
        (b, i) => ({ ...b, segments: [b.segments[0], { ...b.segments[1], extraK: 1 + extraK[i] }] }),
      ),
    });
    const pump = storedPump(14, 0.012);
    const flowsAtDuty = (system: CompiledBranchedSystem) => {
      const point = solveOperatingPoint(pump, system);
      if (!point.ok) throw new Error(point.issue.code);
      return { total: point.flow, ...splitOf(system, point.flow) };
    };

    it('the K found, put in the other branches as extraK on their last segments, gives the wanted flow', () => {
      const system = compileBranchedSystem(input([0, 0, 0]));
      const unbalanced = flowsAtDuty(system);
      const wanted = 1.5 * unbalanced.flows[0];
      const k = balancingValveK(system, pump, 'falls', { flow: wanted });
      expect(k).to.be.above(0);
      const balanced = flowsAtDuty(compileBranchedSystem(input([0, k, k])));
      expect(balanced.flows[0]).to.be.closeTo(wanted, 1e-9 * wanted);
    });

    it('a wanted share of the total flow, likewise', () => {
      const system = compileBranchedSystem(input([0, 0, 0]));
      const unbalanced = flowsAtDuty(system);
      const share = 1.2 * (unbalanced.flows[1] / unbalanced.total);
      const k = balancingValveK(system, pump, 'stream', { share });
      const balanced = flowsAtDuty(compileBranchedSystem(input([k, 0, k])));
      expect(balanced.flows[1] / balanced.total).to.be.closeTo(share, 1e-9);
    });

    it('a flow the branch already exceeds unthrottled, or an unknown branch, is refused by field', () => {
      const system = compileBranchedSystem(input([0, 0, 0]));
      const unbalanced = flowsAtDuty(system);
      expect(() => balancingValveK(system, pump, 'falls', { flow: 0.5 * unbalanced.flows[0] }))
        .to.throw(HydraulicsInputError)
        .that.satisfies(
          (error: HydraulicsInputError) => error.field === '/flow' && error.issue.code === 'branch-target-unreachable',
        );
      expect(() => balancingValveK(system, pump, 'falls', { share: 1 }))
        .to.throw(HydraulicsInputError)
        .with.property('field', '/share');
      expect(() => balancingValveK(system, pump, 'lake', { flow: 1e-3 }))
        .to.throw(HydraulicsInputError)
        .with.property('field', '/branch');
    });

    it('the duty band of a branch: at its ends the branch takes flowMin and flowMax, outside it does not', () => {
      const system = compileBranchedSystem(input([0, 0, 0]));
      const [flowMin, flowMax] = [1e-3, 2.5e-3];
      const band = branchDutyBand(system, 'spray', flowMin, flowMax);
      const sprayAt = (total: number) => splitOf(system, total).flows[2];
      expect(sprayAt(band.totalFlowMin)).to.be.closeTo(flowMin, 1e-9 * flowMin);
      expect(sprayAt(band.totalFlowMax)).to.be.closeTo(flowMax, 1e-9 * flowMax);
      expect(sprayAt(band.totalFlowMin * 0.99)).to.be.below(flowMin);
      expect(sprayAt(band.totalFlowMax * 1.01)).to.be.above(flowMax);
      expect(branchDutyBand(system, 'spray', 0, flowMax).totalFlowMin).to.equal(0);
      expect(() => branchDutyBand(system, 'spray', flowMax, flowMin))
        .to.throw(HydraulicsInputError)
        .with.property('field', '/flowMin');
    });
  });

  describe('bad input throws HydraulicsInputError naming the field', () => {
    const pipe: PipeSegmentInput[] = [{ length: 10, insideDiameter: 0.04, hazenWilliamsC: 140 }];
    const named = (name: string, segments = pipe): BranchInput => ({ name, staticHead: 1, segments });
    const base: BranchedSystemInput = {
      frictionMethod: 'hazen-williams',
      segments: [],
      branches: [named('a'), named('b')],
    };
    const cases: [string, BranchedSystemInput, string, string][] = [
      ['one branch', { ...base, branches: [named('a')] }, '/branches', 'out-of-range'],
      [
        'nine branches',
        { ...base, branches: Array.from({ length: 9 }, (_, i) => named(`b${i}`)) },
        '/branches',
        'out-of-range',
      ],
      [
        'a repeated name',
        { ...base, branches: [named('a'), named('b'), named('a')] },
        '/branches/2/name',
        'branch-name-repeated',
      ],
      ['an empty name', { ...base, branches: [named('a'), named(' ')] }, '/branches/1/name', 'branch-without-name'],
      [
        'a branch without segments',
        { ...base, branches: [named('a'), named('b', [])] },
        '/branches/1/segments',
        'no-segments',
      ],
      ['a system staticHead', { ...base, staticHead: 2 as never }, '/staticHead', 'static-head-with-branches'],
      [
        'a bad length in a branch',
        { ...base, branches: [named('a', [{ ...pipe[0], length: -1 }]), named('b')] },
        '/branches/0/segments/0/length',
        'not-positive',
      ],
      [
        'a bad level of a branch',
        { ...base, branches: [named('a'), { ...named('b'), staticHead: Number.NaN }] },
        '/branches/1/staticHead',
        'not-finite',
      ],
      [
        'a bad bore in the common run',
        { ...base, segments: [{ ...pipe[0], insideDiameter: 0 }] },
        '/segments/0/insideDiameter',
        'out-of-range',
      ],
      ['a bad temperature', { ...base, temperature: 60 }, '/temperature', 'out-of-range'],
    ];
    for (const [name, input, field, code] of cases) {
      it(`${name} -> ${code} at ${field}`, () => {
        expect(() => compileBranchedSystem(input))
          .to.throw(HydraulicsInputError)
          .that.satisfies((error: HydraulicsInputError) => error.field === field && error.issue.code === code);
      });
    }

    it('a negative total flow -> /flow', () => {
      expect(() => branchFlowsAt(compileBranchedSystem(base), -1))
        .to.throw(HydraulicsInputError)
        .with.property('field', '/flow');
    });
  });

  describe('the compiled curve', () => {
    const branches = (frictionMethod: 'hazen-williams' | 'darcy-weisbach'): BranchedSystemInput => ({
      frictionMethod,
      segments: [{ length: 20, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 2 }] }],
      branches: [
        { name: 'falls', staticHead: 3, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-1.5' }] },
        { name: 'stream', staticHead: 0.5, segments: [{ length: 60, pipeSizeId: 'pvc-sch40-1.25' }] },
        { name: 'pool', staticHead: -0.5, outletPressureHead: 2, segments: [{ length: 8, pipeSizeId: 'pvc-sch40-1' }] },
      ],
    });

    for (const frictionMethod of ['hazen-williams', 'darcy-weisbach'] as const) {
      it(`${frictionMethod}: rises strictly with flow, its slope matches the head's difference quotient`, () => {
        const system = compileBranchedSystem(branches(frictionMethod));
        expect(system.staticHead).to.equal(0.5);
        expect(system.evaluate(0)).to.equal(0.5);
        let previous = system.evaluate(0);
        for (let step = 1; step <= 400; step += 1) {
          const flow = step * 5e-5; // to 20 L/s
          const head = system.evaluate(flow);
          expect(head, `${flow}`).to.be.above(previous);
          previous = head;
          const h = 1e-7 * flow;
          const quotient = (system.evaluate(flow + h) - system.evaluate(flow - h)) / (2 * h);
          expect(relative(system.slope(flow), quotient), `slope at ${flow}`).to.be.below(1e-4);
        }
      });
    }

    it('any two to eight branches: the branch flows sum to Q and the head rises with Q (property)', () => {
      const branchArbitrary = fc.record({
        staticHead: fc.double({ min: -5, max: 20, noNaN: true }),
        length: fc.double({ min: 1, max: 200, noNaN: true }),
        insideDiameter: fc.double({ min: 0.01, max: 0.3, noNaN: true }),
        extraK: fc.double({ min: 0, max: 50, noNaN: true }),
      });
      fc.assert(
        fc.property(
          fc.array(branchArbitrary, { minLength: 2, maxLength: 8 }),
          fc.constantFrom('hazen-williams' as const, 'darcy-weisbach' as const),
          fc.double({ min: 1e-5, max: 0.2, noNaN: true }),
          (drawn, frictionMethod, flow) => {
            const system = compileBranchedSystem({
              frictionMethod,
              segments: [],
              branches: drawn.map(({ staticHead, ...segment }, i): BranchInput => ({
                name: `b${i}`,
                staticHead,
                segments: [{ ...segment, hazenWilliamsC: 130, roughness: 1e-5 }],
              })),
            });
            const { head, flows } = splitOf(system, flow);
            const consistent = flows.every((q, i) => {
              const curve = system.branches[i].curve;
              return q === 0
                ? curve.staticHead >= head
                : Math.abs(curve.evaluate(q) - head) < 1e-12 * (1 + Math.abs(head));
            });
            // Backward error: the total flow lies between the flows at split heads 1e-12 (relative) either side.
            const scratch = new Float64Array(flows.length);
            const margin = 1e-12 * (1 + Math.abs(head));
            const bracketsFlow =
              system.flowsAtJunctionHead(head - margin, scratch) <= flow &&
              system.flowsAtJunctionHead(head + margin, scratch) >= flow;
            return consistent && bracketsFlow && system.evaluate(1.01 * flow) > system.evaluate(flow);
          },
        ),
        { numRuns: 300 },
      );
    });
  });
});
