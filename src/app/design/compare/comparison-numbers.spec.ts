import { comparisonNumbers, headOnCurve } from './comparison-numbers';
import type { ChartModel } from './comparison-chart';

const model: ChartModel = {
  flowUnit: 'gpm',
  headUnit: 'ft',
  band: { flowMin: 90, flowMax: 130 },
  // H = 10 + 0.001 Q^2, sampled every 40 gpm
  systemCurve: [0, 40, 80, 120, 160].map((flow) => ({ flow, head: 10 + 0.001 * flow * flow })),
  candidates: [
    {
      key: '1x2',
      label: 'Pump A x2',
      speedRatio: null,
      curve: [
        { flow: 0, head: 40 },
        { flow: 100, head: 30 },
        { flow: 140, head: 20 },
      ],
      preferredRange: { flowMin: 70, flowMax: 120 },
      operatingPoint: { flow: 118.25, head: 23.98 },
      oneFailed: null,
    },
  ],
};

describe('comparison chart numbers', () => {
  it('reads a curve between its samples by straight lines, and nothing outside it', () => {
    expect(headOnCurve(model.candidates[0].curve, 50)).toBe(35);
    expect(headOnCurve(model.candidates[0].curve, 120)).toBe(25);
    expect(headOnCurve(model.candidates[0].curve, 150)).toBeNull();
  });

  it('lists each operating point and every curve over the flow axis, in the chart units', () => {
    const [points, curves] = comparisonNumbers(model);
    expect(points.rows).toEqual([['Pump A x2', '118.3', '24', '–', '–', '70 to 120']]);
    expect(curves.headers).toEqual(['Flow (gpm)', 'System curve (ft)', 'Pump A x2 (ft)']);
    expect(curves.rows.length).toBe(9);
    // 20 gpm a step; at 40 gpm the system sample is exact (11.6 ft), the pump line reads 36 ft
    expect(curves.rows[2]).toEqual(['40', '11.6', '36']);
    // at 160 gpm the pump's curve has ended
    expect(curves.rows[8]).toEqual(['160', '35.6', '–']);
    expect(curves.caption).toContain('duty band 90 to 130 gpm');
  });
});
