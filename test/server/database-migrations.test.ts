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
