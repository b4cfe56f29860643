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
  const expected = `the format line "${curveTableFormatName},${curveTableFormatVersion}" first`;
  if (record[0] !== curveTableFormatName) {
    errors.add(
      issue(
        row,
        null,
        `this is not a Riffle curve table: the first line is "${record.join(',').slice(0, 60)}"`,
        expected,
      ),
    );
    return null;
  }
  const version = Number(record[1]);
  if (!Number.isInteger(version) || version !== curveTableFormatVersion) {
    errors.add(
      issue(
        row,
        'version',
        `format version "${record[1] ?? ''}" is not one this Riffle reads`,
        `version ${curveTableFormatVersion}`,
      ),
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
    errors.add(
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
    errors.add(issue(row, name, `the ${name} line has more than one value`, 'the name and one value'));
    return;
  }
  if (name === 'note') return;
  if (directives.has(name)) {
    errors.add(
      issue(row, name, `${name} is given twice (first on row ${directives.get(name)!.row})`, 'each unit line once'),
    );
    return;
  }
  if (name === 'currency') {
    if (!/^[A-Z]{3}$/.test(value)) {
      errors.add(
        issue(row, name, `"${value}" is not a currency code`, 'a three-letter ISO 4217 code such as USD or EUR'),
      );
      return;
    }
  } else {
    const accepted = unitDirectives[name as UnitDirective] as readonly string[];
    if (!accepted.includes(value)) {
      errors.add(
        issue(row, name, `"${value}" is not a unit Riffle knows for ${name}`, `one of ${accepted.join(', ')}`),
      );
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
      errors.add(
        issue(row, name || '(blank)', `"${name}" is not a column of this format`, `columns among ${known.join(', ')}`),
      );
      return null;
    }
    if (seen.has(name)) {
      errors.add(issue(row, name, `column ${name} appears twice in the header`, 'each column once'));
      return null;
    }
    seen.add(name);
    return name as CurveTableColumn;
  });
  for (const name of requiredColumns) {
    if (!seen.has(name))
      errors.add(issue(row, name, `the header has no ${name} column`, `the columns ${requiredColumns.join(', ')}`));
  }
  for (const [directive, where] of [
    ['flow-unit', 'flow'],
    ['head-unit', 'head'],
  ] as const) {
    if (!directives.has(directive))
      errors.add(
        issue(
          row,
          where,
          `no ${directive} line is given above the header`,
          `a line "${directive},..." with one of ${unitDirectives[directive].join(', ')}`,
        ),
      );
  }
  for (const [column, directive] of Object.entries(columnUnitDirective)) {
    if (seen.has(column) && !directives.has(directive)) {
      errors.add(
        issue(
          row,
          column,
          `the ${column} column needs a ${directive} line above the header`,
          `a line "${directive},..."`,
        ),
      );
    }
  }
  return header;
}
