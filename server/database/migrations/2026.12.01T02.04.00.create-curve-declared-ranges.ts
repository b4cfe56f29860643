import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('curve_declared_ranges', {
    revision_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      primaryKey: true,
      references: { model: 'curve_revisions', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    region: { type: DataTypes.ENUM('preferred', 'allowable'), allowNull: false, primaryKey: true },
    flow_min_m3s: { type: DataTypes.DOUBLE, allowNull: false },
    flow_max_m3s: { type: DataTypes.DOUBLE, allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('curve_declared_ranges');
}
