import { expect } from 'chai';
import {
  flowToSI,
  HydraulicsInputError,
  PIPE_SERIES,
  smallestSizeForVelocity,
  velocityFromSI,
  VELOCITY_WARNING_LIMIT,
} from '../../shared/hydraulics';

/*
 * The size suggestion beside a velocity warning, checked by continuity worked by hand from the
 * series' bores (ASTM D1785 Schedule 40 bores, as the pipe catalogue quotes them) and by brute force
 * over every size of every series.
 */

describe('smallest pipe size for a velocity limit', () => {
  it('suggests 3" Schedule 40 for 100 gpm at 5 ft/s: 2-1/2" runs 6.7 ft/s, 3" 4.3 ft/s (by hand)', () => {
    const flow = flowToSI(100, 'gpm');
    const size = smallestSizeForVelocity('pvc-sch40', flow);
    expect(size?.nominalSize).to.equal(3);
    // by hand: 100 gpm = 0.2228 ft3/s; 3" bore 3.068 in -> area 0.05134 ft2 -> 4.34 ft/s
    const area = (Math.PI * size!.insideDiameter ** 2) / 4;
    expect(velocityFromSI(flow / area, 'ft/s')).to.be.closeTo(4.34, 0.01);
  });

  it('takes a stricter limit: 100 gpm at 3 ft/s needs 4"', () => {
    const size = smallestSizeForVelocity('pvc-sch40', flowToSI(100, 'gpm'), 3 * 0.3048);
    expect(size?.nominalSize).to.equal(4);
  });

  it('is, for every series and a spread of flows, the smallest size a brute-force search over the series finds', () => {
    for (const series of PIPE_SERIES) {
      for (const flow of [1e-4, 5e-4, 2e-3, 1e-2, 5e-2]) {
        const velocities = series.sizes.map((size) => ({
          size,
          velocity: flow / ((Math.PI * size.insideDiameter ** 2) / 4),
        }));
        const passing = velocities.filter((entry) => entry.velocity <= VELOCITY_WARNING_LIMIT);
        const expected = passing.length
          ? passing.reduce((best, entry) => (entry.size.insideDiameter < best.size.insideDiameter ? entry : best)).size
          : null;
        expect(smallestSizeForVelocity(series.id, flow)?.id ?? null, `${series.id} at ${flow}`).to.equal(
          expected?.id ?? null,
        );
      }
    }
  });

  it('answers null for an unknown series and refuses a flow of zero naming the field', () => {
    expect(smallestSizeForVelocity('no-such-series', 0.001)).to.equal(null);
    expect(() => smallestSizeForVelocity('pvc-sch40', 0))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/flow');
  });
});
