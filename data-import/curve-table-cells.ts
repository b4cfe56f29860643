import type { ImportIssue, ImportIssueCode, ImportIssueParams, NumberRule } from '../shared/messages/import-issues';
import { diameterToSI, flowToSI, headToSI, powerToSI, type FlowUnit, type HeadUnit } from '../shared/hydraulics';
import { MAX_SPEED_RATIO } from '../shared/hydraulics/pump-speeds';
import { pumpKinds, pumpStatuses } from '../shared/vocabularies';
import {
  curveTableLimits,
  formulaLeadCharacters,
  type CurveTableColumn,
  type PowerUnitName,
  type UnitDirective,
} from './curve-table-format';
import type { ReadPoint, ReadPumpDetails } from './curve-table-reader';

/*
 * The cell rules of a curve table: each column's parse and check, turning a row's text cells into
 * SI values or issues naming the row and the column. Pure functions on a row and the file's
 * context (its units, its decimal mark, the issue list), so the reader's state holds only where it
 * is in the file.
 */

/** What a cell rule needs of the file: where issues go, its decimal mark and its unit lines. */
export interface CellContext {
  readonly errors: IssueList;
  readonly decimalComma: boolean;
  unitOf(directive: UnitDirective | 'currency'): string | undefined;
}

const numberPattern = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

type Issue = ImportIssue;

/** An issue at a row (the file's line) and column, with its code's values. */
export function issue<Code extends ImportIssueCode>(
  row: number | null,
  column: string | null,
  code: Code,
  params: ImportIssueParams[Code],
): Issue {
  return { row, column, code, params } as Issue;
}

/** What the cells of one row say, before the pump is assembled. */
export interface RowValues {
  row: number;
  cells: Partial<Record<CurveTableColumn, string>>;
}

/** Collects errors, listing the first ones and counting the rest. */
export class IssueList {
  readonly listed: Issue[] = [];
  omitted = 0;

  add(entry: Issue): void {
    if (this.listed.length < curveTableLimits.maxErrorsListed) this.listed.push(entry);
    else this.omitted += 1;
  }

  get count(): number {
    return this.listed.length + this.omitted;
  }
}

function textCell(
  cells: CellContext,
  values: RowValues,
  column: 'display_name' | 'notes',
  maxLength: number,
  required: boolean,
): string | null {
  let text = values.cells[column] ?? '';
  if (text.startsWith("'") && formulaLeadCharacters.some((character) => text[1] === character)) text = text.slice(1);
  if (text === '') {
    if (required) cells.errors.add(issue(values.row, column, 'name-blank', { maxLength }));
    return null;
  }
  if (text.length > maxLength) {
    cells.errors.add(issue(values.row, column, 'text-too-long', { length: text.length, maxLength }));
    return null;
  }
  // eslint-disable-next-line no-control-regex -- control characters are exactly what this rule refuses
  if (/[\u0000-\u0008\u000B\u000C\u000E-\u001F]/.test(text)) {
    cells.errors.add(issue(values.row, column, 'text-control-characters', {}));
    return null;
  }
  return text;
}

/** A number cell, or undefined when blank; an issue (and null) when it is not a number in range. */
export function numberCell(
  cells: CellContext,
  values: RowValues,
  column: CurveTableColumn,
  range: Omit<NumberRule, 'integer'> & { integer?: boolean },
): number | null | undefined {
  const cell = values.cells[column];
  if (cell === undefined || cell === '') return undefined;
  const text = cells.decimalComma ? cell.replace(',', '.') : cell;
  // Built only for an error: this runs for every cell of a large file.
  const rule = (): NumberRule => ({ ...range, integer: range.integer ?? false });
  if (!numberPattern.test(text)) {
    cells.errors.add(
      issue(values.row, column, 'not-a-number', {
        value: cell.slice(0, 40),
        rule: rule(),
        decimalComma: cells.decimalComma,
      }),
    );
    return null;
  }
  const value = Number(text);
  const outOfRange =
    !Number.isFinite(value) ||
    (range.integer && !Number.isInteger(value)) ||
    (range.min !== undefined && value < range.min) ||
    (range.above !== undefined && value <= range.above) ||
    (range.max !== undefined && value > range.max);
  if (outOfRange) {
    cells.errors.add(issue(values.row, column, 'number-out-of-range', { value: cell.slice(0, 40), rule: rule() }));
    return null;
  }
  return value;
}

function choiceCell<T extends string>(
  cells: CellContext,
  values: RowValues,
  column: CurveTableColumn,
  choices: readonly T[],
  fallback?: T,
): T | null {
  const cell = values.cells[column] ?? '';
  if (cell === '' && fallback) return fallback;
  if (!(choices as readonly string[]).includes(cell)) {
    cells.errors.add(
      cell === ''
        ? issue(values.row, column, 'choice-blank', { choices: [...choices] })
        : issue(values.row, column, 'choice-unknown', { value: cell.slice(0, 40), choices: [...choices] }),
    );
    return null;
  }
  return cell as T;
}

export function readDetails(cells: CellContext, values: RowValues): ReadPumpDetails {
  const sizeUnit = cells.unitOf('size-unit') === 'in' ? 'in' : 'mm';
  const size = (column: 'discharge_size' | 'solids_size') => {
    const value = numberCell(cells, values, column, { unit: sizeUnit, above: 0, max: sizeUnit === 'in' ? 40 : 1000 });
    return typeof value === 'number' ? diameterToSI(value, sizeUnit) * 1000 : null;
  };
  const price = numberCell(cells, values, 'list_price', { unit: cells.unitOf('currency') ?? null, min: 0, max: 1e9 });
  const motor = numberCell(cells, values, 'motor_efficiency', { unit: '%', min: 10, max: 100 });
  const current = numberCell(cells, values, 'full_load_current', { unit: 'A', above: 0, max: 1000 });
  const phases = numberCell(cells, values, 'phases', { unit: null, integer: true, min: 1, max: 3 });
  if (phases === 2) cells.errors.add(issue(values.row, 'phases', 'phases-unknown', { value: phases }));
  const nominalSpeedRpm = numberCell(cells, values, 'speed_rpm', speedRule) ?? null;
  return {
    displayName: textCell(cells, values, 'display_name', 160, true) ?? '',
    kind: choiceCell(cells, values, 'kind', pumpKinds) ?? 'submersible',
    nominalSpeedRpm,
    ...readSpeeds(cells, values, nominalSpeedRpm),
    voltageV: numberCell(cells, values, 'voltage', { unit: 'V', integer: true, min: 1, max: 1000 }) ?? null,
    phaseCount: phases === 2 ? null : (phases ?? null),
    fullLoadCurrentA: current ?? null,
    dischargeSizeMm: size('discharge_size'),
    solidsHandlingMm: size('solids_size'),
    listPrice: typeof price === 'number' ? Math.round(price * 100) / 100 : null,
    priceCurrency: typeof price === 'number' ? (cells.unitOf('currency') ?? null) : null,
    motorEfficiency: typeof motor === 'number' ? motor / 100 : null,
    status: choiceCell(cells, values, 'status', pumpStatuses, 'active') ?? 'active',
    notes: textCell(cells, values, 'notes', 2000, false),
  };
}

const speedRule = { unit: 'rpm', integer: true, min: 100, max: 20000 } as const;

/**
 * The speeds beside the nominal one: `speed_min_rpm`/`speed_max_rpm` (a drive's continuous range,
 * both or neither, min < max, holding the nominal speed, at most MAX_SPEED_RATIO times it) and
 * `speeds_rpm` (a multi-speed motor's speeds, `1450;2900`, ascending, each at most the nominal
 * speed: the curve table holds the curve at speed_rpm, and a multi-speed pump's curve is
 * published at its top speed, the lower ones scaled down from it). Both need speed_rpm. A bad
 * value is an issue at its row and column, and the pump keeps no speeds from that cell.
 */
function readSpeeds(
  cells: CellContext,
  values: RowValues,
  nominal: number | null,
): { speedMinRpm: number | null; speedMaxRpm: number | null; fixedSpeedsRpm: number[] | null } {
  const none = { speedMinRpm: null, speedMaxRpm: null, fixedSpeedsRpm: null };
  const min = numberCell(cells, values, 'speed_min_rpm', speedRule);
  const max = numberCell(cells, values, 'speed_max_rpm', speedRule);
  const fixed = speedList(cells, values);
  const refuse = (entry: Issue) => {
    cells.errors.add(entry);
    return none;
  };
  if (min === null || max === null || fixed === null) return none;
  const hasRange = min !== undefined || max !== undefined;
  if (!hasRange && fixed === undefined) return none;
  if (nominal === null) {
    // a speed_rpm cell that is there but bad has its own issue already
    if ((values.cells.speed_rpm ?? '') !== '') return none;
    const column = hasRange ? (min !== undefined ? 'speed_min_rpm' : 'speed_max_rpm') : 'speeds_rpm';
    return refuse(issue(values.row, column, 'speed-needs-nominal', {}));
  }
  if (hasRange) {
    if (min === undefined || max === undefined) {
      const missing = min === undefined ? 'speed_min_rpm' : 'speed_max_rpm';
      return refuse(issue(values.row, missing, 'speed-range-one-end', {}));
    }
    if (!(max > min)) return refuse(issue(values.row, 'speed_max_rpm', 'speed-range-reversed', { min, max }));
    if (nominal < min || nominal > max) {
      const column = nominal < min ? 'speed_min_rpm' : 'speed_max_rpm';
      return refuse(issue(values.row, column, 'speed-range-misses-nominal', { min, max, nominal }));
    }
    if (max > MAX_SPEED_RATIO * nominal)
      return refuse(
        issue(values.row, 'speed_max_rpm', 'speed-above-nominal', { value: max, nominal, maxRatio: MAX_SPEED_RATIO }),
      );
  }
  const above = fixed?.find((speed) => speed > nominal);
  if (above !== undefined)
    return refuse(issue(values.row, 'speeds_rpm', 'speed-above-nominal', { value: above, nominal, maxRatio: 1 }));
  return {
    speedMinRpm: hasRange ? (min as number) : null,
    speedMaxRpm: hasRange ? (max as number) : null,
    fixedSpeedsRpm: fixed ?? null,
  };
}

/** `speeds_rpm`: undefined when blank, null (with an issue) when it is not an ascending list of whole rpm. */
function speedList(cells: CellContext, values: RowValues): number[] | null | undefined {
  const cell = (values.cells.speeds_rpm ?? '').trim();
  if (cell === '') return undefined;
  const parts = cell.split(';').map((part) => part.trim());
  const speeds = parts.map(Number);
  const fine =
    parts.every((part) => /^\d{3,5}$/.test(part)) &&
    speeds.every(
      (speed, index) => speed >= speedRule.min && speed <= speedRule.max && (index === 0 || speed > speeds[index - 1]),
    );
  if (!fine) {
    cells.errors.add(issue(values.row, 'speeds_rpm', 'speeds-not-a-list', { value: cell.slice(0, 40) }));
    return null;
  }
  return speeds;
}

export function readRange(
  cells: CellContext,
  values: RowValues,
  region: 'preferred' | 'allowable',
): { flowMin: number; flowMax: number } | null {
  const flowUnit = cells.unitOf('flow-unit') as FlowUnit;
  const minColumn = `${region}_flow_min` as const;
  const maxColumn = `${region}_flow_max` as const;
  const min = numberCell(cells, values, minColumn, { unit: flowUnit, min: 0 });
  const max = numberCell(cells, values, maxColumn, { unit: flowUnit, above: 0 });
  if (min === null || max === null) return null;
  if (min === undefined && max === undefined) return null;
  if (min === undefined || max === undefined) {
    const missing = min === undefined ? minColumn : maxColumn;
    cells.errors.add(issue(values.row, missing, 'range-one-end', { region }));
    return null;
  }
  if (!(max > min)) {
    cells.errors.add(issue(values.row, maxColumn, 'range-reversed', { region, min, max }));
    return null;
  }
  return { flowMin: flowToSI(min, flowUnit), flowMax: flowToSI(max, flowUnit) };
}

export function readPoint(cells: CellContext, values: RowValues): ReadPoint | null {
  const flowUnit = cells.unitOf('flow-unit') as FlowUnit;
  const headUnit = cells.unitOf('head-unit') as HeadUnit;
  const flow = numberCell(cells, values, 'flow', { unit: flowUnit, min: 0 });
  // zero head is the open-flow point, allowed on a pump's last row only (the engine's rule)
  const head = numberCell(cells, values, 'head', { unit: headUnit, min: 0 });
  for (const [column, value] of [
    ['flow', flow],
    ['head', head],
  ] as const) {
    if (value === undefined)
      cells.errors.add(
        issue(values.row, column, 'point-value-blank', { unit: column === 'flow' ? flowUnit : headUnit }),
      );
  }
  const powerUnit = cells.unitOf('power-unit') as PowerUnitName | undefined;
  const power = numberCell(cells, values, 'power', { unit: powerUnit ?? null, min: 0 });
  const efficiencyUnit = cells.unitOf('efficiency-unit');
  const efficiency = numberCell(cells, values, 'efficiency', {
    unit: efficiencyUnit === '%' ? '%' : 'fraction',
    min: 0,
    max: efficiencyUnit === '%' ? 100 : 1,
  });
  const npshUnit = cells.unitOf('npsh-unit') as HeadUnit | undefined;
  const npsh = numberCell(cells, values, 'npsh_required', { unit: npshUnit ?? null, above: 0 });
  if (typeof flow !== 'number' || typeof head !== 'number' || power === null || efficiency === null || npsh === null)
    return null;
  return {
    row: values.row,
    flow: flowToSI(flow, flowUnit),
    head: headToSI(head, headUnit),
    ...(power !== undefined && powerUnit ? { power: powerToSI(power, powerUnit) } : {}),
    ...(efficiency !== undefined ? { efficiency: efficiencyUnit === '%' ? efficiency / 100 : efficiency } : {}),
    ...(npsh !== undefined && npshUnit ? { npshRequired: headToSI(npsh, npshUnit) } : {}),
  };
}
