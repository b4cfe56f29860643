import { expect } from 'chai';
import { HydraulicsInputError, PIPE_SERIES, PIPE_SIZES, pipeSizeById } from '../../shared/hydraulics';
import { type FluidsAnswer, fluidsReference } from './reference/fluids-reference';
import { refusalOf } from '../support/engine-refusal';

/** python3-fluids schedule names (fluids.piping.schedule_lookup) for each series with a standard. */
const FLUIDS_SCHEDULE: Record<string, string> = {
  'pvc-sch40': '40D1785',
  'pvc-sch80': '80D1785',
  'pvc-sdr21': 'DR21D2241',
  'pvc-sdr26': 'DR26D2241',
  'hdpe-dr11': 'DR11F2619IPS',
  'hdpe-dr17': 'DR17F2619IPS',
  'steel-sch40': '40',
};

/**
 * The standard dimension ratio of each metric series by outside diameter (mm): ISO 4427-2 (PE100
 * SDR 11 = PN 16, SDR 17 = PN 10) and ISO 1452-2 (PVC-U, design coefficient 2.5 to 90 mm and 2.0
 * from 110 mm: PN 10 is SDR 21 then 26, PN 16 SDR 13.6 then 17).
 */
const METRIC_DIMENSION_RATIO: Record<string, (outside: number) => number> = {
  'pe100-sdr11': () => 11,
  'pe100-sdr17': () => 17,
  'pvcu-pn10': (outside) => (outside <= 90 ? 21 : 26),
  'pvcu-pn16': (outside) => (outside <= 90 ? 13.6 : 17),
};

describe('pipe catalogue', () => {
  const sized = PIPE_SIZES.filter((size) => size.series in FLUIDS_SCHEDULE);
  let reference: FluidsAnswer;
  before(() => {
    reference = fluidsReference({
      pipes: sized.map((size): [string, number] => [FLUIDS_SCHEDULE[size.series], size.nominalSize]),
    });
  });

  it('matches python3-fluids nearest_pipe inside and outside diameters for every standard size', () => {
    sized.forEach((size, index) => {
      const [inside, outside] = reference.pipes[index];
      // fluids holds D1785 schedules exactly as tabulated; D2241 and F2619 walls rounded to 0.001 in
      // (two walls: 0.002 in on the bore) and B36.10M in rounded millimetres (within 0.002 in)
      const tolerance = size.series.startsWith('pvc-sch') ? 1e-9 : 0.002 * 0.0254;
      expect(size.insideDiameter, `${size.id} inside`).to.be.closeTo(inside, tolerance);
      expect(size.outsideDiameter, `${size.id} outside`).to.be.closeTo(outside, tolerance);
    });
  });

  it('covers 1/2" to 8" in every series where the standard has them', () => {
    expect(PIPE_SERIES.map((series) => series.id)).to.have.members([
      ...Object.keys(FLUIDS_SCHEDULE),
      'pvc-flex',
      ...Object.keys(METRIC_DIMENSION_RATIO),
    ]);
    for (const series of PIPE_SERIES.filter((entry) => !(entry.id in METRIC_DIMENSION_RATIO))) {
      expect(series.source, series.id).to.be.a('string').and.not.equal('');
      const nominals = series.sizes.map((size) => size.nominalSize);
      expect(Math.max(...nominals), series.id).to.be.oneOf([4, 8]);
    }
    expect(pipeSizeById('pvc-sch40-0.5').nominalLabel).to.equal('1/2"');
    expect(pipeSizeById('pvc-sch40-1.25').nominalLabel).to.equal('1-1/4"');
  });

  it('metric series: bore = OD - 2 x wall, each wall within -0.06/+0.2 mm of OD/SDR (ISO 4065 rounding), 20-250 mm', () => {
    for (const [seriesId, ratioOf] of Object.entries(METRIC_DIMENSION_RATIO)) {
      const series = PIPE_SERIES.find((entry) => entry.id === seriesId);
      expect(series?.source, seriesId).to.match(/ISO (4427|1452)-2/);
      const sizes = series?.sizes ?? [];
      expect(sizes.length, seriesId).to.be.at.least(13);
      expect(Math.max(...sizes.map((size) => size.nominalSize))).to.equal(250);
      for (const size of sizes) {
        const outsideMm = size.nominalSize;
        expect(size.outsideDiameter, size.id).to.be.closeTo(outsideMm / 1000, 1e-12);
        expect(size.nominalLabel).to.equal(`${outsideMm} mm`);
        const wallMm = ((size.outsideDiameter ?? 0) - size.insideDiameter) * 500;
        const nominalWall = outsideMm / ratioOf(outsideMm);
        expect(wallMm - nominalWall, `${size.id} wall ${wallMm.toFixed(2)} mm`).to.be.within(-0.06, 0.2);
      }
    }
    expect(pipeSizeById('pe100-sdr11-63').insideDiameter).to.be.closeTo(0.0514, 1e-12);
    expect(pipeSizeById('pvcu-pn16-110').insideDiameter).to.be.closeTo(0.0968, 1e-12);
    expect(pipeSizeById('pe100-sdr17-110').material).to.equal('hdpe');
    expect(pipeSizeById('pvcu-pn10-50').hazenWilliamsC).to.equal(150);
  });

  it('gives material defaults: C 150 and 0.0015 mm for plastic, C 120 and 0.045 mm for steel', () => {
    const pvc = pipeSizeById('pvc-sch40-3');
    expect(pvc.insideDiameter).to.be.closeTo(3.068 * 0.0254, 1e-12);
    expect(pvc.hazenWilliamsC).to.equal(150);
    expect(pvc.roughness).to.equal(1.5e-6);
    const steel = pipeSizeById('steel-sch40-2');
    expect(steel.hazenWilliamsC).to.equal(120);
    expect(steel.roughness).to.equal(4.5e-5);
    const hose = pipeSizeById('pvc-flex-1.5');
    expect(hose.insideDiameter).to.be.closeTo(1.5 * 0.0254, 1e-12);
    expect(hose.outsideDiameter).to.equal(null);
  });

  it('has unique, URL-safe ids', () => {
    const ids = PIPE_SIZES.map((size) => size.id);
    expect(new Set(ids).size).to.equal(ids.length);
    for (const id of ids) {
      expect(encodeURIComponent(id)).to.equal(id);
    }
  });

  it('rejects an unknown id with a typed error saying how ids are formed', () => {
    expect(() => pipeSizeById('pvc-sch40-7')).to.throw(HydraulicsInputError, /'<series>-<nominal inches>'/);
    const refusal = refusalOf(() => pipeSizeById('pvc-sch40-7', '/segments/2/pipeSizeId'));
    expect(refusal).to.deep.include({ code: 'unknown-pipe-size', pointer: '/segments/2/pipeSizeId' });
    expect((refusal.params as { series: string[] }).series.slice(0, 2)).to.deep.equal(['pvc-sch40', 'pvc-sch80']);
  });
});
