import { stringify } from 'csv-stringify/sync';
import {
  curveTableFormatName,
  curveTableFormatVersion,
  formulaLeadCharacters,
  type CurveTableColumn,
  type UnitDirective,
} from './curve-table-format';

/** A curve table to write: its unit lines, its columns and one entry per curve-point row, in the file's units. */
export interface CurveTableDraft {
  delimiter?: ',' | ';';
  /** Comment lines written at the top, each after "# ". */
  comments?: readonly string[];
  units: Partial<Record<UnitDirective | 'currency', string>>;
  columns: readonly CurveTableColumn[];
  rows: ReadonlyArray<Partial<Record<CurveTableColumn, string | number | null>>>;
}

const textColumns: ReadonlySet<CurveTableColumn> = new Set(['display_name', 'notes']);

/**
 * A text cell as Riffle writes it: one that a spreadsheet would take for a formula gets a leading
 * apostrophe (OWASP, "CSV Injection"), which Riffle's reader drops again.
 */
export function spreadsheetSafeText(text: string): string {
  return formulaLeadCharacters.some((character) => text.startsWith(character)) ? `'${text}` : text;
}

function cellText(value: string | number | null | undefined, column: CurveTableColumn, delimiter: ',' | ';'): string {
  if (value === null || value === undefined) return '';
  let text = typeof value === 'number' ? Number(value.toPrecision(6)).toString() : value;
  if (typeof value === 'number' && delimiter === ';') text = text.replace('.', ',');
  if (typeof value === 'string' && textColumns.has(column)) text = spreadsheetSafeText(text);
  return text;
}

/**
 * The text of a curve-table file (format version 1, see README.md). csv-stringify quotes a cell
 * holding the delimiter, a quote or a line break; a cell with leading or trailing blanks is
 * quoted too, so that the reader keeps them.
 */
export function formatCurveTable(draft: CurveTableDraft): string {
  const delimiter = draft.delimiter ?? ',';
  const records = [
    [curveTableFormatName, String(curveTableFormatVersion)],
    ...Object.entries(draft.units)
      .filter((entry): entry is [string, string] => entry[1] !== undefined)
      .map(([name, value]) => [name, value]),
    [...draft.columns],
    ...draft.rows.map((row) => draft.columns.map((column) => cellText(row[column], column, delimiter))),
  ];
  const comments = (draft.comments ?? []).map((comment) => `# ${comment}\n`).join('');
  return (
    comments + stringify(records, { delimiter, record_delimiter: '\n', quoted_match: [/^\s/, /\s$/, '\r'], eof: true })
  );
}
