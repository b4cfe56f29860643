import { createHash } from 'node:crypto';
import { Readable, Transform, pipeline, type TransformCallback } from 'node:stream';
import { parse, CsvError } from 'csv-parse';
import { diameterToSI, flowToSI, headToSI, powerToSI, type FlowUnit, type HeadUnit } from '../shared/hydraulics';
import type { CurveFileUnits, CurveImportIssue } from '../shared/api/api-schemas';
import { pumpKinds, pumpStatuses, type PumpKind, type PumpStatus } from '../shared/vocabularies';
import {
  columnUnitDirective,
  curveTableFormatName,
  curveTableFormatVersion,
  curveTableLimits,
  formulaLeadCharacters,
  freeDirectives,
  pointColumns,
  pumpColumns,
  requiredColumns,
  unitDirectives,
  type CurveTableColumn,
  type PowerUnitName,
  type PumpColumn,
  type UnitDirective,
} from './curve-table-format';

/*
 * Reads a curve-table file as a stream (csv-parse), checks every cell and converts the numbers to
 * SI. Each problem is an issue naming the file's line and the column. Checks that need a whole
 * pump (point count, rising head, the fit) are in pump-curve-check.ts.
 */

/** One curve point as read, SI: m3/s, m, W, fraction, m. */
export interface ReadPoint {
  row: number;
  flow: number;
  head: number;
  power?: number;
  efficiency?: number;
  npshRequired?: number;
}

/** A pump's details as read (sizes in mm). */
export interface ReadPumpDetails {
  displayName: string;
  kind: PumpKind;
  nominalSpeedRpm: number | null;
  voltageV: number | null;
  phaseCount: number | null;
  dischargeSizeMm: number | null;
  solidsHandlingMm: number | null;
  listPrice: number | null;
  priceCurrency: string | null;
  status: PumpStatus;
  notes: string | null;
}

export interface ReadPump {
  modelCode: string;
  firstRow: number;
  lastRow: number;
  details: ReadPumpDetails;
  /** Supplier-declared flow ranges, m3/s. */
  preferred: { flowMin: number; flowMax: number } | null;
  allowable: { flowMin: number; flowMax: number } | null;
  points: ReadPoint[];
  warnings: CurveImportIssue[];
  /** True when one of its rows had an error: the whole-pump checks would only repeat it. */
  hasRowErrors: boolean;
}

export interface ReadCurveTable {
  formatVersion: number | null;
  fileUnits: CurveFileUnits | null;
  pumps: ReadPump[];
  pointRowCount: number;
  fileChecksum: string;
  fileBytes: number;
  errors: CurveImportIssue[];
  warnings: CurveImportIssue[];
}

export interface ReadOptions {
  maxFileBytes?: number;
  maxPointRows?: number;
  /** Called as bytes are read, for a progress bar. */
  onBytes?: (bytesRead: number) => void;
}

class FileTooLargeError extends Error {}

/** Counts and hashes the bytes going through, and stops the stream past the size limit. */
class CountingHash extends Transform {
  readonly hash = createHash('sha256');
  bytes = 0;

  constructor(
    private readonly limit: number,
    private readonly onBytes?: (bytesRead: number) => void,
  ) {
    super();
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    this.bytes += chunk.length;
    if (this.bytes > this.limit) {
      callback(
        new FileTooLargeError(
          `the file is larger than ${Math.round(this.limit / 1024 / 1024)} MiB; split it into smaller files`,
        ),
      );
      return;
    }
    this.hash.update(chunk);
    this.onBytes?.(this.bytes);
    callback(null, chunk);
  }
}

/** The delimiter of the format line: `;` when it comes before any `,`, else `,`. */
function detectDelimiter(start: string): ';' | ',' {
  const firstLine =
    start
      .replace(/^\uFEFF/, '')
      .split(/\r?\n/)
      .find((line) => line.trim() !== '' && !line.trimStart().startsWith('#')) ?? '';
  const semicolon = firstLine.indexOf(';');
  const comma = firstLine.indexOf(',');
  return semicolon >= 0 && (comma < 0 || semicolon < comma) ? ';' : ',';
}

/** How far the reader looks for the header row before it treats the whole file as one part. */
const preambleSearchBytes = 64 * 1024;

interface SplitFile {
  delimiter: ';' | ',';
  /** The format and unit lines, up to the header row. */
  preamble: Buffer;
  /** From the header row on: what was read of it so far. */
  rest: Buffer;
  /** Lines in the preamble, to number the rest's lines as the file's. */
  preambleLines: number;
}

/**
 * Reads until the header row (a line starting with model_code) and splits there. The two parts
 * are parsed apart so that csv-parse sees the header as its first record and every point row
 * of the same length, the case its column checks are fast for.
 */
async function splitAtHeader(source: AsyncIterator<Buffer>): Promise<SplitFile> {
  let buffer = Buffer.alloc(0);
  let headerAt = -1;
  for (;;) {
    // latin1 keeps one character per byte, so positions in the text are byte offsets.
    const text = buffer.toString('latin1');
    const match = /(^|\n)(\xEF\xBB\xBF)?[ \t]*"?model_code/.exec(text);
    if (match) {
      headerAt = match.index + match[1].length;
      break;
    }
    if (buffer.length > preambleSearchBytes) break;
    const next = await source.next();
    if (next.done) break;
    buffer = Buffer.concat([buffer, next.value]);
  }
  const preamble = headerAt >= 0 ? buffer.subarray(0, headerAt) : buffer;
  const rest = headerAt >= 0 ? buffer.subarray(headerAt) : Buffer.alloc(0);
  const preambleText = preamble.toString('utf8');
  return {
    delimiter: detectDelimiter(headerAt >= 0 ? preambleText : buffer.toString('utf8')),
    preamble,
    rest,
    preambleLines: headerAt >= 0 ? (preambleText.match(/\n/g) ?? []).length : 0,
  };
}

function csvParser(delimiter: ';' | ',') {
  return parse({
    bom: true,
    delimiter,
    relax_column_count: true,
    skip_empty_lines: true,
    skip_records_with_empty_values: true,
    trim: true,
    comment: '#',
    comment_no_infix: true,
    info: true,
    max_record_size: curveTableLimits.maxRecordCharacters,
  });
}

/** The records of a byte stream with the file's line numbers. */
async function* csvRecords(
  chunks: AsyncIterable<Buffer>,
  delimiter: ';' | ',',
  lineOffset: number,
): AsyncGenerator<{ record: string[]; line: number }> {
  const parser = pipeline(Readable.from(chunks), csvParser(delimiter), () => undefined);
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      yield { record, line: info.lines + lineOffset };
    }
  } catch (error) {
    if (error instanceof CsvError)
      Object.assign(error, { lines: ((error as CsvError & { lines?: number }).lines ?? 0) + lineOffset });
    throw error;
  }
}

const numberPattern = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

type Issue = CurveImportIssue;

function issue(row: number | null, column: string | null, message: string, expected?: string): Issue {
  return { row, column, message, ...(expected ? { expected } : {}) };
}

/** What the cells of one row say, before the pump is assembled. */
interface RowValues {
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

/** Reads the file; never throws for what is in the file, every problem becomes an issue. */
export async function readCurveTable(
  input: Readable,
  options: ReadOptions = {},
): Promise<ReadCurveTable & { errorsOmitted: number }> {
  const maxFileBytes = options.maxFileBytes ?? curveTableLimits.maxFileBytes;
  const maxPointRows = options.maxPointRows ?? curveTableLimits.maxPointRows;
  const counter = new CountingHash(maxFileBytes, options.onBytes);
  const counted = input.pipe(counter);
  input.once('error', (error) => counter.destroy(error));
  const iterator = counted[Symbol.asyncIterator]() as AsyncIterator<Buffer>;

  const errors = new IssueList();
  const state = new TableState(errors);
  try {
    const split = await splitAtHeader(iterator);
    state.decimalComma = split.delimiter === ';';
    async function* rest(): AsyncGenerator<Buffer> {
      if (split.rest.length > 0) yield split.rest;
      for (;;) {
        const next = await iterator.next();
        if (next.done) return;
        yield next.value;
      }
    }
    const parts = [
      csvRecords(Readable.from([split.preamble]), split.delimiter, 0),
      csvRecords(rest(), split.delimiter, split.preambleLines),
    ];
    reading: for (const part of parts) {
      for await (const { record, line } of part) {
        state.take(record, line);
        if (state.pointRowCount > maxPointRows) {
          errors.add(
            issue(
              line,
              null,
              `the file has more than ${maxPointRows.toLocaleString('en')} curve-point rows`,
              `at most ${maxPointRows.toLocaleString('en')} rows; split the file`,
            ),
          );
          counter.destroy();
          break reading;
        }
      }
    }
  } catch (error) {
    if (error instanceof FileTooLargeError)
      errors.add(issue(null, null, error.message, `at most ${maxFileBytes} bytes`));
    else if (error instanceof CsvError) {
      const line = (error as CsvError & { lines?: number }).lines ?? null;
      errors.add(
        issue(
          line,
          null,
          `the file is not valid CSV here: ${csvProblem(error)}`,
          'quotes that open and close around a field, and records shorter than 64 KiB',
        ),
      );
    } else throw error;
  }
  state.finish();
  return {
    formatVersion: state.formatVersion,
    fileUnits: state.fileUnits(),
    pumps: state.pumps,
    pointRowCount: state.pointRowCount,
    fileChecksum: counter.hash.copy().digest('hex'),
    fileBytes: counter.bytes,
    errors: errors.listed,
    errorsOmitted: errors.omitted,
    warnings: state.fileWarnings,
  };
}

function csvProblem(error: CsvError): string {
  switch (error.code) {
    case 'CSV_QUOTE_NOT_CLOSED':
      return 'a quoted field is never closed';
    case 'CSV_INVALID_CLOSING_QUOTE':
    case 'CSV_NON_TRIMABLE_CHAR_AFTER_CLOSING_QUOTE':
      return 'a quote closes a field but other characters follow it';
    case 'CSV_MAX_RECORD_SIZE':
      return 'one record is longer than 64 KiB';
    default:
      return error.message;
  }
}

/** The reader's progress through the file: format line, unit lines, header, point rows. */
class TableState {
  formatVersion: number | null = null;
  decimalComma = false;
  readonly pumps: ReadPump[] = [];
  readonly fileWarnings: Issue[] = [];
  pointRowCount = 0;
  private phase: 'format' | 'directives' | 'rows' | 'refused' = 'format';
  private readonly directives = new Map<string, { value: string; row: number }>();
  private header: (CurveTableColumn | null)[] = [];
  private current: {
    pump: ReadPump;
    values: Partial<Record<PumpColumn, string>>;
    valueRows: Partial<Record<PumpColumn, number>>;
  } | null = null;
  private readonly seen = new Map<string, ReadPump>();

  constructor(private readonly errors: IssueList) {}

  take(record: string[], row: number): void {
    if (this.phase === 'refused') return;
    if (this.phase === 'format') this.takeFormatLine(record, row);
    else if (this.phase === 'directives') {
      if (record[0] === 'model_code') this.takeHeader(record, row);
      else this.takeDirective(record, row);
    } else this.takeRow(record, row);
  }

  private takeFormatLine(record: string[], row: number): void {
    const expected = `the format line "${curveTableFormatName},${curveTableFormatVersion}" first`;
    if (record[0] !== curveTableFormatName) {
      this.errors.add(
        issue(
          row,
          null,
          `this is not a Riffle curve table: the first line is "${record.join(',').slice(0, 60)}"`,
          expected,
        ),
      );
      this.phase = 'refused';
      return;
    }
    const version = Number(record[1]);
    if (!Number.isInteger(version) || version !== curveTableFormatVersion) {
      this.errors.add(
        issue(
          row,
          'version',
          `format version "${record[1] ?? ''}" is not one this Riffle reads`,
          `version ${curveTableFormatVersion}`,
        ),
      );
      this.phase = 'refused';
      return;
    }
    this.formatVersion = version;
    this.phase = 'directives';
  }

  private takeDirective(record: string[], row: number): void {
    const [name, value = '', ...rest] = record;
    const known = [...Object.keys(unitDirectives), ...freeDirectives];
    if (!known.includes(name)) {
      this.errors.add(
        issue(
          row,
          name,
          `"${name}" is not a unit line this format knows, and the header row (starting with model_code) has not come yet`,
          `one of ${known.join(', ')}, or the header row`,
        ),
      );
      return;
    }
    if (rest.some((cell) => cell !== '')) {
      this.errors.add(issue(row, name, `the ${name} line has more than one value`, 'the name and one value'));
      return;
    }
    if (name === 'note') return;
    if (this.directives.has(name)) {
      this.errors.add(
        issue(
          row,
          name,
          `${name} is given twice (first on row ${this.directives.get(name)!.row})`,
          'each unit line once',
        ),
      );
      return;
    }
    if (name === 'currency') {
      if (!/^[A-Z]{3}$/.test(value)) {
        this.errors.add(
          issue(row, name, `"${value}" is not a currency code`, 'a three-letter ISO 4217 code such as USD or EUR'),
        );
        return;
      }
    } else {
      const accepted = unitDirectives[name as UnitDirective] as readonly string[];
      if (!accepted.includes(value)) {
        this.errors.add(
          issue(row, name, `"${value}" is not a unit Riffle knows for ${name}`, `one of ${accepted.join(', ')}`),
        );
        return;
      }
    }
    this.directives.set(name, { value, row });
  }

  private takeHeader(record: string[], row: number): void {
    this.phase = 'rows';
    const known: readonly string[] = [...pumpColumns, ...pointColumns];
    const seen = new Set<string>();
    this.header = record.map((name) => {
      if (!known.includes(name)) {
        this.errors.add(
          issue(
            row,
            name || '(blank)',
            `"${name}" is not a column of this format`,
            `columns among ${known.join(', ')}`,
          ),
        );
        return null;
      }
      if (seen.has(name)) {
        this.errors.add(issue(row, name, `column ${name} appears twice in the header`, 'each column once'));
        return null;
      }
      seen.add(name);
      return name as CurveTableColumn;
    });
    for (const name of requiredColumns) {
      if (!seen.has(name))
        this.errors.add(
          issue(row, name, `the header has no ${name} column`, `the columns ${requiredColumns.join(', ')}`),
        );
    }
    for (const [directive, where] of [
      ['flow-unit', 'flow'],
      ['head-unit', 'head'],
    ] as const) {
      if (!this.directives.has(directive))
        this.errors.add(
          issue(
            row,
            where,
            `no ${directive} line is given above the header`,
            `a line "${directive},..." with one of ${unitDirectives[directive].join(', ')}`,
          ),
        );
    }
    for (const [column, directive] of Object.entries(columnUnitDirective)) {
      if (seen.has(column) && !this.directives.has(directive)) {
        this.errors.add(
          issue(
            row,
            column,
            `the ${column} column needs a ${directive} line above the header`,
            `a line "${directive},..."`,
          ),
        );
      }
    }
    if (this.errors.count > 0) this.phase = 'refused';
  }

  private unitOf(directive: UnitDirective | 'currency'): string | undefined {
    return this.directives.get(directive)?.value;
  }

  fileUnits(): CurveFileUnits | null {
    const flow = this.unitOf('flow-unit');
    const head = this.unitOf('head-unit');
    if (!flow || !head) return null;
    const optional = {
      power: this.unitOf('power-unit'),
      efficiency: this.unitOf('efficiency-unit'),
      npsh: this.unitOf('npsh-unit'),
      size: this.unitOf('size-unit'),
      currency: this.unitOf('currency'),
      powerBasis: this.unitOf('power-basis'),
    };
    return {
      flow,
      head,
      ...Object.fromEntries(Object.entries(optional).filter(([, value]) => value !== undefined)),
    } as CurveFileUnits;
  }

  private takeRow(record: string[], row: number): void {
    const errorsBefore = this.errors.count;
    this.takeRowCells(record, row);
    if (this.errors.count > errorsBefore && this.current) this.current.pump.hasRowErrors = true;
  }

  private takeRowCells(record: string[], row: number): void {
    const values: RowValues = { row, cells: {} };
    record.forEach((cell, index) => {
      const column = this.header[index];
      if (index >= this.header.length) {
        if (cell !== '')
          this.errors.add(
            issue(
              row,
              `column ${index + 1}`,
              `the row has a value ("${cell.slice(0, 40)}") beyond the header's ${this.header.length} columns`,
              'no more cells than the header',
            ),
          );
        return;
      }
      if (column) values.cells[column] = cell;
    });
    this.pointRowCount += 1;
    const modelCode = values.cells.model_code ?? '';
    if (!/^[A-Za-z0-9][A-Za-z0-9 ._/-]{0,63}$/.test(modelCode)) {
      this.errors.add(
        issue(
          row,
          'model_code',
          modelCode === '' ? 'the model code is blank' : `"${modelCode.slice(0, 70)}" is not a model code`,
          'a code of 1-64 letters, digits, spaces and . _ / - starting with a letter or digit',
        ),
      );
      return;
    }
    if (this.current?.pump.modelCode !== modelCode) this.startPump(modelCode, values);
    const current = this.current!;
    if (current.pump.firstRow !== row) this.checkRepeatedDetails(current, values);
    current.pump.lastRow = row;
    const point = this.readPoint(values);
    if (point) {
      if (current.pump.points.length >= curveTableLimits.maxPointsPerPump) {
        this.errors.add(
          issue(
            row,
            'flow',
            `pump ${modelCode} has more than ${curveTableLimits.maxPointsPerPump} points`,
            `at most ${curveTableLimits.maxPointsPerPump} points per pump`,
          ),
        );
      } else current.pump.points.push(point);
    }
  }

  private startPump(modelCode: string, values: RowValues): void {
    const earlier = this.seen.get(modelCode);
    if (earlier) {
      this.errors.add(
        issue(
          values.row,
          'model_code',
          `pump ${modelCode} appears again; its rows ${earlier.firstRow}-${earlier.lastRow} came earlier`,
          'each pump once, with all of its rows together',
        ),
      );
    }
    const details = this.readDetails(values);
    const pump: ReadPump = {
      modelCode,
      firstRow: values.row,
      lastRow: values.row,
      details,
      preferred: this.readRange(values, 'preferred'),
      allowable: this.readRange(values, 'allowable'),
      points: [],
      warnings: [],
      hasRowErrors: false,
    };
    for (const column of ['display_name', 'notes'] as const) {
      const text = values.cells[column] ?? '';
      const lead = formulaLeadCharacters.find((character) => text.startsWith(character));
      if (lead) {
        pump.warnings.push(
          issue(values.row, column, `the text starts with "${lead}": Riffle keeps it as text and never evaluates it`),
        );
      }
    }
    if (!earlier) this.seen.set(modelCode, pump);
    this.pumps.push(pump);
    const pumpValues: Partial<Record<PumpColumn, string>> = {};
    const valueRows: Partial<Record<PumpColumn, number>> = {};
    for (const column of pumpColumns) {
      if (values.cells[column] !== undefined) {
        pumpValues[column] = values.cells[column];
        valueRows[column] = values.row;
      }
    }
    this.current = { pump, values: pumpValues, valueRows };
  }

  private checkRepeatedDetails(current: NonNullable<TableState['current']>, values: RowValues): void {
    for (const column of pumpColumns) {
      const cell = values.cells[column];
      if (column === 'model_code' || cell === undefined || cell === '') continue;
      const first = current.values[column] ?? '';
      if (cell !== first) {
        this.errors.add(
          issue(
            values.row,
            column,
            `"${cell.slice(0, 60)}" differs from "${first.slice(0, 60)}" on row ${current.pump.firstRow}, the pump's first row`,
            `blank, or the value of row ${current.pump.firstRow}`,
          ),
        );
      }
    }
  }

  /** A text cell; a leading apostrophe before a formula character (as Riffle writes them) is dropped. */
  private text(
    values: RowValues,
    column: 'display_name' | 'notes',
    maxLength: number,
    required: boolean,
  ): string | null {
    let text = values.cells[column] ?? '';
    if (text.startsWith("'") && formulaLeadCharacters.some((character) => text[1] === character)) text = text.slice(1);
    if (text === '') {
      if (required)
        this.errors.add(
          issue(values.row, column, `the ${column} is blank on the pump's first row`, 'a name of 1-160 characters'),
        );
      return null;
    }
    if (text.length > maxLength) {
      this.errors.add(
        issue(values.row, column, `the text is ${text.length} characters long`, `at most ${maxLength} characters`),
      );
      return null;
    }
    // eslint-disable-next-line no-control-regex -- control characters are exactly what this rule refuses
    if (/[\u0000-\u0008\u000B\u000C\u000E-\u001F]/.test(text)) {
      this.errors.add(issue(values.row, column, 'the text holds control characters', 'printable text'));
      return null;
    }
    return text;
  }

  /** A number cell, or undefined when blank; an issue (and null) when it is not a number in range. */
  number(
    values: RowValues,
    column: CurveTableColumn,
    what: string,
    range: { min?: number; above?: number; max?: number; integer?: boolean },
  ): number | null | undefined {
    const cell = values.cells[column];
    if (cell === undefined || cell === '') return undefined;
    const text = this.decimalComma ? cell.replace(',', '.') : cell;
    // Built only for an error: this runs for every cell of a large file.
    const expected = () =>
      [
        range.integer ? 'a whole number' : 'a number',
        what,
        range.min !== undefined ? `from ${range.min}` : range.above !== undefined ? `above ${range.above}` : '',
        range.max !== undefined ? `up to ${range.max}` : '',
      ]
        .filter(Boolean)
        .join(' ');
    if (!numberPattern.test(text)) {
      this.errors.add(
        issue(
          values.row,
          column,
          `"${cell.slice(0, 40)}" is not a number`,
          `${expected()}${this.decimalComma ? ' (decimal point or comma)' : ' (decimal point)'}`,
        ),
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
      this.errors.add(issue(values.row, column, `${cell} is out of range`, expected()));
      return null;
    }
    return value;
  }

  private choice<T extends string>(
    values: RowValues,
    column: CurveTableColumn,
    choices: readonly T[],
    fallback?: T,
  ): T | null {
    const cell = values.cells[column] ?? '';
    if (cell === '' && fallback) return fallback;
    if (!(choices as readonly string[]).includes(cell)) {
      this.errors.add(
        issue(
          values.row,
          column,
          cell === ''
            ? `the ${column} is blank on the pump's first row`
            : `"${cell.slice(0, 40)}" is not a ${column} Riffle knows`,
          `one of ${choices.join(', ')}`,
        ),
      );
      return null;
    }
    return cell as T;
  }

  private readDetails(values: RowValues): ReadPumpDetails {
    const sizeUnit = this.unitOf('size-unit') === 'in' ? 'in' : 'mm';
    const size = (column: 'discharge_size' | 'solids_size') => {
      const value = this.number(values, column, `in ${sizeUnit}`, { above: 0, max: sizeUnit === 'in' ? 40 : 1000 });
      return typeof value === 'number' ? diameterToSI(value, sizeUnit) * 1000 : null;
    };
    const price = this.number(values, 'list_price', `in ${this.unitOf('currency') ?? 'the currency line'}`, {
      min: 0,
      max: 1e9,
    });
    const phases = this.number(values, 'phases', '(1 or 3)', { integer: true, min: 1, max: 3 });
    if (phases === 2) this.errors.add(issue(values.row, 'phases', '2 is not a supply Riffle knows', '1 or 3'));
    return {
      displayName: this.text(values, 'display_name', 160, true) ?? '',
      kind: this.choice(values, 'kind', pumpKinds) ?? 'submersible',
      nominalSpeedRpm: this.number(values, 'speed_rpm', 'in rpm', { integer: true, min: 100, max: 20000 }) ?? null,
      voltageV: this.number(values, 'voltage', 'in V', { integer: true, min: 1, max: 1000 }) ?? null,
      phaseCount: phases === 2 ? null : (phases ?? null),
      dischargeSizeMm: size('discharge_size'),
      solidsHandlingMm: size('solids_size'),
      listPrice: typeof price === 'number' ? Math.round(price * 100) / 100 : null,
      priceCurrency: typeof price === 'number' ? (this.unitOf('currency') ?? null) : null,
      status: this.choice(values, 'status', pumpStatuses, 'active') ?? 'active',
      notes: this.text(values, 'notes', 2000, false),
    };
  }

  private readRange(values: RowValues, region: 'preferred' | 'allowable'): { flowMin: number; flowMax: number } | null {
    const flowUnit = this.unitOf('flow-unit') as FlowUnit;
    const minColumn = `${region}_flow_min` as const;
    const maxColumn = `${region}_flow_max` as const;
    const min = this.number(values, minColumn, `in ${flowUnit}`, { min: 0 });
    const max = this.number(values, maxColumn, `in ${flowUnit}`, { above: 0 });
    if (min === null || max === null) return null;
    if (min === undefined && max === undefined) return null;
    if (min === undefined || max === undefined) {
      const missing = min === undefined ? minColumn : maxColumn;
      this.errors.add(
        issue(
          values.row,
          missing,
          `the ${region} range has only one end`,
          `both ${minColumn} and ${maxColumn}, or neither`,
        ),
      );
      return null;
    }
    if (!(max > min)) {
      this.errors.add(
        issue(
          values.row,
          maxColumn,
          `the ${region} range ends (${max}) before it starts (${min})`,
          `${maxColumn} greater than ${minColumn}`,
        ),
      );
      return null;
    }
    return { flowMin: flowToSI(min, flowUnit), flowMax: flowToSI(max, flowUnit) };
  }

  private readPoint(values: RowValues): ReadPoint | null {
    const flowUnit = this.unitOf('flow-unit') as FlowUnit;
    const headUnit = this.unitOf('head-unit') as HeadUnit;
    const flow = this.number(values, 'flow', `in ${flowUnit}`, { min: 0 });
    const head = this.number(values, 'head', `in ${headUnit}`, { above: 0 });
    for (const [column, value] of [
      ['flow', flow],
      ['head', head],
    ] as const) {
      if (value === undefined)
        this.errors.add(
          issue(values.row, column, `the ${column} is blank`, `a number in ${column === 'flow' ? flowUnit : headUnit}`),
        );
    }
    const powerUnit = this.unitOf('power-unit') as PowerUnitName | undefined;
    const power = this.number(values, 'power', `in ${powerUnit}`, { min: 0 });
    const efficiencyUnit = this.unitOf('efficiency-unit');
    const efficiency = this.number(
      values,
      'efficiency',
      efficiencyUnit === '%' ? 'in % (0-100)' : 'as a fraction (0-1)',
      { min: 0, max: efficiencyUnit === '%' ? 100 : 1 },
    );
    const npshUnit = this.unitOf('npsh-unit') as HeadUnit | undefined;
    const npsh = this.number(values, 'npsh_required', `in ${npshUnit}`, { above: 0 });
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

  finish(): void {
    // After an error the reader may have stopped early (bad CSV, too large): what it did not reach is not missing.
    const complete = this.errors.count === 0;
    if (complete && this.phase === 'format')
      this.errors.add(
        issue(
          null,
          null,
          'the file is empty',
          `the format line "${curveTableFormatName},${curveTableFormatVersion}", unit lines, a header and point rows`,
        ),
      );
    if (complete && this.phase === 'directives')
      this.errors.add(issue(null, 'model_code', 'the file has no header row', 'a header row starting with model_code'));
    if (complete && this.phase === 'rows' && this.pumps.length === 0)
      this.errors.add(
        issue(null, null, 'the file has a header but no curve points', 'at least one pump with three or more points'),
      );
    if (this.unitOf('efficiency-unit') === '%') {
      const values = this.pumps
        .flatMap((pump) => pump.points.map((point) => point.efficiency))
        .filter((value) => value !== undefined);
      if (values.length > 0 && values.every((value) => value <= 0.01)) {
        this.fileWarnings.push(
          issue(
            this.directives.get('efficiency-unit')!.row,
            'efficiency-unit',
            'efficiency-unit is % but every efficiency is 1 % or less: are these fractions?',
            'efficiency-unit,fraction for values 0-1',
          ),
        );
      }
    }
  }
}
