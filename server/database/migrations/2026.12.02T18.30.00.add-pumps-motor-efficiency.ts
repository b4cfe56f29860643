import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** The motor's efficiency (0-1) a supplier gives, so shaft power can be taken to input power per pump. */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.addColumn('pumps', 'motor_efficiency', { type: DataTypes.DOUBLE, allowNull: true });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.removeColumn('pumps', 'motor_efficiency');
}
