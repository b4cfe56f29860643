import type { StoredPumpCurveFit } from '../../../shared/api/api-schemas';
import { preferredBandOf, pumpCurveNumbers } from './pump-curve-chart';

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

describe('pumpCurveNumbers', () => {
  const gpmAndFeet = { label: 'US gpm and ft', flow: 'gpm', head: 'ft' } as const;

  it('lists the published points in the chosen units, with efficiency only where the sheet gives it', () => {
    // 0.00630902 m3/s is 100 gpm (1 gpm = 3.785411784 L/min); 3.048 m is 10 ft
    const [points, marks] = pumpCurveNumbers(
      [
        { flow: 0, head: 6.096 },
        { flow: 0.00630902, head: 3.048, efficiency: 0.55 },
      ],
      fitWithBep(0.005),
      null,
      gpmAndFeet,
    );
    expect(points.headers).toEqual(['Flow (gpm)', 'Head (ft)', 'Efficiency (%)']);
    expect(points.rows).toEqual([
      ['0', '20', '–'],
      ['100', '10', '55'],
    ]);
    // BEP 0.005 m3/s = 79.3 gpm at 8 m = 26.2 ft; the band 70-120 % of it
    expect(marks.rows[0]).toEqual(['Best efficiency point', '79.3 gpm, 26.2 ft, 60 %']);
    expect(marks.rows[1]).toEqual(['Preferred region (70-120 % of BEP flow)', '55.5 to 95.1 gpm']);
  });

  it('has no marks table without a BEP or a declared band', () => {
    expect(pumpCurveNumbers([{ flow: 0, head: 5 }], fitWithBep(null), null, gpmAndFeet).length).toBe(1);
  });
});
