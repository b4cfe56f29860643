import type { EngineInputError, EngineIssue } from '../hydraulics/engine-issues';

/*
 * What the curve-table import has to say about a file, as data: a code and its values, with the
 * row (the file's line) and the column as the pointer into the file. Values are as the file gave
 * them (its units, its text), cut to a readable length. Sentences are made at the edge from one
 * table (import-issue-text.ts).
 */

/** How a number cell must look: the unit it is read in and its bounds, in that unit. */
export interface NumberRule {
  /** The cell's unit as the file names it (`gpm`, `%`, `fraction`); null when it has none. */
  unit: string | null;
  integer: boolean;
  min?: number;
  above?: number;
  max?: number;
}

/** The values each import issue carries, by code. */
export interface ImportIssueParams {
  /** The first line is not the format line. */
  'not-a-curve-table': { firstLine: string; formatLine: string };
  'unknown-format-version': { version: string; supported: number };
  'unknown-unit-line': { name: string; known: string[] };
  'unit-line-extra-value': { name: string };
  'unit-line-repeated': { name: string; firstRow: number };
  'not-a-currency': { value: string };
  'unknown-unit': { name: string; value: string; accepted: string[] };
  'unknown-column': { name: string; known: string[] };
  'column-repeated': { name: string };
  'column-missing': { name: string; required: string[] };
  'unit-line-missing': { name: string; accepted: string[] };
  'column-needs-unit-line': { name: string; directive: string };
  'file-empty': { formatLine: string };
  'no-header': Record<string, never>;
  'no-points': Record<string, never>;
  'file-too-large': { maxBytes: number };
  'too-many-rows': { maxRows: number };
  /** An issue stored before issues carried codes: its sentence as it was recorded. */
  'recorded-as-text': { message: string; expected?: string };
  /** Bytes that are not text in any accepted encoding (UTF-8, or UTF-16 with a byte-order mark). */
  'not-text': { reason: string; byte: number; accepted: string };
  'not-csv': { problem: string };
  'cell-beyond-header': { value: string; headerColumns: number };
  'model-code-blank': Record<string, never>;
  'not-a-model-code': { value: string };
  'pump-repeated': { modelCode: string; firstRow: number; lastRow: number };
  'too-many-points': { modelCode: string; maxPoints: number };
  'differs-from-first-row': { value: string; first: string; firstRow: number };
  'formula-text': { lead: string };
  'efficiency-looks-fractional': Record<string, never>;
  'name-blank': { maxLength: number };
  'text-too-long': { length: number; maxLength: number };
  'text-control-characters': Record<string, never>;
  'not-a-number': { value: string; rule: NumberRule; decimalComma: boolean };
  'number-out-of-range': { value: string; rule: NumberRule };
  'phases-unknown': { value: number };
  'choice-blank': { choices: string[] };
  'choice-unknown': { value: string; choices: string[] };
  'range-one-end': { region: 'preferred' | 'allowable' };
  'range-reversed': { region: 'preferred' | 'allowable'; min: number; max: number };
  'speed-range-one-end': Record<string, never>;
  'speed-range-reversed': { min: number; max: number };
  /** A speed range or fixed speeds given without speed_rpm, the speed the curve is for. */
  'speed-needs-nominal': Record<string, never>;
  'speed-range-misses-nominal': { min: number; max: number; nominal: number };
  /** A speed above maxRatio times the nominal speed (rpm). */
  'speed-above-nominal': { value: number; nominal: number; maxRatio: number };
  'speeds-not-a-list': { value: string };
  'point-value-blank': { unit: string };
  'too-few-points': { modelCode: string; count: number };
  'flow-not-increasing': { previousRow: number };
  'head-rise-refused': { previousRow: number; share: number; tolerated: number };
  'head-rise-flagged': { share: number };
  'value-on-some-points': { modelCode: string; value: 'power' | 'efficiency'; given: number; count: number };
  'npsh-on-few-points': { modelCode: string; count: number };
  /** The engine refused the pump's curve; its error says why, in SI. */
  'curve-refused': { modelCode: string; error: EngineInputError; pointRow: number | null };
  /** The engine's fit has something to say about the curve. */
  'fit-issue': { issue: EngineIssue };
  'bep-unknown': { reason: string };
  /** RMS and worst residual of the fit, m. */
  'poor-fit': { rmsHead: number; worstResidual: number };
  'range-beyond-points': { region: 'preferred' | 'allowable' };
}

export type ImportIssueCode = keyof ImportIssueParams;

/** One import issue as the importer makes it; the report adds its sentence (`message`, `expected`). */
export type ImportIssue = {
  [Code in ImportIssueCode]: {
    row: number | null;
    column: string | null;
    code: Code;
    params: ImportIssueParams[Code];
  };
}[ImportIssueCode];
