import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import { openApiDocument } from '../../server/api/openapi-document';
import { describeIssue, reportedIssue } from '../../data-import/curve-import-plan';
import { IMPORT_ISSUE_TEXT, importIssueText } from '../../shared/messages/import-issue-text';
import type { ImportIssue, ImportIssueCode, ImportIssueParams } from '../../shared/messages/import-issues';

/*
 * Every import issue code with a sample of its values and the sentence the one table makes of it.
 * The samples are written out by hand, so a changed sentence or a code without one shows here.
 */

type Sample<Code extends ImportIssueCode> = {
  column: string | null;
  params: ImportIssueParams[Code];
  message: string;
  expected?: string;
};

const samples: { [Code in ImportIssueCode]: Sample<Code> } = {
  'not-a-curve-table': {
    column: null,
    params: { firstLine: 'model,flow', formatLine: 'riffle-curve-table,1' },
    message: 'this is not a Riffle curve table: the first line is "model,flow"',
    expected: 'the format line "riffle-curve-table,1" first',
  },
  'unknown-format-version': {
    column: 'version',
    params: { version: '7', supported: 1 },
    message: 'format version "7" is not one this Riffle reads',
    expected: 'version 1',
  },
  'unknown-unit-line': {
    column: 'colour',
    params: { name: 'colour', known: ['flow-unit', 'head-unit'] },
    message:
      '"colour" is not a unit line this format knows, and the header row (starting with model_code) has not come yet',
    expected: 'one of flow-unit, head-unit, or the header row',
  },
  'unit-line-extra-value': {
    column: 'flow-unit',
    params: { name: 'flow-unit' },
    message: 'the flow-unit line has more than one value',
    expected: 'the name and one value',
  },
  'unit-line-repeated': {
    column: 'head-unit',
    params: { name: 'head-unit', firstRow: 3 },
    message: 'head-unit is given twice (first on row 3)',
    expected: 'each unit line once',
  },
  'not-a-currency': {
    column: 'currency',
    params: { value: 'dollars' },
    message: '"dollars" is not a currency code',
    expected: 'a three-letter ISO 4217 code such as USD or EUR',
  },
  'unknown-unit': {
    column: 'flow-unit',
    params: { name: 'flow-unit', value: 'barrels/day', accepted: ['gpm', 'L/s'] },
    message: '"barrels/day" is not a unit Riffle knows for flow-unit',
    expected: 'one of gpm, L/s',
  },
  'unknown-column': {
    column: 'colour',
    params: { name: 'colour', known: ['model_code', 'flow'] },
    message: '"colour" is not a column of this format',
    expected: 'columns among model_code, flow',
  },
  'column-repeated': {
    column: 'head',
    params: { name: 'head' },
    message: 'column head appears twice in the header',
    expected: 'each column once',
  },
  'column-missing': {
    column: 'kind',
    params: { name: 'kind', required: ['model_code', 'kind'] },
    message: 'the header has no kind column',
    expected: 'the columns model_code, kind',
  },
  'unit-line-missing': {
    column: 'head',
    params: { name: 'head-unit', accepted: ['ft', 'm'] },
    message: 'no head-unit line is given above the header',
    expected: 'a line "head-unit,..." with one of ft, m',
  },
  'column-needs-unit-line': {
    column: 'power',
    params: { name: 'power', directive: 'power-unit' },
    message: 'the power column needs a power-unit line above the header',
    expected: 'a line "power-unit,..."',
  },
  'file-empty': {
    column: null,
    params: { formatLine: 'riffle-curve-table,1' },
    message: 'the file is empty',
    expected: 'the format line "riffle-curve-table,1", unit lines, a header and point rows',
  },
  'no-header': {
    column: 'model_code',
    params: {},
    message: 'the file has no header row',
    expected: 'a header row starting with model_code',
  },
  'no-points': {
    column: null,
    params: {},
    message: 'the file has a header but no curve points',
    expected: 'at least one pump with three or more points',
  },
  'file-too-large': {
    column: null,
    params: { maxBytes: 20 * 1024 * 1024 },
    message: 'the file is larger than 20 MiB; split it into smaller files',
    expected: 'at most 20971520 bytes',
  },
  'too-many-rows': {
    column: null,
    params: { maxRows: 200000 },
    message: 'the file has more than 200,000 curve-point rows',
    expected: 'at most 200,000 rows; split the file',
  },
  'recorded-as-text': {
    column: 'head',
    params: { message: 'head rises from row 4', expected: 'a falling curve' },
    message: 'head rises from row 4',
    expected: 'a falling curve',
  },
  'not-text': {
    column: null,
    params: { reason: 'a byte that starts no UTF-8 character', byte: 233, accepted: 'UTF-8' },
    message: 'the file cannot be read as text: a byte that starts no UTF-8 character (byte 233)',
    expected: 'UTF-8',
  },
  'not-csv': {
    column: null,
    params: { problem: 'a quoted field is never closed' },
    message: 'the file is not valid CSV here: a quoted field is never closed',
    expected: 'quotes that open and close around a field, and records shorter than 64 KiB',
  },
  'cell-beyond-header': {
    column: 'column 6',
    params: { value: 'x', headerColumns: 5 },
    message: 'the row has a value ("x") beyond the header\'s 5 columns',
    expected: 'no more cells than the header',
  },
  'model-code-blank': {
    column: 'model_code',
    params: {},
    message: 'the model code is blank',
    expected: 'a code of 1-64 letters, digits, spaces and . _ / - starting with a letter or digit',
  },
  'not-a-model-code': {
    column: 'model_code',
    params: { value: '=SUM(A1)' },
    message: '"=SUM(A1)" is not a model code',
    expected: 'a code of 1-64 letters, digits, spaces and . _ / - starting with a letter or digit',
  },
  'pump-repeated': {
    column: 'model_code',
    params: { modelCode: 'T-100', firstRow: 6, lastRow: 9 },
    message: 'pump T-100 appears again; its rows 6-9 came earlier',
    expected: 'each pump once, with all of its rows together',
  },
  'too-many-points': {
    column: 'flow',
    params: { modelCode: 'T-100', maxPoints: 60 },
    message: 'pump T-100 has more than 60 points',
    expected: 'at most 60 points per pump',
  },
  'differs-from-first-row': {
    column: 'display_name',
    params: { value: 'Other', first: 'Test submersible 100', firstRow: 6 },
    message: '"Other" differs from "Test submersible 100" on row 6, the pump\'s first row',
    expected: 'blank, or the value of row 6',
  },
  'formula-text': {
    column: 'notes',
    params: { lead: '=' },
    message: 'the text starts with "=": Riffle keeps it as text and never evaluates it',
  },
  'efficiency-looks-fractional': {
    column: 'efficiency-unit',
    params: {},
    message: 'efficiency-unit is % but every efficiency is 1 % or less: are these fractions?',
    expected: 'efficiency-unit,fraction for values 0-1',
  },
  'name-blank': {
    column: 'display_name',
    params: { maxLength: 160 },
    message: "the display_name is blank on the pump's first row",
    expected: 'a name of 1-160 characters',
  },
  'text-too-long': {
    column: 'notes',
    params: { length: 2001, maxLength: 2000 },
    message: 'the text is 2001 characters long',
    expected: 'at most 2000 characters',
  },
  'text-control-characters': {
    column: 'notes',
    params: {},
    message: 'the text holds control characters',
    expected: 'printable text',
  },
  'not-a-number': {
    column: 'head',
    params: { value: 'abc', rule: { unit: 'ft', integer: false, above: 0 }, decimalComma: true },
    message: '"abc" is not a number',
    expected: 'a number in ft above 0 (decimal point or comma)',
  },
  'number-out-of-range': {
    column: 'efficiency',
    params: { value: '130', rule: { unit: '%', integer: false, min: 0, max: 100 } },
    message: '130 is out of range',
    expected: 'a number in % from 0 up to 100',
  },
  'phases-unknown': {
    column: 'phases',
    params: { value: 2 },
    message: '2 is not a supply Riffle knows',
    expected: '1 or 3',
  },
  'choice-blank': {
    column: 'kind',
    params: { choices: ['submersible', 'mixed-flow'] },
    message: "the kind is blank on the pump's first row",
    expected: 'one of submersible, mixed-flow',
  },
  'choice-unknown': {
    column: 'kind',
    params: { value: 'turbine', choices: ['submersible', 'mixed-flow'] },
    message: '"turbine" is not a kind Riffle knows',
    expected: 'one of submersible, mixed-flow',
  },
  'range-one-end': {
    column: 'preferred_flow_max',
    params: { region: 'preferred' },
    message: 'the preferred range has only one end',
    expected: 'both preferred_flow_min and preferred_flow_max, or neither',
  },
  'range-reversed': {
    column: 'allowable_flow_max',
    params: { region: 'allowable', min: 5, max: 1 },
    message: 'the allowable range ends (1) before it starts (5)',
    expected: 'allowable_flow_max greater than allowable_flow_min',
  },
  'speed-range-one-end': {
    column: 'speed_max_rpm',
    params: {},
    message: 'the speed range has only one end',
    expected: 'both speed_min_rpm and speed_max_rpm, or neither',
  },
  'speed-range-reversed': {
    column: 'speed_max_rpm',
    params: { min: 2900, max: 1450 },
    message: 'the speed range ends (1450 rpm) before it starts (2900 rpm)',
    expected: 'speed_max_rpm greater than speed_min_rpm',
  },
  'speed-needs-nominal': {
    column: 'speeds_rpm',
    params: {},
    message: 'the speeds_rpm is given without speed_rpm',
    expected: 'speed_rpm, the speed the curve is published for, on the same row',
  },
  'speed-range-misses-nominal': {
    column: 'speed_max_rpm',
    params: { min: 1000, max: 2000, nominal: 2900 },
    message: 'the speed range 1000-2000 rpm leaves out the nominal 2900 rpm',
    expected: 'a speed range that holds speed_rpm',
  },
  'speed-above-nominal': {
    column: 'speed_max_rpm',
    params: { value: 4000, nominal: 2900, maxRatio: 1.2 },
    message: '4000 rpm is above 1.2 times the nominal 2900 rpm',
    expected: 'at most 3480 rpm',
  },
  'speeds-not-a-list': {
    column: 'speeds_rpm',
    params: { value: '2900;1450' },
    message: '"2900;1450" is not a list of speeds',
    expected: 'whole rpm from 100 to 20000 separated by ";", ascending, each once (e.g. 1450;2900)',
  },
  'point-value-blank': {
    column: 'head',
    params: { unit: 'ft' },
    message: 'the head is blank',
    expected: 'a number in ft',
  },
  'too-few-points': {
    column: 'flow',
    params: { modelCode: 'T-100', count: 2 },
    message: 'pump T-100 has 2 usable point(s)',
    expected: 'at least three points per pump',
  },
  'flow-not-increasing': {
    column: 'flow',
    params: { previousRow: 7 },
    message: 'the flow does not exceed the flow of row 7',
    expected: 'flows strictly increasing down the rows of a pump',
  },
  'head-rise-refused': {
    column: 'head',
    params: { previousRow: 7, share: 0.194, tolerated: 0.02 },
    message: "head rises from row 7 by 19.4 % of the pump's highest head",
    expected: 'head not rising with flow (a rise up to 2 % of the highest head is flagged, more is refused)',
  },
  'head-rise-flagged': {
    column: 'head',
    params: { share: 0.016 },
    message:
      "head rises by 1.6 % of the pump's highest head: flagged; the fit holds it level with the lowest head before it",
    expected: 'head not rising with flow',
  },
  'value-on-some-points': {
    column: 'power',
    params: { modelCode: 'T-100', value: 'power', given: 2, count: 4 },
    message: 'pump T-100 gives power on 2 of its 4 points',
    expected: 'power on every point of the pump, or on none',
  },
  'npsh-on-few-points': {
    column: 'npsh_required',
    params: { modelCode: 'T-100', count: 2 },
    message: 'pump T-100 gives NPSH required on 2 point(s)',
    expected: 'NPSH required on at least three points, or on none',
  },
  'curve-refused': {
    column: 'power',
    params: {
      modelCode: 'T-100',
      error: {
        code: 'power-below-water-power',
        params: { power: 100, waterPower: 150.25 },
        pointer: '/points/3/power',
      },
      pointRow: 9,
    },
    message: 'power 100.0 W is less than the water power 150.3 W at this point',
  },
  'fit-issue': {
    column: null,
    params: { issue: { code: 'shut-off-extrapolated', params: { flowMin: 0.001 } } },
    message: 'shut-off head is extrapolated: the first point is not at zero flow',
  },
  'bep-unknown': {
    column: 'efficiency',
    params: { reason: 'the curve has no efficiency or power data' },
    message: 'BEP unknown: the curve has no efficiency or power data',
  },
  'poor-fit': {
    column: 'head',
    params: { rmsHead: 1.234567, worstResidual: -2.5 },
    message: 'the fitted curve misses the points by 1.235 m RMS (worst -2.5 m): check the data',
  },
  'range-beyond-points': {
    column: 'preferred_flow_max',
    params: { region: 'preferred' },
    message: 'the preferred range reaches beyond the published points',
  },
};

function sampleIssue(code: ImportIssueCode): ImportIssue {
  const { column, params } = samples[code];
  return { row: 12, column, code, params } as ImportIssue;
}

describe('import issue text', () => {
  const codes = Object.keys(samples) as ImportIssueCode[];

  it("lists the same codes as the table and as the contract's CurveImportIssue.code", () => {
    expect(Object.keys(IMPORT_ISSUE_TEXT).sort()).to.deep.equal([...codes].sort());
    const schema = openApiDocument.components!.schemas!.CurveImportIssue as OpenAPIV3_1.SchemaObject;
    const code = schema.properties!.code as OpenAPIV3_1.SchemaObject;
    expect([...(code.enum as string[])].sort()).to.deep.equal([...codes].sort());
  });

  for (const code of codes) {
    it(`${code}: its sentence from the one table`, () => {
      const { message, expected } = samples[code];
      expect(importIssueText(sampleIssue(code))).to.deep.equal({ message, ...(expected ? { expected } : {}) });
    });
  }

  it("a pump the engine refuses away from a point is named before the engine's sentence", () => {
    const issue: ImportIssue = {
      row: 6,
      column: 'head',
      code: 'curve-refused',
      params: {
        modelCode: 'T-100',
        error: { code: 'no-falling-fit', params: {}, pointer: '/points' },
        pointRow: null,
      },
    };
    expect(importIssueText(issue).message).to.match(/^pump T-100: no quadratic or cubic through these points/);
  });

  it('the report keeps the code and values and adds the sentence; the one-line form reads the same table', () => {
    const issue = sampleIssue('flow-not-increasing');
    expect(reportedIssue(issue)).to.deep.equal({
      row: 12,
      column: 'flow',
      code: 'flow-not-increasing',
      params: { previousRow: 7 },
      message: 'the flow does not exceed the flow of row 7',
      expected: 'flows strictly increasing down the rows of a pump',
    });
    expect(describeIssue(reportedIssue(issue))).to.equal(
      'row 12, column flow: the flow does not exceed the flow of row 7 (expected flows strictly increasing down the rows of a pump)',
    );
  });
});
