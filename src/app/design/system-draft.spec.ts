import { compileDraft, convertSystemDraft, exampleDraft, staticHeadOf, toPipeSystem } from './system-draft';

describe('system draft', () => {
  it('takes the static head from two measured levels', () => {
    const draft = { ...exampleDraft(), staticMode: 'levels' as const, intakeLevel: 101.2, dischargeLevel: 109.7 };
    expect(staticHeadOf(draft)).toBeCloseTo(8.5, 9);
    expect(toPipeSystem(draft).staticHead).toBeCloseTo(8.5, 9);
  });

  it('leaves out fittings counted zero and names the catalogue size', () => {
    const draft = exampleDraft();
    draft.segments[0].fittings.push({ kind: 'valve-ball', count: 0 });
    const segment = toPipeSystem(draft).segments[0];
    expect(segment.pipe).toBe('pvc-sch40-3');
    expect(segment.fittings?.map((fitting) => fitting.kind)).toEqual(['elbow-90-standard', 'exit']);
  });

  it('previews the static head at no flow and more head with flow', () => {
    const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
    const curve = compileDraft(toPipeSystem(exampleDraft()), units);
    // 14.5 ft in metres (1 ft = 0.3048 m exactly)
    expect(curve.evaluate(0)).toBeCloseTo(14.5 * 0.3048, 9);
    expect(curve.evaluate(0.006)).toBeGreaterThan(curve.evaluate(0.003));
  });

  it('converts the measured system to metric and back to the numbers typed', () => {
    const us = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
    const si = { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' } as const;
    const draft = {
      ...exampleDraft(),
      staticMode: 'levels' as const,
      intakeLevel: 335.794,
      dischargeLevel: 350.294,
      outletPressureHead: 2.31,
    };
    const metric = convertSystemDraft(draft, us, si);
    // 1 ft = 0.3048 m exactly
    expect(metric.staticHead).toBe(4.4196);
    expect(metric.segments[0].length).toBe(73.152);
    expect(metric.intakeLevel).toBe(102.35);
    expect(metric.dischargeLevel).toBe(106.7696);
    expect(staticHeadOf(metric)).toBeCloseTo(14.5 * 0.3048, 9);
    expect(metric.segments[0].size).toBe('pvc-sch40-3');
    expect(metric.segments[0].fittings).toEqual(draft.segments[0].fittings);
    expect(convertSystemDraft(metric, si, us)).toEqual(draft);
  });
});
