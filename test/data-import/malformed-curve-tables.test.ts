import { expect } from 'chai';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Sequelize } from 'sequelize';
import type { Supplier } from '../../server/database/models';
import type { CurveImportIssue } from '../../shared/api/api-schemas';
import { importIssueText } from '../../shared/messages/import-issue-text';
import type { ImportIssue, ImportIssueCode } from '../../shared/messages/import-issues';
import { tableChecksums } from '../support/accounts';
import { createScratchDatabase } from '../support/test-database';
import { catalogRowCounts, importText, seedDemoCatalog } from './catalog-fixtures';

/*
 * Each file in malformed/ is wrong in one way. Importing it (a commit, not a dry run) must name
 * the row and column of the problem and what is expected, and leave the database as it was:
 * the same row counts and the same table checksums.
 */

const folder = fileURLToPath(new URL('./malformed/', import.meta.url));

/**
 * The first error each file must give: its row (the file's line), its column, its code and the
 * values that matter (for a curve the engine refuses, the engine's own code).
 */
const expectedFirstErrors: Record<
  string,
  {
    row: number | null;
    column: string | null;
    code: ImportIssueCode;
    params?: Record<string, unknown>;
    engineCode?: string;
  }
> = {
  '01-not-a-curve-table.csv': { row: 2, column: null, code: 'not-a-curve-table' },
  '02-unknown-version.csv': { row: 2, column: 'version', code: 'unknown-format-version', params: { version: '7' } },
  '03-empty.csv': { row: null, column: null, code: 'file-empty' },
  '04-no-header.csv': { row: null, column: 'model_code', code: 'no-header' },
  '05-unknown-flow-unit.csv': {
    row: 3,
    column: 'flow-unit',
    code: 'unknown-unit',
    params: { name: 'flow-unit', value: 'barrels/day' },
  },
  '06-missing-head-unit.csv': { row: 4, column: 'head', code: 'unit-line-missing', params: { name: 'head-unit' } },
  '07-unknown-column.csv': { row: 5, column: 'colour', code: 'unknown-column', params: { name: 'colour' } },
  '08-duplicate-column.csv': { row: 5, column: 'head', code: 'column-repeated', params: { name: 'head' } },
  '09-missing-kind-column.csv': { row: 5, column: 'kind', code: 'column-missing', params: { name: 'kind' } },
  '10-power-without-unit.csv': {
    row: 5,
    column: 'power',
    code: 'column-needs-unit-line',
    params: { name: 'power', directive: 'power-unit' },
  },
  '11-text-in-head.csv': { row: 7, column: 'head', code: 'not-a-number', params: { value: 'abc' } },
  '12-negative-flow.csv': { row: 6, column: 'flow', code: 'number-out-of-range', params: { value: '-1' } },
  '13-blank-head.csv': { row: 7, column: 'head', code: 'point-value-blank' },
  '14-flows-not-increasing.csv': { row: 8, column: 'flow', code: 'flow-not-increasing', params: { previousRow: 7 } },
  '15-two-points.csv': { row: 6, column: 'flow', code: 'too-few-points', params: { count: 2 } },
  '16-head-rises-badly.csv': { row: 8, column: 'head', code: 'head-rise-refused', params: { previousRow: 7 } },
  '17-efficiency-over-100-percent.csv': {
    row: 9,
    column: 'efficiency',
    code: 'number-out-of-range',
    params: { value: '130' },
  },
  '18-efficiency-percent-as-fraction.csv': {
    row: 8,
    column: 'efficiency',
    code: 'number-out-of-range',
    params: { value: '72' },
  },
  '19-duplicate-pump.csv': {
    row: 14,
    column: 'model_code',
    code: 'pump-repeated',
    params: { modelCode: 'T-100', firstRow: 6, lastRow: 9 },
  },
  '20-formula-model-code.csv': { row: 6, column: 'model_code', code: 'not-a-model-code' },
  '21-unknown-kind.csv': { row: 6, column: 'kind', code: 'choice-unknown', params: { value: 'turbine' } },
  '22-inconsistent-detail.csv': {
    row: 7,
    column: 'display_name',
    code: 'differs-from-first-row',
    params: { first: 'Test submersible 100', firstRow: 6 },
  },
  '23-unclosed-quote.csv': {
    row: 7,
    column: null,
    code: 'not-csv',
    params: { problem: 'a quoted field is never closed' },
  },
  '24-extra-cells.csv': { row: 7, column: 'column 6', code: 'cell-beyond-header' },
  '25-power-on-some-points.csv': {
    row: 9,
    column: 'power',
    code: 'value-on-some-points',
    params: { value: 'power', given: 2, count: 4 },
  },
  '26-preferred-range-one-end.csv': {
    row: 6,
    column: 'preferred_flow_max',
    code: 'range-one-end',
    params: { region: 'preferred' },
  },
  '27-allowable-range-reversed.csv': {
    row: 6,
    column: 'allowable_flow_max',
    code: 'range-reversed',
    params: { region: 'allowable', min: 5, max: 1 },
  },
  '28-bad-currency.csv': { row: 5, column: 'currency', code: 'not-a-currency' },
  '29-two-phases.csv': { row: 6, column: 'phases', code: 'phases-unknown', params: { value: 2 } },
  '30-power-below-water-power.csv': {
    row: 9,
    column: 'power',
    code: 'curve-refused',
    engineCode: 'power-below-water-power',
  },
  '31-npsh-on-two-points.csv': { row: 8, column: 'npsh_required', code: 'npsh-on-few-points', params: { count: 2 } },
  '32-blank-model-code.csv': { row: 10, column: 'model_code', code: 'model-code-blank' },
  '33-header-only.csv': { row: null, column: null, code: 'no-points' },
  '34-semicolon-bad-number.csv': { row: 7, column: 'head', code: 'not-a-number', params: { value: '5,6,1' } },
  '35-efficiency-fraction-under-percent.csv': {
    row: 9,
    column: 'efficiency',
    code: 'curve-refused',
    engineCode: 'efficiency-looks-like-fraction',
  },
  '36-zero-head-before-last.csv': { row: 8, column: 'head', code: 'curve-refused', engineCode: 'zero-head-not-last' },
};

/** The sentence the one table makes for a reported issue's code and values. */
function describeIssueMessage(reported: CurveImportIssue): string {
  return importIssueText(reported as unknown as ImportIssue).message;
}

describe('malformed curve tables', function () {
  this.timeout(60_000);
  let sequelize: Sequelize;
  let drop: () => Promise<void>;
  let supplier: Supplier;

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('malformed_curves'));
    [supplier] = await seedDemoCatalog(sequelize);
  });

  after(async () => {
    await drop?.();
  });

  it('has at least 25 files, each with its expected error', () => {
    const files = readdirSync(folder)
      .filter((name) => name.endsWith('.csv'))
      .sort();
    expect(files.length).to.be.at.least(25);
    expect(files).to.deep.equal(Object.keys(expectedFirstErrors).sort());
  });

  for (const [file, expected] of Object.entries(expectedFirstErrors)) {
    it(`${file}: row ${expected.row ?? '-'}, column ${expected.column ?? '-'}, ${expected.code}, and nothing written`, async () => {
      const countsBefore = await catalogRowCounts(sequelize);
      const checksumsBefore = await tableChecksums(sequelize);
      const report = await importText(sequelize, supplier, readFileSync(`${folder}${file}`, 'utf8'), {
        fileName: file,
      });
      expect(report.errors.length, JSON.stringify(report.errors)).to.be.greaterThan(0);
      const [first] = report.errors;
      expect({ row: first.row, column: first.column }).to.deep.equal({ row: expected.row, column: expected.column });
      expect(first.code).to.equal(expected.code);
      expect(first.params).to.deep.include(expected.params ?? {});
      if (expected.engineCode) expect((first.params.error as { code: string }).code).to.equal(expected.engineCode);
      expect(first.message, 'the sentence of its code').to.equal(describeIssueMessage(first));
      expect(report.committed).to.equal(false);
      expect(report.importId).to.equal(null);
      expect(await catalogRowCounts(sequelize)).to.deep.equal(countsBefore);
      expect(await tableChecksums(sequelize)).to.deep.equal(checksumsBefore);
    });
  }

  it('a file over the size limit is refused with the limit in the message, nothing written', async () => {
    const checksumsBefore = await tableChecksums(sequelize);
    const text = readFileSync(`${folder}11-text-in-head.csv`, 'utf8').replace('abc', '5.5') + '#'.repeat(5000);
    const { readCurveTable } = await import('../../data-import/curve-table-reader');
    const { Readable } = await import('node:stream');
    const read = await readCurveTable(Readable.from([Buffer.from(text)]), { maxFileBytes: 4096 });
    expect(read.errors[0]).to.deep.include({ code: 'file-too-large', params: { maxBytes: 4096 } });
    expect(importIssueText(read.errors[0]).expected).to.equal('at most 4096 bytes');
    expect(await tableChecksums(sequelize)).to.deep.equal(checksumsBefore);
  });

  it('a file over the row limit is refused naming the row where the limit was passed', async () => {
    const { readCurveTable } = await import('../../data-import/curve-table-reader');
    const { Readable } = await import('node:stream');
    const rows = Array.from(
      { length: 30 },
      (_, index) =>
        `R-${Math.floor(index / 5)},Pump ${Math.floor(index / 5)},submersible,${index % 5},${10 - (index % 5)}`,
    );
    const text = [
      'riffle-curve-table,1',
      'flow-unit,m3/h',
      'head-unit,m',
      'model_code,display_name,kind,flow,head',
      ...rows,
    ].join('\n');
    const read = await readCurveTable(Readable.from([Buffer.from(text)]), { maxPointRows: 20 });
    const limit = read.errors.find((error) => error.code === 'too-many-rows');
    expect(limit, JSON.stringify(read.errors)).to.not.equal(undefined);
    expect(limit!.row).to.equal(4 + 21);
    expect(limit!.params).to.deep.equal({ maxRows: 20 });
  });
});
