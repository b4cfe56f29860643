import type { SelectionCandidate } from '../../../../shared/api/api-schemas';
import { toPipeSystem, exampleDraft } from '../system-draft';
import { candidateLabel, comparisonModel } from './comparison-model';

const point = {
  flow: 100,
  head: 20,
  flowPerPump: 50,
  percentOfBep: 95,
  region: 'preferred',
  inputPower: 0.8,
  efficiency: 0.5,
  warnings: [],
};
const candidate = {
  rank: 1,
  pumpId: 7,
  supplier: 'Test Supply',
  model: 'Test pump 7',
  modelCode: 'TP-7',
  arrangement: { installed: 3, running: 2 },
  operatingPoint: point,
  oneFailed: point,
  curve: [
    { flow: 0, head: 30 },
    { flow: 200, head: 10 },
  ],
  preferredRange: { flowMin: 80, flowMax: 120 },
} as unknown as SelectionCandidate;

describe('comparison model', () => {
  it('names how many run and a standby', () => {
    expect(candidateLabel(candidate)).toBe('Test pump 7 x2 + standby');
    expect(candidateLabel({ ...candidate, arrangement: { installed: 1, running: 1 } })).toBe('Test pump 7');
  });

  it('names the speed a variable-speed pump runs at, and hands its ratio to the chart', () => {
    const driven = { ...candidate, speed: { ratio: 0.75, rpm: 2174.6 } } as SelectionCandidate;
    expect(candidateLabel(driven)).toBe('Test pump 7 x2 + standby at 2175 rpm');
    const us = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' } as const;
    const design = { system: toPipeSystem(exampleDraft()), band: { flowMin: 90, flowMax: 130 }, units: us };
    const [fixed, atSpeed] = comparisonModel(design, [candidate, driven], us)!.candidates;
    expect([fixed.speedRatio, atSpeed.speedRatio]).toEqual([null, 0.75]);
  });

  it('draws the design in other units: 100 gpm is 378.5 L/min, 20 ft is 6.096 m', () => {
    const us = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' } as const;
    const si = { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm', power: 'kW' } as const;
    const model = comparisonModel(
      { system: toPipeSystem(exampleDraft()), band: { flowMin: 90, flowMax: 130 }, units: us },
      [candidate],
      si,
    )!;
    expect(model.flowUnit).toBe('L/min');
    // 1 US gal = 3.785411784 L exactly
    expect(model.candidates[0].operatingPoint.flow).toBeCloseTo(378.5411784, 6);
    expect(model.candidates[0].operatingPoint.head).toBeCloseTo(6.096, 9);
    // the system curve starts at the static head, 14.5 ft
    expect(model.systemCurve[0].head).toBeCloseTo(14.5 * 0.3048, 9);
    expect(
      comparisonModel({ system: toPipeSystem(exampleDraft()), band: { flowMin: 90, flowMax: 130 }, units: us }, [], si),
    ).toBeNull();
  });
});
