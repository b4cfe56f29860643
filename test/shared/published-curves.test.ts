import { expect } from 'chai';
import {
  compileSystemCurve,
  fitPumpCurve,
  fitPumpCurveWithIssues,
  flowToSI,
  headToSI,
  HydraulicsInputError,
  polynomialValue,
  pumpCurvePointErrors,
  solveOperatingPoint,
} from '../../shared/hydraulics';

/*
 * Curves as the trade publishes them: the open-flow point at zero head, two-point sheets,
 * drooping curves, points typed from the largest flow down, and efficiencies typed as fractions
 * under a percent unit. Points are invented; expected values are worked by hand from the stated
 * formulas.
 */

/** An invented pond-pump sheet in gph and ft, ending at its open-flow point (0 ft). */
const pondSheet = [
  [0, 12],
  [1000, 11.2],
  [2000, 9.8],
  [3000, 7.6],
  [4000, 4.4],
  [4800, 0],
].map(([flow, head]) => ({ flow: flowToSI(flow, 'gph'), head: headToSI(head, 'ft') }));

describe('published pump curves', () => {
  it('accepts zero head on the last point and fits up to that open flow', () => {
    const fit = fitPumpCurve(pondSheet);
    expect(fit.flowMax).to.equal(pondSheet[5].flow);
    expect(fit.curveBasis).to.equal('published');
    // a 1.5 ft lift through 3 m of 2 in pipe crosses before the open flow
    const system = compileSystemCurve({
      staticHead: headToSI(1.5, 'ft'),
      frictionMethod: 'hazen-williams',
      segments: [{ length: 3, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'exit', count: 1 }] }],
    });
    const point = solveOperatingPoint(fit, system);
    expect(point.ok).to.equal(true);
    if (!point.ok) return;
    expect(point.flow).to.be.within(flowToSI(3000, 'gph'), fit.flowMax);
    expect(polynomialValue(fit.headCoefficients, point.flow) - system.evaluate(point.flow)).to.be.closeTo(0, 1e-6);
  });

  it('refuses zero head on any point but the last', () => {
    const points = [pondSheet[0], { ...pondSheet[1], head: 0 }, ...pondSheet.slice(2)];
    expect(pumpCurvePointErrors(points).map((error) => [error.code, error.pointer])).to.deep.include([
      'zero-head-not-last',
      '/points/1/head',
    ]);
  });

  it('fits a two-point sheet by H = H0 (1 - (Q/Qmax)^2), marked estimated, without BEP', () => {
    const { fit, issues } = fitPumpCurveWithIssues([
      { flow: 0, head: 3 },
      { flow: 0.002, head: 0 },
    ]);
    expect(fit.curveBasis).to.equal('estimated-from-two-points');
    expect(issues.map((issue) => issue.code)).to.include('curve-estimated-from-two-points');
    // by hand: at half the open flow, 3 (1 - 0.25) = 2.25 m
    expect(polynomialValue(fit.headCoefficients, 0.001)).to.be.closeTo(2.25, 1e-12);
    expect(fit.efficiencyCoefficients).to.equal(null);
    expect(fit.bep).to.equal(null);
  });

  it('keeps power given on a two-point sheet as a straight line between its ends', () => {
    const fit = fitPumpCurve([
      { flow: 0, head: 3, power: 40 },
      { flow: 0.002, head: 0, power: 60 },
    ]);
    expect(polynomialValue(fit.powerCoefficients as number[], 0.001)).to.be.closeTo(50, 1e-9);
    expect(fit.powerBasis).to.equal('shaft');
  });

  it('refuses two points that are not shut-off and open flow', () => {
    expect(() =>
      fitPumpCurve([
        { flow: 0.001, head: 3 },
        { flow: 0.002, head: 1 },
      ]),
    )
      .to.throw(HydraulicsInputError)
      .with.nested.property('issue.code', 'too-few-points');
  });

  it('uses a drooping curve from its peak on, with a warning', () => {
    const points = [
      { flow: 0, head: 9 },
      { flow: 0.002, head: 10 },
      { flow: 0.004, head: 9.5 },
      { flow: 0.006, head: 8 },
      { flow: 0.008, head: 5 },
    ];
    const { fit, issues } = fitPumpCurveWithIssues(points);
    expect(fit.flowMin).to.equal(0.002);
    expect(fit.flowMax).to.equal(0.008);
    expect(issues).to.deep.include({ code: 'drooping-curve', params: { peakFlow: 0.002, peakHead: 10 } });
    expect(issues.map((issue) => issue.code)).not.to.include('shut-off-extrapolated');
    expect(fit.statistics.pointCount).to.equal(4);
  });

  it('still refuses head that rises after its peak', () => {
    const points = [
      { flow: 0, head: 10 },
      { flow: 0.002, head: 9 },
      { flow: 0.004, head: 9.5 },
      { flow: 0.006, head: 5 },
    ];
    expect(pumpCurvePointErrors(points).map((error) => error.pointer)).to.deep.equal(['/points/2/head']);
  });

  it('sorts points typed from the largest flow down, with a note, and names them as typed', () => {
    const { fit, issues } = fitPumpCurveWithIssues([...pondSheet].reverse());
    expect(fit.headCoefficients).to.deep.equal(fitPumpCurve(pondSheet).headCoefficients);
    expect(issues.map((issue) => issue.code)).to.include('points-reversed');
    const reversedBad = [...pondSheet].reverse().map((point, index) => (index === 0 ? { ...point, head: 1 } : point));
    // the typed first row (largest flow) is the last point in flow order: zero head is required there only
    expect(pumpCurvePointErrors(reversedBad)).to.deep.equal([]);
    const zeroInside = [...pondSheet].reverse().map((point, index) => (index === 2 ? { ...point, head: 0 } : point));
    expect(pumpCurvePointErrors(zeroInside).map((error) => error.pointer)).to.include('/points/2/head');
  });

  it('refuses efficiencies that look like fractions typed as percent, and a peak below 5 %', () => {
    const withEfficiency = (efficiencies: number[]) =>
      pondSheet.slice(0, 5).map((point, index) => ({ ...point, efficiency: efficiencies[index] }));
    const [fraction] = pumpCurvePointErrors(withEfficiency([0, 0.0035, 0.0052, 0.0058, 0.005]));
    expect(fraction).to.deep.equal({
      code: 'efficiency-looks-like-fraction',
      params: { peak: 0.0058 },
      pointer: '/points/3/efficiency',
    });
    expect(new HydraulicsInputError(fraction).message).to.contain('did you mean 58 %?');
    const [low] = pumpCurvePointErrors(withEfficiency([0, 0.02, 0.03, 0.04, 0.035]));
    expect(low.code).to.equal('efficiency-implausibly-low');
    expect(pumpCurvePointErrors(withEfficiency([0, 0.35, 0.52, 0.58, 0.5]))).to.deep.equal([]);
  });
});
