import type { StoredPumpCurveFit } from '../../../shared/api/api-schemas';
import { preferredBandOf } from './pump-curve-chart';

function fitWithBep(bepFlow: number | null, flowMin = 0, flowMax = 0.01): StoredPumpCurveFit {
  return {
    schemaVersion: 1,
    degree: 2,
    headCoefficients: [10, 0, -50000],
    flowMin,
    flowMax,
    shutOffHead: 10,
    efficiencyCoefficients: null,
    powerCoefficients: null,
    powerBasis: null,
    npshRequired: null,
    bep: bepFlow === null ? null : { flow: bepFlow, head: 8, efficiency: 0.6 },
    bepUnknownReason: bepFlow === null ? 'the curve has no efficiency or power data' : null,
    allowableRegion: null,
    statistics: { rmsHead: 0, worstResidual: 0, worstResidualFlow: 0, pointCount: 3 },
    warnings: [],
  };
}

describe('preferredBandOf', () => {
  it("takes the supplier's declared range when there is one", () => {
    expect(preferredBandOf(fitWithBep(0.005), { flowMin: 0.001, flowMax: 0.002 })).toEqual({
      range: { flowMin: 0.001, flowMax: 0.002 },
      source: 'supplier',
    });
  });

  it('otherwise draws 70-120 % of BEP flow (ANSI/HI 9.6.3 default POR)', () => {
    const band = preferredBandOf(fitWithBep(0.005), null)!;
    expect(band.source).toBe('bep');
    expect(band.range.flowMin).toBeCloseTo(0.0035, 12);
    expect(band.range.flowMax).toBeCloseTo(0.006, 12);
  });

  it('keeps the band inside the published flows, and draws none without a BEP', () => {
    expect(preferredBandOf(fitWithBep(0.009), null)!.range.flowMax).toBe(0.01);
    expect(preferredBandOf(fitWithBep(null), null)).toBeNull();
  });
});
