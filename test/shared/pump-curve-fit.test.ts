import { expect } from 'chai';
import fc from 'fast-check';
import {
  HydraulicsInputError,
  STANDARD_GRAVITY,
  fitPumpCurve,
  fitPumpCurveWithIssues,
  polynomialValue,
  pumpEfficiencyAt,
  pumpHeadAt,
  pumpNpshRequiredAt,
  waterDensity,
  type PumpCurvePoint,
} from '../../shared/hydraulics';
import { refusalOf } from '../support/engine-refusal';

/** Points on H = h0 - k Q^2 at the given flows (an exact quadratic the fit must recover). */
const parabola = (h0: number, k: number, flows: number[]): PumpCurvePoint[] =>
  flows.map((flow) => ({ flow, head: h0 - k * flow * flow }));

describe('pump curve fit', () => {
  it('recovers an exact quadratic from three points with zero residual', () => {
    const fit = fitPumpCurve(parabola(12, 2e5, [0, 0.004, 0.007]));
    expect(fit.degree).to.equal(2);
    expect(fit.headCoefficients[0]).to.be.closeTo(12, 1e-10);
    expect(fit.headCoefficients[1]).to.be.closeTo(0, 1e-8);
    expect(fit.headCoefficients[2]).to.be.closeTo(-2e5, 1e-4);
    expect(fit.shutOffHead).to.be.closeTo(12, 1e-10);
    expect(fit.statistics.rmsHead).to.be.lessThan(1e-10);
    expect(fit.flowMin).to.equal(0);
    expect(fit.flowMax).to.equal(0.007);
  });

  it("agrees with the normal-equation least-squares solution solved independently (Cramer's rule)", () => {
    const points: PumpCurvePoint[] = [
      { flow: 0, head: 10.2 },
      { flow: 0.001, head: 9.7 },
      { flow: 0.002, head: 8.9 },
      { flow: 0.003, head: 7.1 },
    ];
    const fit = fitPumpCurve(points);
    expect(fit.degree).to.equal(2); // four points: quadratic by the degree rule
    const sums = (p: number) => points.reduce((sum, point) => sum + point.flow ** p, 0);
    const rhs = (p: number) => points.reduce((sum, point) => sum + point.head * point.flow ** p, 0);
    const m = [
      [sums(0), sums(1), sums(2)],
      [sums(1), sums(2), sums(3)],
      [sums(2), sums(3), sums(4)],
    ];
    const det = (a: number[][]) =>
      a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) -
      a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0]) +
      a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
    const b = [rhs(0), rhs(1), rhs(2)];
    const d = det(m);
    const expected = [0, 1, 2].map(
      (column) => det(m.map((row, i) => row.map((value, j) => (j === column ? b[i] : value)))) / d,
    );
    expected.forEach((value, power) =>
      expect(fit.headCoefficients[power]).to.be.closeTo(value, 1e-7 * Math.abs(value)),
    );
    const residuals = points.map((point) => point.head - polynomialValue(expected, point.flow));
    const rms = Math.sqrt(residuals.reduce((sum, r) => sum + r * r, 0) / residuals.length);
    expect(fit.statistics.rmsHead).to.be.closeTo(rms, 1e-9);
    const worst = residuals.reduce((a, r) => (Math.abs(r) > Math.abs(a) ? r : a), 0);
    expect(fit.statistics.worstResidual).to.be.closeTo(worst, 1e-9);
    expect(fit.statistics.worstResidualFlow).to.equal(
      points[residuals.indexOf(residuals.reduce((a, r) => (Math.abs(r) > Math.abs(a) ? r : a), 0))].flow,
    );
    expect(fit.statistics.pointCount).to.equal(4);
  });

  it('chooses a cubic only for five or more points spread over at least half the flow range', () => {
    const cubic = (q: number) => 20 - 1e2 * q - 1e5 * q * q - 5e6 * q ** 3;
    const spread = [0, 0.002, 0.004, 0.006, 0.008].map((flow) => ({ flow, head: cubic(flow) }));
    const fit = fitPumpCurve(spread);
    expect(fit.degree).to.equal(3);
    expect(fit.headCoefficients[3]).to.be.closeTo(-5e6, 1e-3);
    const clustered = [0.005, 0.0055, 0.006, 0.007, 0.008].map((flow) => ({ flow, head: cubic(flow) }));
    expect(fitPumpCurve(clustered).degree).to.equal(2);
    expect(fitPumpCurve(spread.slice(0, 4)).degree).to.equal(2);
  });

  it('never lets the fitted head rise over the data range, and says how it constrained the fit', () => {
    const flatThenFalling: PumpCurvePoint[] = [10, 10, 10, 9.5, 5].map((head, index) => ({ flow: index * 1e-3, head }));
    const fit = fitPumpCurve(flatThenFalling);
    for (let q = 0; q < 0.004; q += 1e-5) {
      expect(polynomialValue(fit.headCoefficients, q + 1e-5)).to.be.at.most(
        polynomialValue(fit.headCoefficients, q) + 1e-9,
      );
    }
    expect(fit.warnings.join(' ')).to.match(/would rise within the data range/);
  });

  it('fits efficiency through the origin and finds the BEP at its maximum', () => {
    // eta = 0.8 (2 x - x^2), x = Q / 0.005: peak 0.80 at 0.005 m3/s
    const flows = [0, 0.002, 0.004, 0.006, 0.008];
    const points = flows.map((flow) => {
      const x = flow / 0.005;
      return { flow, head: 15 - 1e5 * flow * flow, efficiency: 0.8 * (2 * x - x * x) };
    });
    const fit = fitPumpCurve(points);
    expect(fit.efficiencyCoefficients?.[0]).to.equal(0);
    expect(fit.bep?.flow).to.be.closeTo(0.005, 1e-9);
    expect(fit.bep?.efficiency).to.be.closeTo(0.8, 1e-9);
    expect(fit.bep?.head).to.be.closeTo(15 - 1e5 * 0.005 ** 2, 1e-8);
    expect(pumpEfficiencyAt(fit, 0.0025)).to.be.closeTo(0.6, 1e-9);
  });

  it('derives efficiency from power as rho g Q H / P (water at 20 C) and fits the power curve', () => {
    const rho = waterDensity(20);
    const power = (flow: number) => 250 + 8e4 * flow - 2e6 * flow * flow; // W, an exact quadratic
    const head = (flow: number) => 12 - 1.2e5 * flow * flow;
    const points = [0, 0.002, 0.004, 0.006].map((flow) => ({ flow, head: head(flow), power: power(flow) }));
    const fit = fitPumpCurve(points, { powerBasis: 'electrical' });
    expect(fit.powerBasis).to.equal('electrical');
    const [p0, p1, p2] = fit.powerCoefficients as number[];
    expect(p0).to.be.closeTo(250, 1e-9);
    expect(p1).to.be.closeTo(8e4, 1e-6);
    expect(p2).to.be.closeTo(-2e6, 1e-3);
    // the derived values are not a polynomial: a two-term curve through the origin is within 0.03 of them
    for (const flow of [0.002, 0.004, 0.006]) {
      const derived = (rho * STANDARD_GRAVITY * flow * head(flow)) / power(flow);
      expect(pumpEfficiencyAt(fit, flow) as number).to.be.closeTo(derived, 0.03);
    }
  });

  it('states the BEP as unknown, with a reason, without efficiency data or when efficiency still rises at the last point', () => {
    const noEfficiency = fitPumpCurve(parabola(10, 1e5, [0, 0.002, 0.004]));
    expect(noEfficiency.bep).to.equal(null);
    expect(noEfficiency.bepUnknownReason).to.match(/no efficiency or power data/);
    const rising = fitPumpCurve(
      [0, 0.002, 0.004].map((flow) => ({ flow, head: 10 - 1e5 * flow * flow, efficiency: 100 * flow })),
    );
    expect(rising.bep).to.equal(null);
    expect(rising.bepUnknownReason).to.match(/still rises at the last curve point/);
  });

  it('fits NPSH required over the points that give it and never extrapolates a curve', () => {
    const points = parabola(10, 1e5, [0.001, 0.002, 0.003, 0.004]).map((point) => ({
      ...point,
      npshRequired: 1 + 1e5 * point.flow ** 2,
    }));
    const fit = fitPumpCurve(points);
    expect(pumpNpshRequiredAt(fit, 0.0025)).to.be.closeTo(1 + 1e5 * 0.0025 ** 2, 1e-9);
    expect(fitPumpCurveWithIssues(points).issues.map((issue) => issue.code)).to.include('shut-off-extrapolated');
    expect(refusalOf(() => pumpHeadAt(fit, 0.0041))).to.deep.include({ code: 'flow-outside-curve', pointer: '/flow' });
    expect(() => pumpHeadAt(fit, 0.0005)).to.throw(HydraulicsInputError);
    expect(pumpHeadAt(fit, 0.004)).to.be.closeTo(10 - 1e5 * 0.004 ** 2, 1e-9);
  });

  it('is a plain JSON object that reloads unchanged', () => {
    const fit = fitPumpCurve(
      [0, 0.002, 0.004, 0.006, 0.008].map((flow) => ({
        flow,
        head: 15 - 1e5 * flow * flow,
        efficiency: 200 * flow - 2e4 * flow * flow,
      })),
      { allowableRegion: { flowMin: 0.001, flowMax: 0.008 } },
    );
    const reloaded = JSON.parse(JSON.stringify(fit));
    expect(reloaded).to.deep.equal(fit);
    expect(pumpHeadAt(reloaded, 0.003)).to.equal(pumpHeadAt(fit, 0.003));
  });

  it('fits any non-increasing point set with a curve that does not rise and finite statistics (property)', () => {
    const pointSet = fc
      .tuple(
        fc.integer({ min: 3, max: 9 }),
        fc.double({ min: 0.5, max: 80, noNaN: true }),
        fc.double({ min: 1e-4, max: 0.1, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 18, maxLength: 18 }),
      )
      .map(([count, shutOff, flowMax, shares]) => {
        let head = shutOff;
        return Array.from({ length: count }, (_, index) => {
          head -= index === 0 ? 0 : (shutOff / count) * 0.9 * shares[index];
          return { flow: (flowMax * (index + shares[index + 9] * 0.5)) / count, head };
        });
      });
    fc.assert(
      fc.property(pointSet, (points) => {
        const fit = fitPumpCurve(points);
        const span = fit.flowMax - fit.flowMin;
        for (let step = 0; step < 100; step += 1) {
          const q = fit.flowMin + (span * step) / 100;
          if (
            polynomialValue(fit.headCoefficients, q + span / 100) >
            polynomialValue(fit.headCoefficients, q) + 1e-8 * points[0].head
          )
            return false;
        }
        return Number.isFinite(fit.statistics.rmsHead) && fit.headCoefficients.every(Number.isFinite);
      }),
      { numRuns: 300 },
    );
  });

  describe('bad input -> HydraulicsInputError, never NaN', () => {
    const good = parabola(10, 1e5, [0, 0.002, 0.004]);
    const cases: [string, PumpCurvePoint[], string][] = [
      ['fewer than three points', good.slice(0, 2), '/points'],
      ['flows not strictly increasing', [good[0], good[2], good[1]], '/points/2/flow'],
      ['repeated flow', [good[0], good[1], { ...good[1], head: good[1].head - 1 }], '/points/2/flow'],
      ['head rising with flow', [good[0], { flow: 0.002, head: 11 }, good[2]], '/points/1/head'],
      ['NaN head', [good[0], { flow: 0.002, head: Number.NaN }, good[2]], '/points/1/head'],
      ['negative flow', [{ flow: -0.001, head: 10 }, ...good.slice(1)], '/points/0/flow'],
      ['efficiency on some points only', [{ ...good[0], efficiency: 0 }, good[1], good[2]], '/points/1/efficiency'],
      ['efficiency above 1', good.map((point) => ({ ...point, efficiency: 1.2 })), '/points/0/efficiency'],
      ['power below the water power', good.map((point) => ({ ...point, power: 1 })), '/points/1/power'],
    ];
    for (const [name, points, field] of cases) {
      it(`${name} -> ${field}`, () => {
        expect(() => fitPumpCurve(points))
          .to.throw(HydraulicsInputError)
          .with.property('field', field);
      });
    }
  });
});
