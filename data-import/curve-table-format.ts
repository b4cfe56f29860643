import { FLOW_UNITS, HEAD_UNITS, POWER_UNITS, type PowerUnit } from '../shared/hydraulics';

/*
 * Riffle's own curve-table format, version 1 (described with an example in README.md): a format
 * line, unit lines, a header row, then one row per curve point.
 */

export const curveTableFormatName = 'riffle-curve-table';
export const curveTableFormatVersion = 1;

/** Limits that keep one upload from holding the server: the page and the API say them in their messages. */
export const curveTableLimits = {
  maxFileBytes: 16 * 1024 * 1024,
  maxPointRows: 100_000,
  maxPointsPerPump: 60,
  /** Longest record (characters) the reader accepts before it gives up on the file. */
  maxRecordCharacters: 64 * 1024,
  /** Errors listed in a report; the rest are counted. */
  maxErrorsListed: 200,
} as const;

/** The engine's power units (W, kW, mechanical hp). */
export const powerUnits = POWER_UNITS;
export const efficiencyUnits = ['%', 'fraction'] as const;
export const sizeUnits = ['mm', 'in'] as const;
export const powerBases = ['shaft', 'electrical'] as const;

export type PowerUnitName = PowerUnit;
export type EfficiencyUnitName = (typeof efficiencyUnits)[number];
export type SizeUnitName = (typeof sizeUnits)[number];

/** The unit lines a file may give, each with the values it accepts. */
export const unitDirectives = {
  'flow-unit': FLOW_UNITS,
  'head-unit': HEAD_UNITS,
  'power-unit': powerUnits,
  'efficiency-unit': efficiencyUnits,
  'npsh-unit': HEAD_UNITS,
  'size-unit': sizeUnits,
  'power-basis': powerBases,
} as const;

export type UnitDirective = keyof typeof unitDirectives;
/** `currency` takes any three-letter ISO 4217 code; `note` lines are kept with nothing else done. */
export const freeDirectives = ['currency', 'note'] as const;

/** Columns about the pump: given on its first row, then blank or repeated on its other rows. */
export const pumpColumns = [
  'model_code',
  'display_name',
  'kind',
  'speed_rpm',
  'speed_min_rpm',
  'speed_max_rpm',
  'speeds_rpm',
  'voltage',
  'phases',
  'full_load_current',
  'discharge_size',
  'solids_size',
  'list_price',
  'motor_efficiency',
  'status',
  'preferred_flow_min',
  'preferred_flow_max',
  'allowable_flow_min',
  'allowable_flow_max',
  'notes',
] as const;

/** Columns of the curve point on each row. */
export const pointColumns = ['flow', 'head', 'power', 'efficiency', 'npsh_required'] as const;

export type PumpColumn = (typeof pumpColumns)[number];
export type PointColumn = (typeof pointColumns)[number];
export type CurveTableColumn = PumpColumn | PointColumn;

export const requiredColumns: readonly CurveTableColumn[] = ['model_code', 'display_name', 'kind', 'flow', 'head'];

/** The unit line a column needs before it may be used. */
export const columnUnitDirective: Partial<Record<CurveTableColumn, UnitDirective | 'currency'>> = {
  power: 'power-unit',
  efficiency: 'efficiency-unit',
  npsh_required: 'npsh-unit',
  discharge_size: 'size-unit',
  solids_size: 'size-unit',
  list_price: 'currency',
};

/**
 * A head rise between neighbouring points up to this fraction of the curve's highest head is
 * flagged and the fit holds the head level there; a larger rise is refused. Our own rule: small
 * rises near shut-off are common in published tables, a large one is usually a typing error.
 */
export const headRiseToleratedFraction = 0.02;

/** Characters that make a spreadsheet treat a cell as a formula (OWASP, "CSV Injection"). */
export const formulaLeadCharacters = ['=', '+', '-', '@'] as const;
