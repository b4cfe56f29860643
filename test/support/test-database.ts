import type { Sequelize } from 'sequelize';
import mariadb from 'mariadb';
import { loadConfig, type RiffleConfig } from '../../server/config';
import { createSequelize } from '../../server/database/connection';
import { createMigrator } from '../../server/database/migrator';
import { initialiseModels } from '../../server/database/models';

/** The throwaway database that `npm test` started; the suites run only under it. */
export function testDatabaseConfig(): RiffleConfig['database'] {
  if (!process.env.RIFFLE_TEST_MARIADB_FOLDER) {
    throw new Error('these suites need the throwaway MariaDB that `npm test` starts: run them with npm test');
  }
  return loadConfig().database;
}

let scratchCount = 0;

/**
 * A new, empty, migrated database of its own on the test server, for a suite that writes.
 * Models are bound to the returned connection.
 */
export async function createScratchDatabase(
  label: string,
): Promise<{ sequelize: Sequelize; drop: () => Promise<void> }> {
  const base = testDatabaseConfig();
  const name = `riffle_scratch_${label.replace(/[^a-z0-9]/gi, '_').toLowerCase()}_${process.pid}_${++scratchCount}`;
  const admin = await mariadb.createConnection({
    host: base.host,
    port: base.port,
    user: base.user,
    password: base.password,
  });
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.end();
  const sequelize = createSequelize({ ...base, name });
  initialiseModels(sequelize);
  await createMigrator(sequelize).up();
  return {
    sequelize,
    drop: async () => {
      await sequelize.close();
      const cleaner = await mariadb.createConnection({
        host: base.host,
        port: base.port,
        user: base.user,
        password: base.password,
      });
      await cleaner.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await cleaner.end();
    },
  };
}
