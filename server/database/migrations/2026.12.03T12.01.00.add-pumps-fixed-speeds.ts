import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** The fixed speeds of a multi-speed pump (rpm, ascending, as `1450;2900`). */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.addColumn('pumps', 'fixed_speeds_rpm', { type: DataTypes.STRING(120), allowNull: true });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.removeColumn('pumps', 'fixed_speeds_rpm');
}
