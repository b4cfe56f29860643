import { expect } from 'chai';
import fc from 'fast-check';
import {
  HydraulicsInputError,
  flowFromSI,
  flowToSI,
  headFromSI,
  headToSI,
  polynomialValue,
  solveOperatingPoint,
  solveParallelIdentical,
  solveParallelUnequal,
  solveSeries,
  type HeadCurve,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { quadraticSystem } from './quadratic-system';

const gpm = (value: number) => flowToSI(value, 'gpm');

/**
 * The pump and system of Munson, Young & Okiishi, Fundamentals of Fluid
 * Mechanics, Problem 12.27 (h_a = 180 - 6.10e-4 Q^2, ft and gpm; 50 ft lift;
 * 600 ft of 4 in pipe at f = 0.02, K = fL/D = 36). The parallel and series
 * answers below extend that problem and are worked here in closed form
 * (H0 - k Q^2 against Hs + c Q^2), not quoted from the book.
 */
const k = 6.1e-4;
const area = (Math.PI * 0.1016 ** 2) / 4;
const bSI = 36 / (2 * 9.80665 * area * area);
const c = headFromSI(bSI * gpm(1) ** 2, 'ft'); // ft per gpm^2
const system = quadraticSystem(headToSI(50, 'ft'), bSI);
const pumpCurve = (shutOffFeet: number, kFeet: number, maxGpm: number): HeadCurve => ({
  headCoefficients: [headToSI(shutOffFeet, 'ft'), 0, -headToSI(kFeet, 'ft') / gpm(1) ** 2],
  flowMin: 0,
  flowMax: gpm(maxGpm),
});
const pump = pumpCurve(180, k, 540);

describe('pump arrangements', () => {
  it('two identical pumps in parallel: each carries Q/2 at the common head', () => {
    const result = solveParallelIdentical(pump, system, 2, 2);
    if (!result.ok) throw new Error(engineIssueText(result.issue));
    const expected = Math.sqrt((180 - 50) / (k / 4 + c)); // gpm
    expect(flowFromSI(result.totalFlow, 'gpm')).to.be.closeTo(expected, 1e-6);
    expect(result.pumpFlows).to.have.length(2);
    expect(result.pumpFlows[0]).to.be.closeTo(result.totalFlow / 2, 1e-15);
    expect(result.head).to.be.closeTo(polynomialValue(pump.headCoefficients, result.pumpFlows[0]), 1e-9);
    // parallel gain is well short of double against this friction-heavy system
    const single = solveOperatingPoint(pump, system);
    if (!single.ok) throw new Error(engineIssueText(single.issue));
    expect(result.totalFlow / single.flow).to.be.within(1.05, 1.6);
  });

  it('with one of two failed, the running pump moves right to the single-pump point', () => {
    const result = solveParallelIdentical(pump, system, 2, 1);
    const single = solveOperatingPoint(pump, system);
    if (!result.ok || !single.ok) throw new Error('no point');
    expect(result.totalFlow).to.be.closeTo(single.flow, 1e-15);
    expect(result).to.include({ installed: 2, running: 1 });
  });

  it('two in series: heads add at the common flow', () => {
    const result = solveSeries(pump, system, 2);
    if (!result.ok) throw new Error(engineIssueText(result.issue));
    const expected = Math.sqrt((360 - 50) / (2 * k + c));
    expect(flowFromSI(result.totalFlow, 'gpm')).to.be.closeTo(expected, 1e-6);
    expect(result.pumpFlows).to.deep.equal([result.totalFlow, result.totalFlow]);
  });

  it('unequal pumps: a pump whose shut-off head is below the common head delivers zero', () => {
    const weak = pumpCurve(95, k, 390);
    const result = solveParallelUnequal([pump, weak], system);
    const single = solveOperatingPoint(pump, system);
    if (!result.ok || !single.ok) throw new Error('no point');
    expect(headFromSI(result.head, 'ft')).to.be.greaterThan(95);
    expect(result.pumpFlows[1]).to.equal(0);
    expect(result.totalFlow).to.be.closeTo(single.flow, 1e-9 * single.flow);
  });

  it('unequal pumps both delivering share one head that the system needs at their total flow', () => {
    const other = pumpCurve(150, 1e-3, 380);
    const result = solveParallelUnequal([pump, other], system);
    if (!result.ok) throw new Error(engineIssueText(result.issue));
    const [qa, qb] = result.pumpFlows;
    expect(qa).to.be.greaterThan(0);
    expect(qb).to.be.greaterThan(0);
    expect(polynomialValue(pump.headCoefficients, qa)).to.be.closeTo(result.head, 1e-9);
    expect(polynomialValue(other.headCoefficients, qb)).to.be.closeTo(result.head, 1e-9);
    expect(system.evaluate(qa + qb)).to.be.closeTo(result.head, 1e-8);
  });

  it('reports no point with a reason for unequal pumps: below static head, run-out', () => {
    expect(solveParallelUnequal([pumpCurve(40, k, 200)], system)).to.include({
      ok: false,
      reason: 'below-static-head',
    });
    expect(solveParallelUnequal([pump, pumpCurve(170, k, 100)], system)).to.include({
      ok: false,
      reason: 'beyond-curve',
    });
  });

  it('rejects bad counts and curves that do not start at shut-off', () => {
    expect(() => solveParallelIdentical(pump, system, 2, 3))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/running');
    expect(() => solveParallelIdentical(pump, system, 0, 0))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/installed');
    expect(() => solveSeries(pump, system, 1.5))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/count');
    expect(() => solveParallelUnequal([{ ...pump, flowMin: gpm(10) }], system))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/pumps/0');
  });

  const curveArbitrary = fc
    .record({
      shutOff: fc.double({ min: 20, max: 80, noNaN: true }),
      kFeet: fc.double({ min: 1e-4, max: 2e-3, noNaN: true }),
    })
    .map(({ shutOff, kFeet }) => pumpCurve(shutOff, kFeet, Math.sqrt((shutOff - 1) / kFeet)));

  it('more pumps in parallel never lowers the total flow (property)', () => {
    const lowSystem = quadraticSystem(headToSI(10, 'ft'), bSI);
    fc.assert(
      fc.property(curveArbitrary, fc.array(curveArbitrary, { minLength: 1, maxLength: 4 }), (first, others) => {
        let previous = 0;
        for (let running = 1; running <= 4; running += 1) {
          const result = solveParallelIdentical(first, lowSystem, 4, running);
          if (result.ok) {
            if (result.totalFlow < previous * (1 - 1e-12)) return false;
            previous = result.totalFlow;
          }
        }
        let unequalPrevious = 0;
        for (let count = 1; count <= others.length + 1; count += 1) {
          const result = solveParallelUnequal([first, ...others].slice(0, count), lowSystem);
          if (result.ok) {
            if (result.totalFlow < unequalPrevious * (1 - 1e-9)) return false;
            unequalPrevious = result.totalFlow;
          }
        }
        return true;
      }),
      { numRuns: 200 },
    );
  });
});
