import { expect } from 'chai';
import {
  HydraulicsInputError,
  fitPumpCurve,
  flowToSI,
  headToSI,
  polynomialValue,
  pumpCurveAtSpeed,
  pumpHeadAt,
  scaleByGeometricSimilarity,
  scaleByImpellerTrim,
  scaleBySpeed,
  solveOperatingPoint,
  specificSpeedAtBep,
  specificSpeedMetric,
  specificSpeedUS,
  speedRatioForDutyPoint,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { quadraticSystem } from './quadratic-system';

describe('affinity laws', () => {
  it('speed change (Karassik, Pump Handbook; White, Fluid Mechanics 11.4): doubling speed doubles flow, quadruples head, power x8', () => {
    const point = { flow: flowToSI(100, 'gpm'), head: headToSI(50, 'ft'), power: 1491.4 };
    const doubled = scaleBySpeed(point, 3500 / 1750);
    expect(doubled.flow).to.be.closeTo(flowToSI(200, 'gpm'), 1e-15);
    expect(doubled.head).to.be.closeTo(headToSI(200, 'ft'), 1e-12);
    expect(doubled.power).to.be.closeTo(8 * 1491.4, 1e-9);
    const slowed = scaleBySpeed(point, 0.8);
    expect(slowed.head / point.head).to.be.closeTo(0.64, 1e-12);
    expect((slowed.power as number) / point.power).to.be.closeTo(0.512, 1e-12);
  });

  it('keeps impeller trim and geometric similarity as different laws', () => {
    const point = { flow: 0.01, head: 20, power: 3000 };
    const trimmed = scaleByImpellerTrim(point, 0.9);
    expect(trimmed.flow).to.be.closeTo(0.009, 1e-15);
    expect(trimmed.head).to.be.closeTo(16.2, 1e-12);
    expect(trimmed.power).to.be.closeTo(2187, 1e-9);
    const larger = scaleByGeometricSimilarity(point, 1, 1.1); // same speed, 10 % larger pump
    expect(larger.flow).to.be.closeTo(0.01331, 1e-12); // D^3
    expect(larger.head).to.be.closeTo(24.2, 1e-12); // D^2
    expect(larger.power).to.be.closeTo(3000 * 1.1 ** 5, 1e-9); // D^5
    expect(() => scaleByImpellerTrim(point, 1.1))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/diameterRatio');
    expect(() => scaleBySpeed(point, 0))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/speedRatio');
  });

  const fit = fitPumpCurve(
    [0, 0.002, 0.004, 0.006, 0.008].map((flow) => ({
      flow,
      head: 18 - 2e5 * flow * flow,
      efficiency: 0.75 * (2 * (flow / 0.005) - (flow / 0.005) ** 2),
      npshRequired: 1 + 3e4 * flow * flow,
    })),
  );

  it('moves a whole fitted curve to another speed: curve, range, BEP and NPSH required', () => {
    const scaled = pumpCurveAtSpeed(fit, 0.8);
    expect(scaled.flowMax).to.be.closeTo(0.0064, 1e-15);
    expect(pumpHeadAt(scaled, 0.8 * 0.006)).to.be.closeTo(0.64 * pumpHeadAt(fit, 0.006), 1e-9);
    expect(scaled.bep?.flow).to.be.closeTo(0.004, 1e-9);
    expect(scaled.bep?.efficiency).to.be.closeTo(0.75, 1e-9);
    expect(polynomialValue(scaled.efficiencyCoefficients as number[], 0.8 * 0.003)).to.be.closeTo(
      polynomialValue(fit.efficiencyCoefficients as number[], 0.003),
      1e-12,
    );
    expect(polynomialValue(scaled.npshRequired?.coefficients as number[], 0.8 * 0.003)).to.be.closeTo(
      0.64 * (1 + 3e4 * 0.003 ** 2),
      1e-9,
    );
    expect(scaled.warnings.at(-1)).to.equal('scaled to 80.0 % speed by the affinity laws');
    expect(JSON.parse(JSON.stringify(scaled))).to.deep.equal(scaled);
  });

  it('finds the speed ratio that puts the curve through a duty point, and the system then runs there', () => {
    const dutyFlow = 0.004;
    const dutyHead = 9;
    const result = speedRatioForDutyPoint(fit, dutyFlow, dutyHead);
    if (!result.ok) throw new Error(engineIssueText(result.issue));
    // closed form for H = H0 - k Q^2: r^2 H0 - k Qd^2 = Hd
    expect(result.speedRatio).to.be.closeTo(Math.sqrt((dutyHead + 2e5 * dutyFlow ** 2) / 18), 1e-9);
    expect(result.aboveRatedSpeed).to.equal(false);
    const scaled = pumpCurveAtSpeed(fit, result.speedRatio);
    expect(pumpHeadAt(scaled, dutyFlow)).to.be.closeTo(dutyHead, 1e-9);
    const system = quadraticSystem(5, (dutyHead - 5) / dutyFlow ** 2); // through the duty point
    const point = solveOperatingPoint(scaled, system);
    if (!point.ok) throw new Error(engineIssueText(point.issue));
    expect(point.flow).to.be.closeTo(dutyFlow, 1e-12);
    expect(speedRatioForDutyPoint(fit, 0.004, 20)).to.deep.include({ ok: true, aboveRatedSpeed: true });
    expect(speedRatioForDutyPoint(fit, 0.02, 0.5)).to.include({ ok: false, reason: 'beyond-curve' });
  });

  it('specific speed: US units (rpm, gpm, ft) are 51.65 times the metric n_q (rpm, m3/s, m)', () => {
    const flow = flowToSI(500, 'gpm');
    const head = headToSI(100, 'ft');
    expect(specificSpeedUS(1750, flow, head)).to.be.closeTo((1750 * Math.sqrt(500)) / 100 ** 0.75, 1e-9);
    expect(specificSpeedUS(1750, flow, head) / specificSpeedMetric(1750, flow, head)).to.be.closeTo(51.65, 0.02);
    expect(() => specificSpeedMetric(1750, 0, head))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/flow');
    const atBep = specificSpeedAtBep(fit, 2900);
    expect(atBep?.metric).to.be.closeTo((2900 * Math.sqrt(0.005)) / (18 - 2e5 * 0.005 ** 2) ** 0.75, 1e-6);
    expect(specificSpeedAtBep({ bep: null }, 2900)).to.equal(null);
  });
});
