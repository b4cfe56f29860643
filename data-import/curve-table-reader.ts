import { Readable } from 'node:stream';
import { CsvError } from 'csv-parse';
import type { CurveFileUnits } from '../shared/api/api-schemas';
import { FRACTION_AS_PERCENT } from '../shared/hydraulics';
import type { ImportIssue } from '../shared/messages/import-issues';
import type { PumpKind, PumpStatus } from '../shared/vocabularies';
import {
  issue,
  IssueList,
  readDetails,
  readPoint,
  readRange,
  type CellContext,
  type RowValues,
} from './curve-table-cells';
import {
  curveTableFormatName,
  curveTableFormatVersion,
  curveTableLimits,
  formulaLeadCharacters,
  pumpColumns,
  type CurveTableColumn,
  type PumpColumn,
  type UnitDirective,
} from './curve-table-format';
import { readDirective, readFormatLine, readHeader, type Directives } from './curve-table-preamble';
import { CountingHash, csvProblem, csvRecords, FileTooLargeError, splitAtHeader } from './curve-table-stream';

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
  /** The motor's full-load (rated) current, A, when the supplier gives it. */
  fullLoadCurrentA: number | null;
  /** A continuous speed range on a drive or controller, rpm, both or neither; nominalSpeedRpm inside it. */
  speedMinRpm: number | null;
  speedMaxRpm: number | null;
  /** The fixed speeds of a multi-speed pump, rpm ascending, each at most nominalSpeedRpm. */
  fixedSpeedsRpm: number[] | null;
  dischargeSizeMm: number | null;
  solidsHandlingMm: number | null;
  listPrice: number | null;
  priceCurrency: string | null;
  /** The motor's efficiency at its rating, 0-1, when the supplier gives it. */
  motorEfficiency: number | null;
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
  warnings: ImportIssue[];
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
  errors: ImportIssue[];
  /** Errors found beyond the listed ones, counted only. */
  errorsOmitted: number;
  warnings: ImportIssue[];
}

export interface ReadOptions {
  maxFileBytes?: number;
  maxPointRows?: number;
  /** Called as bytes are read, for a progress bar. */
  onBytes?: (bytesRead: number) => void;
}

/** Reads the file; never throws for what is in the file, every problem becomes an issue. */
export async function readCurveTable(input: Readable, options: ReadOptions = {}): Promise<ReadCurveTable> {
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
          errors.add(issue(line, null, 'too-many-rows', { maxRows: maxPointRows }));
          counter.destroy();
          break reading;
        }
      }
    }
  } catch (error) {
    if (error instanceof FileTooLargeError) errors.add(issue(null, null, 'file-too-large', { maxBytes: maxFileBytes }));
    else if (error instanceof CsvError) {
      const line = (error as CsvError & { lines?: number }).lines ?? null;
      errors.add(issue(line, null, 'not-csv', { problem: csvProblem(error) }));
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

class TableState implements CellContext {
  formatVersion: number | null = null;
  decimalComma = false;
  readonly pumps: ReadPump[] = [];
  readonly fileWarnings: ImportIssue[] = [];
  pointRowCount = 0;
  private phase: 'format' | 'directives' | 'rows' | 'refused' = 'format';
  private readonly directives: Directives = new Map();
  private header: (CurveTableColumn | null)[] = [];
  private current: {
    pump: ReadPump;
    values: Partial<Record<PumpColumn, string>>;
    valueRows: Partial<Record<PumpColumn, number>>;
  } | null = null;
  private readonly seen = new Map<string, ReadPump>();

  constructor(readonly errors: IssueList) {}

  take(record: string[], row: number): void {
    if (this.phase === 'refused') return;
    if (this.phase === 'format') {
      this.formatVersion = readFormatLine(record, row, this.errors);
      this.phase = this.formatVersion === null ? 'refused' : 'directives';
    } else if (this.phase === 'directives') {
      if (record[0] === 'model_code') {
        this.header = readHeader(record, row, this.directives, this.errors);
        this.phase = this.errors.count > 0 ? 'refused' : 'rows';
      } else readDirective(record, row, this.directives, this.errors);
    } else this.takeRow(record, row);
  }

  unitOf(directive: UnitDirective | 'currency'): string | undefined {
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
            issue(row, `column ${index + 1}`, 'cell-beyond-header', {
              value: cell.slice(0, 40),
              headerColumns: this.header.length,
            }),
          );
        return;
      }
      if (column) values.cells[column] = cell;
    });
    this.pointRowCount += 1;
    const modelCode = values.cells.model_code ?? '';
    if (!/^[A-Za-z0-9][A-Za-z0-9 ._/-]{0,63}$/.test(modelCode)) {
      this.errors.add(
        modelCode === ''
          ? issue(row, 'model_code', 'model-code-blank', {})
          : issue(row, 'model_code', 'not-a-model-code', { value: modelCode.slice(0, 70) }),
      );
      return;
    }
    if (this.current?.pump.modelCode !== modelCode) this.startPump(modelCode, values);
    const current = this.current!;
    if (current.pump.firstRow !== row) this.checkRepeatedDetails(current, values);
    current.pump.lastRow = row;
    const point = readPoint(this, values);
    if (point) {
      if (current.pump.points.length >= curveTableLimits.maxPointsPerPump) {
        this.errors.add(
          issue(row, 'flow', 'too-many-points', { modelCode, maxPoints: curveTableLimits.maxPointsPerPump }),
        );
      } else current.pump.points.push(point);
    }
  }

  private startPump(modelCode: string, values: RowValues): void {
    const earlier = this.seen.get(modelCode);
    if (earlier) {
      this.errors.add(
        issue(values.row, 'model_code', 'pump-repeated', {
          modelCode,
          firstRow: earlier.firstRow,
          lastRow: earlier.lastRow,
        }),
      );
    }
    const details = readDetails(this, values);
    const pump: ReadPump = {
      modelCode,
      firstRow: values.row,
      lastRow: values.row,
      details,
      preferred: readRange(this, values, 'preferred'),
      allowable: readRange(this, values, 'allowable'),
      points: [],
      warnings: [],
      hasRowErrors: false,
    };
    for (const column of ['display_name', 'notes'] as const) {
      const text = values.cells[column] ?? '';
      const lead = formulaLeadCharacters.find((character) => text.startsWith(character));
      if (lead) pump.warnings.push(issue(values.row, column, 'formula-text', { lead }));
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
          issue(values.row, column, 'differs-from-first-row', {
            value: cell.slice(0, 60),
            first: first.slice(0, 60),
            firstRow: current.pump.firstRow,
          }),
        );
      }
    }
  }

  /** A text cell; a leading apostrophe before a formula character (as Riffle writes them) is dropped. */
  finish(): void {
    // After an error the reader may have stopped early (bad CSV, too large): what it did not reach is not missing.
    const complete = this.errors.count === 0;
    if (complete && this.phase === 'format')
      this.errors.add(
        issue(null, null, 'file-empty', { formatLine: `${curveTableFormatName},${curveTableFormatVersion}` }),
      );
    if (complete && this.phase === 'directives') this.errors.add(issue(null, 'model_code', 'no-header', {}));
    if (complete && this.phase === 'rows' && this.pumps.length === 0)
      this.errors.add(issue(null, null, 'no-points', {}));
    if (this.unitOf('efficiency-unit') === '%') {
      const values = this.pumps
        .flatMap((pump) => pump.points.map((point) => point.efficiency))
        .filter((value) => value !== undefined);
      if (values.length > 0 && values.every((value) => value <= FRACTION_AS_PERCENT)) {
        this.fileWarnings.push(
          issue(this.directives.get('efficiency-unit')!.row, 'efficiency-unit', 'efficiency-looks-fractional', {}),
        );
      }
    }
  }
}
