import {
  branchSharesOf,
  compileDraft,
  convertSystemDraft,
  exampleDraft,
  newBranch,
  toPipeSystem,
} from './system-draft';
import type { SystemDraft } from './system-draft';

const us = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
const si = { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' } as const;

/** A pond: 30 ft of 3" to a tee, then a falls 9 ft up and a filter return 1.5 ft up. */
function fallsAndFilter(): SystemDraft {
  const draft = { ...exampleDraft(), staticMode: 'levels' as const, intakeLevel: 100, dischargeLevel: 109 };
  draft.segments = [
    { series: 'pvc-sch40', size: 'pvc-sch40-3', length: 6, fittings: [], extraK: 0, side: 'suction' },
    { ...draft.segments[0], length: 30 },
  ];
  draft.siteElevation = 1200;
  draft.pumpElevation = 2;
  draft.branches = [
    { ...newBranch(draft, 'Falls'), outletLevel: 109 },
    {
      ...newBranch(draft, 'Filter return'),
      outletLevel: 101.5,
      outletPressureHead: 2,
      segments: [{ series: 'pvc-sch40', size: 'pvc-sch40-1.5', length: 40, fittings: [], extraK: 0 }],
    },
  ];
  return draft;
}

describe('system draft with branches and a suction side', () => {
  it('maps branches with their own outlet levels above the intake, and no static head of the system', () => {
    const system = toPipeSystem(fallsAndFilter());
    expect(system.staticHead).toBeUndefined();
    expect(system.outletPressureHead).toBeUndefined();
    expect(system.branches?.map((branch) => [branch.name, branch.staticHead, branch.outletPressureHead])).toEqual([
      ['Falls', 9, 0],
      ['Filter return', 1.5, 2],
    ]);
    expect(system.segments.map((segment) => segment.side)).toEqual(['suction', undefined]);
    expect(system.siteElevation).toBe(1200);
    expect(system.pumpElevation).toBe(2);
  });

  it('keeps the elevations out without a suction side, and a single route as it was', () => {
    const draft = fallsAndFilter();
    draft.segments = draft.segments.map((segment) => ({ ...segment, side: 'discharge' as const }));
    const system = toPipeSystem(draft);
    expect(system.pumpElevation).toBeUndefined();
    expect(system.siteElevation).toBeUndefined();
    expect(system.segments[0].side).toBeUndefined();
    const single = toPipeSystem(exampleDraft());
    expect(single.branches).toBeUndefined();
    expect(single.staticHead).toBe(14.5);
  });

  it('converts branch levels, heads, pipe and the elevations to metric and back to the numbers typed', () => {
    const draft = fallsAndFilter();
    const metric = convertSystemDraft(draft, us, si);
    // 1 ft = 0.3048 m exactly
    expect(metric.branches?.[0].outletLevel).toBe(33.2232);
    expect(metric.branches?.[1].outletPressureHead).toBe(0.6096);
    expect(metric.branches?.[1].segments[0].length).toBe(12.192);
    expect(metric.siteElevation).toBe(365.76);
    expect(metric.pumpElevation).toBe(0.6096);
    expect(toPipeSystem(metric).branches?.[0].staticHead).toBeCloseTo(9 * 0.3048, 9);
    expect(convertSystemDraft(metric, si, us)).toEqual(draft);
  });

  it('splits a total flow between the branches: the shares add up, the lower outlet takes most of a small flow', () => {
    const system = toPipeSystem(fallsAndFilter());
    const [low, high] = branchSharesOf(system, us, [40, 120]);
    for (const row of [low, high]) expect(row.map((share) => share.name)).toEqual(['Falls', 'Filter return']);
    expect(low[0].flow + low[1].flow).toBeCloseTo(40, 6);
    expect(high[0].flow + high[1].flow).toBeCloseTo(120, 6);
    expect(low[1].flow).toBeGreaterThan(low[0].flow);
    expect(high[0].flow).toBeGreaterThan(low[0].flow);
    expect(high[0].velocity).toBeGreaterThan(0);
    // the preview's curve starts at the lower outlet (1.5 ft + 2 ft of pressure)
    expect(compileDraft(system, us).evaluate(0)).toBeCloseTo(3.5 * 0.3048, 9);
    expect(branchSharesOf(toPipeSystem(exampleDraft()), us, [40])).toEqual([]);
  });
});
