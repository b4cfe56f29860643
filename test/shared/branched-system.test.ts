import { expect } from 'chai';
import fc from 'fast-check';
import {
  STANDARD_GRAVITY,
  branchFlowsAt,
  compileBranchedSystem,
  compileSystemCurve,
  headLossHazenWilliams,
  type BranchInput,
  type BranchedSystemInput,
  type CompiledBranchedSystem,
  type PipeSegmentInput,
} from '../../shared/hydraulics';

const area = (bore: number) => (Math.PI * bore * bore) / 4;
const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

function splitOf(system: CompiledBranchedSystem, totalFlow: number): { head: number; flows: number[] } {
  const flows = new Float64Array(system.branches.length);
  const head = system.splitAt(totalFlow, flows);
  return { head, flows: [...flows] };
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
          params: { branch: 0, outletHead: 4, junctionHead: split.junctionHead },
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
