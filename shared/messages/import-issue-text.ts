import type { ImportIssue, ImportIssueCode, ImportIssueParams, NumberRule } from './import-issues';
import { engineInputErrorText, engineIssueText } from './engine-issue-text';

/** What a person reads of one import issue: what is wrong and, where it helps, what is expected. */
export interface ImportIssueSentence {
  message: string;
  expected?: string;
}

type Sentence<Code extends ImportIssueCode> = (
  params: ImportIssueParams[Code],
  column: string | null,
) => ImportIssueSentence;

function numberRuleText(rule: NumberRule): string {
  const unit = rule.unit === null ? '' : rule.unit === 'fraction' ? 'as a fraction' : `in ${rule.unit}`;
  const from = rule.min !== undefined ? `from ${rule.min}` : rule.above !== undefined ? `above ${rule.above}` : '';
  return [rule.integer ? 'a whole number' : 'a number', unit, from, rule.max !== undefined ? `up to ${rule.max}` : '']
    .filter(Boolean)
    .join(' ');
}

const percent = (share: number) => `${(100 * share).toFixed(1)} %`;

const metres = (value: number) => Number(value.toPrecision(4)).toString();

const modelCodeRule = 'a code of 1-64 letters, digits, spaces and . _ / - starting with a letter or digit';

/** The one sentence (and what is expected) of every import issue. */
export const IMPORT_ISSUE_TEXT: { [Code in ImportIssueCode]: Sentence<Code> } = {
  'not-a-curve-table': ({ firstLine, formatLine }) => ({
    message: `this is not a Riffle curve table: the first line is "${firstLine}"`,
    expected: `the format line "${formatLine}" first`,
  }),
  'unknown-format-version': ({ version, supported }) => ({
    message: `format version "${version}" is not one this Riffle reads`,
    expected: `version ${supported}`,
  }),
  'unknown-unit-line': ({ name, known }) => ({
    message: `"${name}" is not a unit line this format knows, and the header row (starting with model_code) has not come yet`,
    expected: `one of ${known.join(', ')}, or the header row`,
  }),
  'unit-line-extra-value': ({ name }) => ({
    message: `the ${name} line has more than one value`,
    expected: 'the name and one value',
  }),
  'unit-line-repeated': ({ name, firstRow }) => ({
    message: `${name} is given twice (first on row ${firstRow})`,
    expected: 'each unit line once',
  }),
  'not-a-currency': ({ value }) => ({
    message: `"${value}" is not a currency code`,
    expected: 'a three-letter ISO 4217 code such as USD or EUR',
  }),
  'unknown-unit': ({ name, value, accepted }) => ({
    message: `"${value}" is not a unit Riffle knows for ${name}`,
    expected: `one of ${accepted.join(', ')}`,
  }),
  'unknown-column': ({ name, known }) => ({
    message: `"${name}" is not a column of this format`,
    expected: `columns among ${known.join(', ')}`,
  }),
  'column-repeated': ({ name }) => ({
    message: `column ${name} appears twice in the header`,
    expected: 'each column once',
  }),
  'column-missing': ({ name, required }) => ({
    message: `the header has no ${name} column`,
    expected: `the columns ${required.join(', ')}`,
  }),
  'unit-line-missing': ({ name, accepted }) => ({
    message: `no ${name} line is given above the header`,
    expected: `a line "${name},..." with one of ${accepted.join(', ')}`,
  }),
  'column-needs-unit-line': ({ name, directive }) => ({
    message: `the ${name} column needs a ${directive} line above the header`,
    expected: `a line "${directive},..."`,
  }),
  'file-empty': ({ formatLine }) => ({
    message: 'the file is empty',
    expected: `the format line "${formatLine}", unit lines, a header and point rows`,
  }),
  'no-header': () => ({ message: 'the file has no header row', expected: 'a header row starting with model_code' }),
  'no-points': () => ({
    message: 'the file has a header but no curve points',
    expected: 'at least one pump with three or more points',
  }),
  'file-too-large': ({ maxBytes }) => ({
    message: `the file is larger than ${Math.round(maxBytes / 1024 / 1024)} MiB; split it into smaller files`,
    expected: `at most ${maxBytes} bytes`,
  }),
  'too-many-rows': ({ maxRows }) => ({
    message: `the file has more than ${maxRows.toLocaleString('en')} curve-point rows`,
    expected: `at most ${maxRows.toLocaleString('en')} rows; split the file`,
  }),
  'recorded-as-text': ({ message, expected }) => ({ message, ...(expected ? { expected } : {}) }),
  'not-text': ({ reason, byte, accepted }) => ({
    message: `the file cannot be read as text: ${reason} (byte ${byte})`,
    expected: accepted,
  }),
  'not-csv': ({ problem }) => ({
    message: `the file is not valid CSV here: ${problem}`,
    expected: 'quotes that open and close around a field, and records shorter than 64 KiB',
  }),
  'cell-beyond-header': ({ value, headerColumns }) => ({
    message: `the row has a value ("${value}") beyond the header's ${headerColumns} columns`,
    expected: 'no more cells than the header',
  }),
  'model-code-blank': () => ({ message: 'the model code is blank', expected: modelCodeRule }),
  'not-a-model-code': ({ value }) => ({ message: `"${value}" is not a model code`, expected: modelCodeRule }),
  'pump-repeated': ({ modelCode, firstRow, lastRow }) => ({
    message: `pump ${modelCode} appears again; its rows ${firstRow}-${lastRow} came earlier`,
    expected: 'each pump once, with all of its rows together',
  }),
  'too-many-points': ({ modelCode, maxPoints }) => ({
    message: `pump ${modelCode} has more than ${maxPoints} points`,
    expected: `at most ${maxPoints} points per pump`,
  }),
  'differs-from-first-row': ({ value, first, firstRow }) => ({
    message: `"${value}" differs from "${first}" on row ${firstRow}, the pump's first row`,
    expected: `blank, or the value of row ${firstRow}`,
  }),
  'formula-text': ({ lead }) => ({
    message: `the text starts with "${lead}": Riffle keeps it as text and never evaluates it`,
  }),
  'efficiency-looks-fractional': () => ({
    message: 'efficiency-unit is % but every efficiency is 1 % or less: are these fractions?',
    expected: 'efficiency-unit,fraction for values 0-1',
  }),
  'name-blank': ({ maxLength }, column) => ({
    message: `the ${column} is blank on the pump's first row`,
    expected: `a name of 1-${maxLength} characters`,
  }),
  'text-too-long': ({ length, maxLength }) => ({
    message: `the text is ${length} characters long`,
    expected: `at most ${maxLength} characters`,
  }),
  'text-control-characters': () => ({ message: 'the text holds control characters', expected: 'printable text' }),
  'not-a-number': ({ value, rule, decimalComma }) => ({
    message: `"${value}" is not a number`,
    expected: `${numberRuleText(rule)}${decimalComma ? ' (decimal point or comma)' : ' (decimal point)'}`,
  }),
  'number-out-of-range': ({ value, rule }) => ({ message: `${value} is out of range`, expected: numberRuleText(rule) }),
  'phases-unknown': ({ value }) => ({ message: `${value} is not a supply Riffle knows`, expected: '1 or 3' }),
  'choice-blank': ({ choices }, column) => ({
    message: `the ${column} is blank on the pump's first row`,
    expected: `one of ${choices.join(', ')}`,
  }),
  'choice-unknown': ({ value, choices }, column) => ({
    message: `"${value}" is not a ${column} Riffle knows`,
    expected: `one of ${choices.join(', ')}`,
  }),
  'range-one-end': ({ region }) => ({
    message: `the ${region} range has only one end`,
    expected: `both ${region}_flow_min and ${region}_flow_max, or neither`,
  }),
  'range-reversed': ({ region, min, max }) => ({
    message: `the ${region} range ends (${max}) before it starts (${min})`,
    expected: `${region}_flow_max greater than ${region}_flow_min`,
  }),
  'speed-range-one-end': () => ({
    message: 'the speed range has only one end',
    expected: 'both speed_min_rpm and speed_max_rpm, or neither',
  }),
  'speed-range-reversed': ({ min, max }) => ({
    message: `the speed range ends (${max} rpm) before it starts (${min} rpm)`,
    expected: 'speed_max_rpm greater than speed_min_rpm',
  }),
  'speed-needs-nominal': (_params, column) => ({
    message: `the ${column} is given without speed_rpm`,
    expected: 'speed_rpm, the speed the curve is published for, on the same row',
  }),
  'speed-range-misses-nominal': ({ min, max, nominal }) => ({
    message: `the speed range ${min}-${max} rpm leaves out the nominal ${nominal} rpm`,
    expected: 'a speed range that holds speed_rpm',
  }),
  'speed-above-nominal': ({ value, nominal, maxRatio }) => ({
    message:
      maxRatio === 1
        ? `${value} rpm is above the nominal ${nominal} rpm`
        : `${value} rpm is above ${maxRatio} times the nominal ${nominal} rpm`,
    expected: maxRatio === 1 ? `at most ${nominal} rpm` : `at most ${Math.floor(maxRatio * nominal)} rpm`,
  }),
  'speeds-not-a-list': ({ value }) => ({
    message: `"${value}" is not a list of speeds`,
    expected: 'whole rpm from 100 to 20000 separated by ";", ascending, each once (e.g. 1450;2900)',
  }),
  'point-value-blank': ({ unit }, column) => ({ message: `the ${column} is blank`, expected: `a number in ${unit}` }),
  'too-few-points': ({ modelCode, count }) => ({
    message: `pump ${modelCode} has ${count} usable point(s)`,
    expected: 'at least three points per pump',
  }),
  'flow-not-increasing': ({ previousRow }) => ({
    message: `the flow does not exceed the flow of row ${previousRow}`,
    expected: 'flows strictly increasing down the rows of a pump',
  }),
  'head-rise-refused': ({ previousRow, share, tolerated }) => ({
    message: `head rises from row ${previousRow} by ${percent(share)} of the pump's highest head`,
    expected: `head not rising with flow (a rise up to ${100 * tolerated} % of the highest head is flagged, more is refused)`,
  }),
  'head-rise-flagged': ({ share }) => ({
    message: `head rises by ${percent(share)} of the pump's highest head: flagged; the fit holds it level with the lowest head before it`,
    expected: 'head not rising with flow',
  }),
  'value-on-some-points': ({ modelCode, value, given, count }) => ({
    message: `pump ${modelCode} gives ${value} on ${given} of its ${count} points`,
    expected: `${value} on every point of the pump, or on none`,
  }),
  'npsh-on-few-points': ({ modelCode, count }) => ({
    message: `pump ${modelCode} gives NPSH required on ${count} point(s)`,
    expected: 'NPSH required on at least three points, or on none',
  }),
  'curve-refused': ({ modelCode, error, pointRow }) => ({
    message: `${pointRow === null ? `pump ${modelCode}: ` : ''}${engineInputErrorText(error)}`,
  }),
  'fit-issue': ({ issue }) => ({ message: engineIssueText(issue) }),
  'bep-unknown': ({ reason }) => ({ message: `BEP unknown: ${reason}` }),
  'poor-fit': ({ rmsHead, worstResidual }) => ({
    message: `the fitted curve misses the points by ${metres(rmsHead)} m RMS (worst ${metres(worstResidual)} m): check the data`,
  }),
  'range-beyond-points': ({ region }) => ({ message: `the ${region} range reaches beyond the published points` }),
};

/** The sentence a person reads for one import issue. */
export function importIssueText(issue: ImportIssue): ImportIssueSentence {
  const text = IMPORT_ISSUE_TEXT[issue.code] as (
    params: ImportIssue['params'],
    column: string | null,
  ) => ImportIssueSentence;
  return text(issue.params, issue.column);
}
