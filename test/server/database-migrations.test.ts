import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import { createMigrator } from '../../server/database/migrator';
import { Supplier } from '../../server/database/models';
import { createUserWithSession } from '../support/accounts';
import { createScratchDatabase } from '../support/test-database';

describe('database migrations', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;

  before(async () => {
    scratch = await createScratchDatabase('migrations');
  });

  after(async () => {
    await scratch?.drop();
  });

  const tables = async () =>
    (await scratch.sequelize.query<Record<string, string>>('SHOW TABLES', { type: QueryTypes.SELECT }))
      .map((row) => Object.values(row)[0])
      .sort();

  it('keep a curve import to users of this site: an unknown user id is refused, a known one or none is kept', async () => {
    const supplier = await Supplier.create({ code: 'KEYCHECK', name: 'Key Check Demo Supply' });
    const { user } = await createUserWithSession(scratch.sequelize, 'supplier-admin', { supplierId: supplier.id });
    const insert = (userId: number | null) =>
      scratch.sequelize.query(
        `INSERT INTO curve_imports (supplier_id, imported_by_user_id, imported_by, channel, file_name, file_checksum, file_units, row_count, pump_count, new_count, changed_count, unchanged_count, report, created_at)
         VALUES (?, ?, 'test', 'api', 'a.csv', REPEAT('0', 64), '{}', 0, 0, 0, 0, 0, '{}', NOW())`,
        { replacements: [supplier.id, userId] },
      );
    await insert(user.id);
    await insert(null);
    let refused: unknown;
    await insert(999_999).catch((error: unknown) => (refused = error));
    expect(String((refused as Error | undefined)?.message)).to.match(/foreign key constraint fails/i);
  });

  it('give the issues of a report stored before codes the code recorded-as-text, and take only that away going down', async () => {
    const supplier = await Supplier.create({ code: 'OLDREPORT', name: 'Old Report Demo Supply' });
    const stored = {
      errors: [{ row: 4, column: 'head', message: 'head rises from row 3', expected: 'a falling curve' }],
      warnings: [
        { row: 2, column: 'head', code: 'head-rise-flagged', params: { previousRow: 1, share: 0.01 }, message: 'kept' },
      ],
      pumps: [{ warnings: [{ row: null, column: null, message: 'BEP unknown' }] }],
    };
    await scratch.sequelize.query(
      `INSERT INTO curve_imports (supplier_id, imported_by, channel, file_name, file_checksum, file_units, row_count, pump_count, new_count, changed_count, unchanged_count, report, created_at)
       VALUES (?, 'test', 'api', 'old.csv', REPEAT('0', 64), '{}', 0, 0, 0, 0, 0, ?, NOW())`,
      { replacements: [supplier.id, JSON.stringify(stored)] },
    );
    const [{ id }] = await scratch.sequelize.query<{ id: number }>(
      "SELECT id FROM curve_imports WHERE file_name = 'old.csv'",
      { type: QueryTypes.SELECT },
    );
    const report = async () => {
      const [row] = await scratch.sequelize.query<{ report: string | object }>(
        'SELECT report FROM curve_imports WHERE id = ?',
        { replacements: [id], type: QueryTypes.SELECT },
      );
      return typeof row.report === 'string' ? JSON.parse(row.report) : row.report;
    };
    const migrator = createMigrator(scratch.sequelize);
    const name = '2026.12.02T02.00.00.give-stored-import-issues-codes.ts';
    await migrator.down({ to: name });
    await migrator.up({ to: name });
    const after = await report();
    expect(after.errors[0]).to.deep.include({
      code: 'recorded-as-text',
      params: { message: 'head rises from row 3', expected: 'a falling curve' },
      message: 'head rises from row 3',
    });
    expect(after.warnings[0].code).to.equal('head-rise-flagged');
    expect(after.pumps[0].warnings[0]).to.deep.include({
      code: 'recorded-as-text',
      params: { message: 'BEP unknown' },
    });
    await migrator.down({ to: name });
    expect(await report()).to.deep.equal(stored);
    await migrator.up();
  });

  it('go down to an empty schema and up again', async () => {
    const migrator = createMigrator(scratch.sequelize);
    const applied = (await migrator.executed()).length;
    const before = await tables();
    await migrator.down({ to: 0 });
    expect(await tables()).to.deep.equal(['schema_migrations']);
    await migrator.up();
    expect((await migrator.executed()).length).to.equal(applied);
    expect(await tables()).to.deep.equal(before);
  });
});
