import type { MigrationContext } from '../migrator';

/**
 * The continuous speed range (rpm) of a pump on a drive or a controller, both ends or neither: one
 * ALTER TABLE adding both columns, so the change is made whole or not at all.
 */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.sequelize.query(
    'ALTER TABLE pumps ADD COLUMN speed_min_rpm INTEGER UNSIGNED NULL, ADD COLUMN speed_max_rpm INTEGER UNSIGNED NULL',
  );
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.sequelize.query('ALTER TABLE pumps DROP COLUMN speed_min_rpm, DROP COLUMN speed_max_rpm');
}
