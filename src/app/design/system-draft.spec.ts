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

  it('sends a custom bore with the series material, custom C and roughness, and equipment', () => {
    const draft = exampleDraft();
    draft.segments[0] = {
      ...draft.segments[0],
      insideDiameter: 2.9,
      hazenWilliamsC: 140,
      roughness: null,
      equipment: [{ name: 'bead filter', headLoss: 4, atFlow: 80 }],
    };
    const segment = toPipeSystem(draft).segments[0];
    expect(segment.pipe).toBeUndefined();
    expect(segment.insideDiameter).toBe(2.9);
    expect(segment.material).toBe('pvc');
    expect(segment.hazenWilliamsC).toBe(140);
    expect(segment.roughness).toBeUndefined();
    expect(segment.equipment).toEqual([{ name: 'bead filter', headLoss: 4, atFlow: 80 }]);
    const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
    const plain = compileDraft(toPipeSystem({ ...draft, segments: [{ ...draft.segments[0], equipment: [] }] }), units);
    // 4 ft (1.2192 m) at its rated 80 gpm
    const rated = (80 * 3.785411784e-3) / 60;
    expect(compileDraft(toPipeSystem(draft), units).evaluate(rated) - plain.evaluate(rated)).toBeCloseTo(1.2192, 9);
  });

  it('converts custom bores, roughness and equipment with the units: 4 ft at 80 gpm is 1.2192 m at 302.83 L/min', () => {
    const us = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
    const si = { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' } as const;
    const draft = exampleDraft();
    draft.segments[0] = {
      ...draft.segments[0],
      insideDiameter: 3,
      roughness: 0.0018,
      equipment: [{ name: 'bead filter', headLoss: 4, atFlow: 80 }],
    };
    const metric = convertSystemDraft(draft, us, si).segments[0];
    expect(metric.insideDiameter).toBe(76.2);
    expect(metric.roughness).toBe(0.04572);
    expect(metric.equipment?.[0].headLoss).toBe(1.2192);
    expect(metric.equipment?.[0].atFlow).toBeCloseTo(302.833, 3);
  });
});
