import { expect } from 'chai';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Sequelize } from 'sequelize';
import type { Supplier } from '../../server/database/models';
import { tableChecksums } from '../support/accounts';
import { createScratchDatabase } from '../support/test-database';
import { catalogRowCounts, importText, seedDemoCatalog } from './catalog-fixtures';

/*
 * Each file in malformed/ is wrong in one way. Importing it (a commit, not a dry run) must name
 * the row and column of the problem and what is expected, and leave the database as it was:
 * the same row counts and the same table checksums.
 */

const folder = fileURLToPath(new URL('./malformed/', import.meta.url));

/** The first error each file must give: its row (the file's line), its column, and words of its message. */
const expectedFirstErrors: Record<string, { row: number | null; column: string | null; says: string }> = {
  '01-not-a-curve-table.csv': { row: 2, column: null, says: 'not a Riffle curve table' },
  '02-unknown-version.csv': { row: 2, column: 'version', says: 'format version "7"' },
  '03-empty.csv': { row: null, column: null, says: 'the file is empty' },
  '04-no-header.csv': { row: null, column: 'model_code', says: 'no header row' },
  '05-unknown-flow-unit.csv': { row: 3, column: 'flow-unit', says: '"barrels/day" is not a unit' },
  '06-missing-head-unit.csv': { row: 4, column: 'head', says: 'no head-unit line' },
  '07-unknown-column.csv': { row: 5, column: 'colour', says: 'not a column of this format' },
  '08-duplicate-column.csv': { row: 5, column: 'head', says: 'appears twice' },
  '09-missing-kind-column.csv': { row: 5, column: 'kind', says: 'no kind column' },
  '10-power-without-unit.csv': { row: 5, column: 'power', says: 'needs a power-unit line' },
  '11-text-in-head.csv': { row: 7, column: 'head', says: '"abc" is not a number' },
  '12-negative-flow.csv': { row: 6, column: 'flow', says: '-1 is out of range' },
  '13-blank-head.csv': { row: 7, column: 'head', says: 'the head is blank' },
  '14-flows-not-increasing.csv': { row: 8, column: 'flow', says: 'does not exceed the flow of row 7' },
  '15-two-points.csv': { row: 6, column: 'flow', says: 'has 2 usable point(s)' },
  '16-head-rises-badly.csv': { row: 8, column: 'head', says: 'head rises from row 7 by 19.4 %' },
  '17-efficiency-over-100-percent.csv': { row: 9, column: 'efficiency', says: '130 is out of range' },
  '18-efficiency-percent-as-fraction.csv': { row: 8, column: 'efficiency', says: '72 is out of range' },
  '19-duplicate-pump.csv': { row: 14, column: 'model_code', says: 'pump T-100 appears again; its rows 6-9' },
  '20-formula-model-code.csv': { row: 6, column: 'model_code', says: 'is not a model code' },
  '21-unknown-kind.csv': { row: 6, column: 'kind', says: '"turbine" is not a kind' },
  '22-inconsistent-detail.csv': {
    row: 7,
    column: 'display_name',
    says: 'differs from "Test submersible 100" on row 6',
  },
  '23-unclosed-quote.csv': { row: 7, column: null, says: 'a quoted field is never closed' },
  '24-extra-cells.csv': { row: 7, column: 'column 6', says: 'beyond the header' },
  '25-power-on-some-points.csv': { row: 9, column: 'power', says: 'gives power on 2 of its 4 points' },
  '26-preferred-range-one-end.csv': { row: 6, column: 'preferred_flow_max', says: 'only one end' },
  '27-allowable-range-reversed.csv': { row: 6, column: 'allowable_flow_max', says: 'ends (1) before it starts (5)' },
  '28-bad-currency.csv': { row: 5, column: 'currency', says: 'not a currency code' },
  '29-two-phases.csv': { row: 6, column: 'phases', says: '2 is not a supply' },
  '30-power-below-water-power.csv': { row: 9, column: 'power', says: 'less than the water power' },
  '31-npsh-on-two-points.csv': { row: 8, column: 'npsh_required', says: 'NPSH required on 2 point(s)' },
  '32-blank-model-code.csv': { row: 10, column: 'model_code', says: 'the model code is blank' },
  '33-header-only.csv': { row: null, column: null, says: 'no curve points' },
  '34-semicolon-bad-number.csv': { row: 7, column: 'head', says: '"5,6,1" is not a number' },
};

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
    it(`${file}: row ${expected.row ?? '-'}, column ${expected.column ?? '-'}, "${expected.says}", and nothing written`, async () => {
      const countsBefore = await catalogRowCounts(sequelize);
      const checksumsBefore = await tableChecksums(sequelize);
      const report = await importText(sequelize, supplier, readFileSync(`${folder}${file}`, 'utf8'), {
        fileName: file,
      });
      expect(report.errors.length, JSON.stringify(report.errors)).to.be.greaterThan(0);
      const [first] = report.errors;
      expect({ row: first.row, column: first.column }).to.deep.equal({ row: expected.row, column: expected.column });
      expect(first.message).to.contain(expected.says);
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
    expect(read.errors[0].message).to.match(/larger than .* MiB|larger than/);
    expect(read.errors[0].expected).to.equal('at most 4096 bytes');
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
    const limit = read.errors.find((error) => error.message.includes('more than 20 curve-point rows'));
    expect(limit, JSON.stringify(read.errors)).to.not.equal(undefined);
    expect(limit!.row).to.equal(4 + 21);
  });
});
