import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** The motor's full-load current (A) a supplier gives, so the cable run to the pump can be sized. */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.addColumn('pumps', 'full_load_current_a', { type: DataTypes.DOUBLE, allowNull: true });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.removeColumn('pumps', 'full_load_current_a');
}
