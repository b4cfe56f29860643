import { issue, type IssueList } from './curve-table-cells';
import {
  columnUnitDirective,
  curveTableFormatName,
  curveTableFormatVersion,
  freeDirectives,
  pointColumns,
  pumpColumns,
  requiredColumns,
  unitDirectives,
  type CurveTableColumn,
  type UnitDirective,
} from './curve-table-format';

/*
 * The lines above a curve table's point rows: the format line, the unit lines and the header.
 * Each is checked on its own; issues name the line and the directive or column.
 */

/** The unit lines read so far, by name, with the line each stood on. */
export type Directives = Map<string, { value: string; row: number }>;

/** The first line: the format's name and version, or null (and an issue) when the file is not one this reads. */
export function readFormatLine(record: string[], row: number, errors: IssueList): number | null {
  if (record[0] !== curveTableFormatName) {
    errors.add(
      issue(row, null, 'not-a-curve-table', {
        firstLine: record.join(',').slice(0, 60),
        formatLine: `${curveTableFormatName},${curveTableFormatVersion}`,
      }),
    );
    return null;
  }
  const version = Number(record[1]);
  if (!Number.isInteger(version) || version !== curveTableFormatVersion) {
    errors.add(
      issue(row, 'version', 'unknown-format-version', {
        version: (record[1] ?? '').slice(0, 40),
        supported: curveTableFormatVersion,
      }),
    );
    return null;
  }
  return version;
}

/** A unit line above the header, kept in `directives` when it is valid. */
export function readDirective(record: string[], row: number, directives: Directives, errors: IssueList): void {
  const [name, value = '', ...rest] = record;
  const known = [...Object.keys(unitDirectives), ...freeDirectives];
  if (!known.includes(name)) {
    errors.add(issue(row, name, 'unknown-unit-line', { name: name.slice(0, 60), known }));
    return;
  }
  if (rest.some((cell) => cell !== '')) {
    errors.add(issue(row, name, 'unit-line-extra-value', { name }));
    return;
  }
  if (name === 'note') return;
  if (directives.has(name)) {
    errors.add(issue(row, name, 'unit-line-repeated', { name, firstRow: directives.get(name)!.row }));
    return;
  }
  if (name === 'currency') {
    if (!/^[A-Z]{3}$/.test(value)) {
      errors.add(issue(row, name, 'not-a-currency', { value: value.slice(0, 40) }));
      return;
    }
  } else {
    const accepted = unitDirectives[name as UnitDirective] as readonly string[];
    if (!accepted.includes(value)) {
      errors.add(issue(row, name, 'unknown-unit', { name, value: value.slice(0, 40), accepted: [...accepted] }));
      return;
    }
  }
  directives.set(name, { value, row });
}

/** The header row: each cell's column, or null for one the format does not know; issues for what is missing. */
export function readHeader(
  record: string[],
  row: number,
  directives: Directives,
  errors: IssueList,
): (CurveTableColumn | null)[] {
  const known: readonly string[] = [...pumpColumns, ...pointColumns];
  const seen = new Set<string>();
  const header = record.map((name) => {
    if (!known.includes(name)) {
      errors.add(issue(row, name || '(blank)', 'unknown-column', { name: name.slice(0, 60), known: [...known] }));
      return null;
    }
    if (seen.has(name)) {
      errors.add(issue(row, name, 'column-repeated', { name }));
      return null;
    }
    seen.add(name);
    return name as CurveTableColumn;
  });
  for (const name of requiredColumns) {
    if (!seen.has(name)) errors.add(issue(row, name, 'column-missing', { name, required: [...requiredColumns] }));
  }
  for (const [directive, where] of [
    ['flow-unit', 'flow'],
    ['head-unit', 'head'],
  ] as const) {
    if (!directives.has(directive))
      errors.add(issue(row, where, 'unit-line-missing', { name: directive, accepted: [...unitDirectives[directive]] }));
  }
  for (const [column, directive] of Object.entries(columnUnitDirective)) {
    if (seen.has(column) && !directives.has(directive)) {
      errors.add(issue(row, column, 'column-needs-unit-line', { name: column, directive }));
    }
  }
  return header;
}
