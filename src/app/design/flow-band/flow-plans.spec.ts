import { bandFromModules, bandFromTurnover, bandFromWeir } from './flow-plans';

// Figures worked by hand from 1 gpm = 60 gph and 1 gal = 3.785411784 L (exact).
describe('flow plans (rules of thumb, common practice)', () => {
  it('multiplies modules by the flow each wants', () => {
    expect(bandFromModules(3, 30, 45)).toEqual({ flowMin: 90, flowMax: 135 });
  });

  it('turns a 6,000 gal pond over once to twice an hour: 100 to 200 gpm', () => {
    const band = bandFromTurnover(6000, 'gal', 1, 2, 'gpm');
    expect(band.flowMin).toBeCloseTo(100, 9);
    expect(band.flowMax).toBeCloseTo(200, 9);
  });

  it('takes a metric volume: 10 m3 once an hour is 166.67 L/min', () => {
    expect(bandFromTurnover(10, 'm3', 1, 1, 'L/min').flowMin).toBeCloseTo(10_000 / 60, 6);
  });

  it('gives a 36 in weir with an average to heavy sheet 60 to 90 gpm', () => {
    const band = bandFromWeir(36, 'in', 100, 150, 'gpm');
    expect(band.flowMin).toBeCloseTo(60, 9);
    expect(band.flowMax).toBeCloseTo(90, 9);
  });

  it('reads a weir width in millimetres: 914.4 mm is 36 in', () => {
    expect(bandFromWeir(914.4, 'mm', 100, 100, 'gpm').flowMin).toBeCloseTo(60, 9);
  });
});
