import { HydraulicsInputError } from './hydraulics-error';
import { METRIC_SERIES_DEFINITIONS, type MetricSeriesDefinition } from './metric-pipe-series';
import { diameterToSI } from './units';

/*
 * Pipe sizes by series. Inch dimensions are those the standards tabulate, as
 * are the millimetre dimensions of the metric series (ISO 4427, ISO 1452);
 * they are converted to metres once here. Hazen-Williams C and absolute
 * roughness are the series' defaults (a segment may override them):
 *   plastic (PVC, PE): C = 150 (USDA NRCS Conservation Practice Standard 430,
 *     Irrigation Pipeline; NFPA 13 annex table), roughness 0.0015 mm
 *     (drawn tubing / smooth plastic, Moody 1944);
 *   steel: C = 120 (a design value for steel in service; new steel ~140),
 *     roughness 0.045 mm (commercial steel, Moody 1944).
 */

const INCH = diameterToSI(1, 'in');

/** The pipe materials a segment may name, each with defaults in MATERIAL_DEFAULTS. */
export const PIPE_MATERIALS = ['pvc', 'hdpe', 'steel', 'flexible-pvc'] as const;
export type PipeMaterial = (typeof PIPE_MATERIALS)[number];

/**
 * Default Hazen-Williams C and absolute roughness (m) per material; sources above (USDA NRCS CPS
 * 430 and NFPA 13 for C = 150; Moody (1944) for roughness).
 * @example
 * MATERIAL_DEFAULTS.steel.roughness // => 4.5e-5
 * MATERIAL_DEFAULTS.pvc.hazenWilliamsC // => 150
 */
export const MATERIAL_DEFAULTS: Readonly<Record<PipeMaterial, { hazenWilliamsC: number; roughness: number }>> =
  Object.freeze({
    pvc: { hazenWilliamsC: 150, roughness: 0.0015e-3 },
    hdpe: { hazenWilliamsC: 150, roughness: 0.0015e-3 },
    'flexible-pvc': { hazenWilliamsC: 150, roughness: 0.0015e-3 },
    steel: { hazenWilliamsC: 120, roughness: 0.045e-3 },
  });

/** One pipe size. Lengths in m. */
export interface PipeSize {
  /** Stable, URL-safe id, e.g. `pvc-sch40-1.5`. */
  id: string;
  /** Series id, e.g. `pvc-sch40`. */
  series: string;
  /** Nominal size: inches for the inch series, e.g. 1.5; the outside diameter in mm for the metric ones, e.g. 63. */
  nominalSize: number;
  /** Nominal size as the trade writes it, e.g. `1-1/2"` or `63 mm`. */
  nominalLabel: string;
  material: PipeMaterial;
  /** Outside diameter, m; null where no dimensional standard fixes it (flexible hose). */
  outsideDiameter: number | null;
  /** Inside diameter, m. */
  insideDiameter: number;
  /** Default Hazen-Williams C. */
  hazenWilliamsC: number;
  /** Default absolute roughness, m. */
  roughness: number;
}

/** One series of sizes and the standard its dimensions come from. */
export interface PipeSeries {
  id: string;
  label: string;
  material: PipeMaterial;
  /** Where the dimensions come from. */
  source: string;
  sizes: readonly PipeSize[];
}

/** IPS (iron pipe size) outside diameters, in, shared by ASTM D1785, D2241, D3035 and ASME B36.10M. */
const IPS_OUTSIDE_DIAMETER: Readonly<Record<number, number>> = {
  0.5: 0.84,
  0.75: 1.05,
  1: 1.315,
  1.25: 1.66,
  1.5: 1.9,
  2: 2.375,
  2.5: 2.875,
  3: 3.5,
  4: 4.5,
  5: 5.563,
  6: 6.625,
  8: 8.625,
};

/** Schedule 40 minimum wall, in (ASTM D1785 Table 1 = ASME B36.10M Sch 40). */
const SCHEDULE_40_WALL: Readonly<Record<number, number>> = {
  0.5: 0.109,
  0.75: 0.113,
  1: 0.133,
  1.25: 0.14,
  1.5: 0.145,
  2: 0.154,
  2.5: 0.203,
  3: 0.216,
  4: 0.237,
  5: 0.258,
  6: 0.28,
  8: 0.322,
};

/** Schedule 80 minimum wall, in (ASTM D1785 Table 1). */
const SCHEDULE_80_WALL: Readonly<Record<number, number>> = {
  0.5: 0.147,
  0.75: 0.154,
  1: 0.179,
  1.25: 0.191,
  1.5: 0.2,
  2: 0.218,
  2.5: 0.276,
  3: 0.3,
  4: 0.337,
  5: 0.375,
  6: 0.432,
  8: 0.5,
};

const NOMINAL_LABELS: Readonly<Record<number, string>> = {
  0.5: '1/2"',
  0.75: '3/4"',
  1: '1"',
  1.25: '1-1/4"',
  1.5: '1-1/2"',
  2: '2"',
  2.5: '2-1/2"',
  3: '3"',
  4: '4"',
  5: '5"',
  6: '6"',
  8: '8"',
};

interface SeriesDefinition {
  id: string;
  label: string;
  material: PipeMaterial;
  source: string;
  nominalSizes: readonly number[];
  /** Outside and inside diameter in inches for a nominal size. */
  dimensionsInInches(nominal: number): { outside: number | null; inside: number };
}

const ALL_NOMINAL = [0.5, 0.75, 1, 1.25, 1.5, 2, 2.5, 3, 4, 5, 6, 8] as const;

function scheduleSeries(wall: Readonly<Record<number, number>>) {
  return (nominal: number) => {
    const outside = IPS_OUTSIDE_DIAMETER[nominal];
    return { outside, inside: outside - 2 * wall[nominal] };
  };
}

/**
 * Dimension-ratio pipe: minimum wall t = max(OD / DR, floor), ID = OD - 2t.
 * ASTM D2241 sets a 0.060 in floor on the wall of small sizes.
 */
function dimensionRatioSeries(ratio: number, wallFloor = 0) {
  return (nominal: number) => {
    const outside = IPS_OUTSIDE_DIAMETER[nominal];
    return { outside, inside: outside - 2 * Math.max(outside / ratio, wallFloor) };
  };
}

const SERIES_DEFINITIONS: readonly SeriesDefinition[] = [
  {
    id: 'pvc-sch40',
    label: 'PVC Schedule 40',
    material: 'pvc',
    source: 'ASTM D1785, Table 1 (outside diameter and minimum wall, Schedule 40)',
    nominalSizes: ALL_NOMINAL,
    dimensionsInInches: scheduleSeries(SCHEDULE_40_WALL),
  },
  {
    id: 'pvc-sch80',
    label: 'PVC Schedule 80',
    material: 'pvc',
    source: 'ASTM D1785, Table 1 (outside diameter and minimum wall, Schedule 80)',
    nominalSizes: ALL_NOMINAL,
    dimensionsInInches: scheduleSeries(SCHEDULE_80_WALL),
  },
  {
    id: 'pvc-sdr21',
    label: 'PVC SDR 21 (200 psi)',
    material: 'pvc',
    source: 'ASTM D2241 (IPS outside diameter, minimum wall = OD/21, at least 0.060 in); SDR 21 is tabulated from 3/4"',
    nominalSizes: ALL_NOMINAL.filter((n) => n >= 0.75),
    dimensionsInInches: dimensionRatioSeries(21, 0.06),
  },
  {
    id: 'pvc-sdr26',
    label: 'PVC SDR 26 (160 psi)',
    material: 'pvc',
    source: 'ASTM D2241 (IPS outside diameter, minimum wall = OD/26, at least 0.060 in); SDR 26 is tabulated from 1"',
    nominalSizes: ALL_NOMINAL.filter((n) => n >= 1),
    dimensionsInInches: dimensionRatioSeries(26, 0.06),
  },
  {
    id: 'hdpe-dr11',
    label: 'HDPE DR 11 (IPS)',
    material: 'hdpe',
    source: 'ASTM D3035 / F714 (IPS outside diameter, minimum wall = OD/11); bore from the minimum wall',
    nominalSizes: ALL_NOMINAL,
    dimensionsInInches: dimensionRatioSeries(11),
  },
  {
    id: 'hdpe-dr17',
    label: 'HDPE DR 17 (IPS)',
    material: 'hdpe',
    source: 'ASTM D3035 / F714 (IPS outside diameter, minimum wall = OD/17); from 2" as ASTM F2619 tabulates DR 17',
    nominalSizes: ALL_NOMINAL.filter((n) => n >= 2),
    dimensionsInInches: dimensionRatioSeries(17),
  },
  {
    id: 'steel-sch40',
    label: 'Steel Schedule 40',
    material: 'steel',
    source: 'ASME B36.10M (outside diameter and nominal wall, Schedule 40)',
    nominalSizes: ALL_NOMINAL,
    dimensionsInInches: scheduleSeries(SCHEDULE_40_WALL),
  },
  {
    id: 'pvc-flex',
    label: 'Flexible PVC hose (by nominal bore)',
    material: 'flexible-pvc',
    source:
      "Trade convention: flexible hose is sold by its bore, taken as the inside diameter; no dimensional standard fixes it, so check the maker's bore",
    nominalSizes: ALL_NOMINAL.filter((n) => n <= 4),
    dimensionsInInches: (nominal) => ({ outside: null, inside: nominal }),
  },
];

function sizeOf(
  definition: { id: string; material: PipeMaterial },
  nominal: number,
  nominalLabel: string,
  outsideDiameter: number | null,
  insideDiameter: number,
): PipeSize {
  return Object.freeze({
    id: `${definition.id}-${nominal}`,
    series: definition.id,
    nominalSize: nominal,
    nominalLabel,
    material: definition.material,
    outsideDiameter,
    insideDiameter,
    hazenWilliamsC: MATERIAL_DEFAULTS[definition.material].hazenWilliamsC,
    roughness: MATERIAL_DEFAULTS[definition.material].roughness,
  });
}

function buildMetricSeries(definition: MetricSeriesDefinition): PipeSeries {
  const sizes = Object.entries(definition.wallByOutsideDiameter).map(([outside, wall]) =>
    sizeOf(definition, Number(outside), `${outside} mm`, Number(outside) / 1000, (Number(outside) - 2 * wall) / 1000),
  );
  const { id, label, material, source } = definition;
  return Object.freeze({ id, label, material, source, sizes: Object.freeze(sizes) });
}

function buildSeries(definition: SeriesDefinition): PipeSeries {
  const sizes = definition.nominalSizes.map((nominal): PipeSize => {
    const inches = definition.dimensionsInInches(nominal);
    return sizeOf(
      definition,
      nominal,
      NOMINAL_LABELS[nominal],
      inches.outside === null ? null : inches.outside * INCH,
      inches.inside * INCH,
    );
  });
  return Object.freeze({
    id: definition.id,
    label: definition.label,
    material: definition.material,
    source: definition.source,
    sizes: Object.freeze(sizes),
  });
}

/**
 * Every series in the catalogue, each with its sizes and the standard its dimensions come from.
 * @example
 * PIPE_SERIES.find((series) => series.id === 'pvc-sch40').sizes.length > 0 // => true
 */
export const PIPE_SERIES: readonly PipeSeries[] = Object.freeze([
  ...SERIES_DEFINITIONS.map(buildSeries),
  ...METRIC_SERIES_DEFINITIONS.map(buildMetricSeries),
]);

/**
 * Every pipe size in the catalogue, bores in m from the inch dimensions of each series' standard.
 * @example
 * // 3" Schedule 40 PVC: ASTM D1785 bore 3.068 in; python3-fluids nearest_pipe(NPS=3, schedule='40D1785') gives 0.0779272 m
 * PIPE_SIZES.find((size) => size.id === 'pvc-sch40-3').insideDiameter // => 0.0779272
 */
export const PIPE_SIZES: readonly PipeSize[] = Object.freeze(PIPE_SERIES.flatMap((series) => series.sizes));

const SIZES_BY_ID: ReadonlyMap<string, PipeSize> = new Map(PIPE_SIZES.map((size) => [size.id, size]));

/**
 * The catalogue size with this id, e.g. `pvc-sch40-3`.
 * Unknown id -> HydraulicsInputError naming the series and how ids are formed.
 * @param id - `<series>-<nominal inches>`, e.g. `pvc-sch40-1.5`, or `<series>-<outside mm>`, e.g. `pe100-sdr11-63`
 * @param field - JSON pointer named when the id is unknown
 * @returns the size: bores in m, default C and roughness (m)
 * @example
 * // 2" Schedule 40 PVC, ASTM D1785: bore 2.067 in (the handbook's table; python3-fluids nearest_pipe agrees)
 * pipeSizeById('pvc-sch40-2').insideDiameter // => 0.0525018
 * pipeSizeById('pvc-sch40-2').hazenWilliamsC // => 150
 * // 63 mm PE100 SDR 11, ISO 4427-2: wall 5.8 mm, bore 63 - 2 x 5.8 = 51.4 mm
 * pipeSizeById('pe100-sdr11-63').insideDiameter // => 0.0514
 */
export function pipeSizeById(id: string, field = '/pipeSizeId'): PipeSize {
  const size = SIZES_BY_ID.get(id);
  if (!size) {
    throw new HydraulicsInputError({
      code: 'unknown-pipe-size',
      params: { value: id, series: PIPE_SERIES.map((series) => series.id) },
      pointer: field,
    });
  }
  return size;
}
