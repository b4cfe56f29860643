import { compileDraft, exampleDraft, staticHeadOf, toPipeSystem } from './system-draft';

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
});
