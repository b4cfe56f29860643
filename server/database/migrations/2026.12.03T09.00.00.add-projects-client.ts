import type { MigrationContext } from '../migrator';

/**
 * The client a proposal goes to and the site it is for. One ALTER TABLE, so the four columns
 * arrive together or not at all (MariaDB's DDL is not transactional).
 */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.sequelize.query(
    'ALTER TABLE projects' +
      ' ADD COLUMN client_name VARCHAR(200) NULL,' +
      ' ADD COLUMN client_email VARCHAR(254) NULL,' +
      ' ADD COLUMN client_phone VARCHAR(40) NULL,' +
      ' ADD COLUMN site_address VARCHAR(400) NULL',
  );
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.sequelize.query(
    'ALTER TABLE projects DROP COLUMN client_name, DROP COLUMN client_email, DROP COLUMN client_phone, DROP COLUMN site_address',
  );
}
