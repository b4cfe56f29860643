import type { PipeMaterial } from './pipe-catalogue';

/*
 * The metric pipe series of the catalogue (pipe-catalogue.ts builds their sizes): PE100 to
 * ISO 4427-2 and PVC-U to ISO 1452-2, by outside diameter and nominal wall in mm.
 */

/** A metric series: outside diameter (mm) -> nominal wall (mm) as its standard tabulates them. */
export interface MetricSeriesDefinition {
  id: string;
  label: string;
  material: PipeMaterial;
  source: string;
  wallByOutsideDiameter: Readonly<Record<number, number>>;
}

/*
 * Metric walls, mm, quoted from memory of the standards' tables (ISO 4427-2:2019 Table 2 for PE,
 * ISO 1452-2:2009 Table 2 for PVC-U, both from the wall series of ISO 4065): check them against
 * the standard before relying on one. Each lies within 0.2 mm of OD / SDR (the tests check it).
 */
const PE100_SDR11_WALL = {
  20: 2.0,
  25: 2.3,
  32: 2.9,
  40: 3.7,
  50: 4.6,
  63: 5.8,
  75: 6.8,
  90: 8.2,
  110: 10.0,
  125: 11.4,
  140: 12.7,
  160: 14.6,
  180: 16.4,
  200: 18.2,
  225: 20.5,
  250: 22.7,
};
const SDR17_WALL = {
  40: 2.4,
  50: 3.0,
  63: 3.8,
  75: 4.5,
  90: 5.4,
  110: 6.6,
  125: 7.4,
  140: 8.3,
  160: 9.5,
  180: 10.7,
  200: 11.9,
  225: 13.4,
  250: 14.8,
};
/** PVC-U PN 10: SDR 21 to 90 mm (design coefficient 2.5), SDR 26 from 110 mm (2.0). */
const PVC_U_PN10_WALL = {
  32: 1.6,
  40: 1.9,
  50: 2.4,
  63: 3.0,
  75: 3.6,
  90: 4.3,
  110: 4.2,
  125: 4.8,
  140: 5.4,
  160: 6.2,
  180: 6.9,
  200: 7.7,
  225: 8.6,
  250: 9.6,
};
/** PVC-U PN 16: SDR 13.6 to 90 mm, SDR 17 from 110 mm. */
const PVC_U_PN16_WALL = {
  20: 1.5,
  25: 1.9,
  32: 2.4,
  40: 3.0,
  50: 3.7,
  63: 4.7,
  75: 5.6,
  90: 6.7,
  110: 6.6,
  125: 7.4,
  140: 8.3,
  160: 9.5,
  180: 10.7,
  200: 11.9,
  225: 13.4,
  250: 14.8,
};

/**
 * The metric series, each with its standard and walls (mm by outside diameter in mm).
 * @example
 * METRIC_SERIES_DEFINITIONS[0].wallByOutsideDiameter[63] // => 5.8
 */
export const METRIC_SERIES_DEFINITIONS: readonly MetricSeriesDefinition[] = [
  {
    id: 'pe100-sdr11',
    label: 'PE100 SDR 11 (PN 16)',
    material: 'hdpe',
    source:
      'ISO 4427-2 (outside diameter and nominal wall, SDR 11); bore = OD - 2 x wall; walls quoted from memory of the table',
    wallByOutsideDiameter: PE100_SDR11_WALL,
  },
  {
    id: 'pe100-sdr17',
    label: 'PE100 SDR 17 (PN 10)',
    material: 'hdpe',
    source:
      'ISO 4427-2 (outside diameter and nominal wall, SDR 17); bore = OD - 2 x wall; walls quoted from memory of the table',
    wallByOutsideDiameter: SDR17_WALL,
  },
  {
    id: 'pvcu-pn10',
    label: 'PVC-U PN 10 (metric)',
    material: 'pvc',
    source:
      'ISO 1452-2 (outside diameter and nominal wall, PN 10: SDR 21 to 90 mm, SDR 26 from 110 mm); bore = OD - 2 x wall; walls quoted from memory of the table',
    wallByOutsideDiameter: PVC_U_PN10_WALL,
  },
  {
    id: 'pvcu-pn16',
    label: 'PVC-U PN 16 (metric)',
    material: 'pvc',
    source:
      'ISO 1452-2 (outside diameter and nominal wall, PN 16: SDR 13.6 to 90 mm, SDR 17 from 110 mm); bore = OD - 2 x wall; walls quoted from memory of the table',
    wallByOutsideDiameter: PVC_U_PN16_WALL,
  },
];
