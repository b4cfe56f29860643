import { expect } from 'chai';
import fc from 'fast-check';
import {
  PIPE_SIZES,
  compileSystemCurve,
  fitPumpCurve,
  flowFromSI,
  flowToSI,
  headFromSI,
  headToSI,
  polynomialValue,
  solveOperatingPoint,
  type FrictionMethod,
  type HeadCurve,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { quadraticSystem } from './quadratic-system';

const lpm = (value: number) => flowToSI(value, 'L/min');
const gpm = (value: number) => flowToSI(value, 'gpm');

describe('operating point', () => {
  describe('Çengel & Cimbala, Fluid Mechanics: Fundamentals and Applications, ch. 14 problem (pump H = H0 - a V^2 between two reservoirs)', () => {
    // Problem data as published (problem number not verified): H0 = 7.46 m, a = 0.0453 m/(Lpm)^2;
    // system z2 - z1 = 3.52 m, b = 0.0261 m/(Lpm)^2. Answer worked here in closed form:
    // V = sqrt((H0 - dz)/(a + b)) = 7.428 Lpm, H = dz + b V^2 = 4.960 m.
    const a = 0.0453 / lpm(1) ** 2;
    const b = 0.0261 / lpm(1) ** 2;
    const system = quadraticSystem(3.52, b);
    const expectedLpm = Math.sqrt((7.46 - 3.52) / (0.0453 + 0.0261));

    it('solves the stated curves: 7.43 Lpm at 4.96 m', () => {
      const pump: HeadCurve = { headCoefficients: [7.46, 0, -a], flowMin: 0, flowMax: lpm(12) };
      const point = solveOperatingPoint(pump, system);
      if (!point.ok) throw new Error(engineIssueText(point.issue));
      expect(flowFromSI(point.flow, 'L/min')).to.be.closeTo(expectedLpm, 1e-6);
      expect(flowFromSI(point.flow, 'L/min')).to.be.closeTo(7.43, 0.005);
      expect(point.head).to.be.closeTo(4.96, 0.005);
    });

    it('gives the same point from the pump curve as points (0-12 Lpm) fitted and stored', () => {
      const points = [0, 2, 4, 6, 8, 10, 12].map((v) => ({ flow: lpm(v), head: 7.46 - 0.0453 * v * v }));
      const fit = JSON.parse(JSON.stringify(fitPumpCurve(points)));
      const point = solveOperatingPoint(fit, system);
      if (!point.ok) throw new Error(engineIssueText(point.issue));
      expect(flowFromSI(point.flow, 'L/min')).to.be.closeTo(expectedLpm, 1e-6);
    });
  });

  describe('Munson, Young & Okiishi, Fundamentals of Fluid Mechanics, Problem 12.27 (edition not verified)', () => {
    // Problem data as published: h_a = 180 - 6.10e-4 Q^2 (ft, gpm); z2 - z1 = 50 ft; 600 ft of 4 in
    // pipe, f = 0.02 constant, minor losses neglected. The constant f makes the pipe a fixed
    // K = f L/D = 36. Answer worked here from those data: about 365 gpm (g = 9.80665 m/s2).
    const area = (Math.PI * 0.1016 ** 2) / 4;
    const bSI = 36 / (2 * 9.80665 * area * area);
    const system = quadraticSystem(headToSI(50, 'ft'), bSI);
    const headPerGpm2 = headFromSI(bSI * gpm(1) ** 2, 'ft');
    const expectedGpm = Math.sqrt((180 - 50) / (6.1e-4 + headPerGpm2));

    it('delivers about 365 gpm with the pump curve tabulated at 0-500 gpm', () => {
      const points = [0, 100, 200, 300, 400, 500].map((q) => ({
        flow: gpm(q),
        head: headToSI(180 - 6.1e-4 * q * q, 'ft'),
      }));
      const point = solveOperatingPoint(fitPumpCurve(points), system);
      if (!point.ok) throw new Error(engineIssueText(point.issue));
      expect(flowFromSI(point.flow, 'gpm')).to.be.closeTo(expectedGpm, 1e-6);
      expect(flowFromSI(point.flow, 'gpm')).to.be.closeTo(365, 1);
    });
  });

  describe('no intersection: a typed reason, not an exception', () => {
    const system = quadraticSystem(10, 2e5);
    it('below-static-head when shut-off head is under the static head', () => {
      const result = solveOperatingPoint({ headCoefficients: [9.5, 0, -1e5], flowMin: 0, flowMax: 0.005 }, system);
      expect(result).to.include({ ok: false, reason: 'below-static-head' });
    });
    it('beyond-curve when the curves would cross past the last point (run-out)', () => {
      const result = solveOperatingPoint({ headCoefficients: [30, 0, -1e5], flowMin: 0, flowMax: 0.004 }, system);
      expect(result).to.include({ ok: false, reason: 'beyond-curve' });
    });
    it('before-curve when the curve starts above zero flow and the crossing lies left of it', () => {
      const result = solveOperatingPoint({ headCoefficients: [12, 0, -1e5], flowMin: 0.003, flowMax: 0.01 }, system);
      expect(result).to.include({ ok: false, reason: 'before-curve' });
    });
  });

  const pumpArbitrary = fc
    .record({
      shutOff: fc.double({ min: 1, max: 60, noNaN: true }),
      flowMax: fc.double({ min: 1e-4, max: 0.05, noNaN: true }),
      shape: fc.tuple(
        fc.double({ min: 0, max: 0.3, noNaN: true }),
        fc.double({ min: 0, max: 0.4, noNaN: true }),
        fc.double({ min: 0, max: 0.25, noNaN: true }),
      ),
    })
    .map(({ shutOff, flowMax, shape: [alpha, beta, gamma] }): HeadCurve => ({
      // H = H0 (1 - alpha x - beta x^2 - gamma x^3), x = Q / flowMax: non-increasing, positive
      headCoefficients: [
        shutOff,
        (-shutOff * alpha) / flowMax,
        (-shutOff * beta) / flowMax ** 2,
        (-shutOff * gamma) / flowMax ** 3,
      ],
      flowMin: 0,
      flowMax,
    }));
  const systemArbitrary = fc.record({
    staticHead: fc.double({ min: 0, max: 40, noNaN: true }),
    length: fc.double({ min: 1, max: 300, noNaN: true }),
    pipeSizeId: fc.constantFrom(...PIPE_SIZES.map((size) => size.id)),
    elbows: fc.integer({ min: 0, max: 8 }),
    frictionMethod: fc.constantFrom<FrictionMethod>('hazen-williams', 'darcy-weisbach'),
  });
  const compile = (s: {
    staticHead: number;
    length: number;
    pipeSizeId: string;
    elbows: number;
    frictionMethod: FrictionMethod;
  }) =>
    compileSystemCurve({
      staticHead: s.staticHead,
      frictionMethod: s.frictionMethod,
      segments: [
        {
          length: s.length,
          pipeSizeId: s.pipeSizeId,
          fittings: [
            { kind: 'elbow-90-standard', count: s.elbows },
            { kind: 'exit', count: 1 },
          ],
        },
      ],
    });

  it('lies on both curves, inside the curve range, within a few iterations (property)', () => {
    fc.assert(
      fc.property(pumpArbitrary, systemArbitrary, (pump, systemInput) => {
        const system = compile(systemInput);
        const result = solveOperatingPoint(pump, system);
        if (!result.ok) {
          if (result.reason === 'below-static-head') return pump.headCoefficients[0] < system.staticHead;
          return (
            result.reason === 'beyond-curve' &&
            polynomialValue(pump.headCoefficients, pump.flowMax) > system.evaluate(pump.flowMax)
          );
        }
        const pumpHead = polynomialValue(pump.headCoefficients, result.flow);
        return (
          result.flow >= 0 &&
          result.flow <= pump.flowMax &&
          Math.abs(pumpHead - result.head) <= 1e-12 * pump.headCoefficients[0] &&
          Math.abs(pumpHead - system.evaluate(result.flow)) <= 1e-9 * pump.headCoefficients[0] &&
          result.iterations <= 12
        );
      }),
      { numRuns: 500 },
    );
  });

  it('a longer pipe never raises the flow (property)', () => {
    fc.assert(
      fc.property(
        pumpArbitrary,
        systemArbitrary,
        fc.double({ min: 1, max: 5, noNaN: true }),
        (pump, systemInput, factor) => {
          const short = solveOperatingPoint(pump, compile(systemInput));
          const long = solveOperatingPoint(pump, compile({ ...systemInput, length: systemInput.length * factor }));
          if (short.ok && long.ok) return long.flow <= short.flow * (1 + 1e-9); // solver tolerance
          if (!short.ok && short.reason === 'below-static-head') return !long.ok && long.reason === 'below-static-head';
          return !short.ok || long.ok || long.reason !== 'beyond-curve';
        },
      ),
      { numRuns: 300 },
    );
  });
});
