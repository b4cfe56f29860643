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

function cell(value: string | number | null | undefined, column: CurveTableColumn, delimiter: ',' | ';'): string {
  if (value === null || value === undefined) return '';
  let text = typeof value === 'number' ? Number(value.toPrecision(6)).toString() : value;
  if (typeof value === 'number' && delimiter === ';') text = text.replace('.', ',');
  if (typeof value === 'string' && textColumns.has(column)) text = spreadsheetSafeText(text);
  return /["\r\n]/.test(text) || text.includes(delimiter) || text !== text.trim()
    ? `"${text.replaceAll('"', '""')}"`
    : text;
}

/** The text of a curve-table file (format version 1, see README.md). */
export function formatCurveTable(draft: CurveTableDraft): string {
  const delimiter = draft.delimiter ?? ',';
  const lines = [
    ...(draft.comments ?? []).map((comment) => `# ${comment}`),
    [curveTableFormatName, curveTableFormatVersion].join(delimiter),
    ...Object.entries(draft.units)
      .filter(([, value]) => value !== undefined)
      .map(([name, value]) => [name, value].join(delimiter)),
    draft.columns.join(delimiter),
    ...draft.rows.map((row) => draft.columns.map((column) => cell(row[column], column, delimiter)).join(delimiter)),
  ];
  return `${lines.join('\n')}\n`;
}
