import { fileURLToPath } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

const migrationsFolder = fileURLToPath(new URL('./migrations', import.meta.url));

/**
 * Umzug over the timestamped files in migrations/. MariaDB's DDL is not transactional, so each
 * migration makes one schema change and has a `down` that undoes it.
 */
export function createMigrator(sequelize: Sequelize): Umzug<MigrationContext> {
  return new Umzug<MigrationContext>({
    migrations: { glob: ['*.ts', { cwd: migrationsFolder }] },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}
