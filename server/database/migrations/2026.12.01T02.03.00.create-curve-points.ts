import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('curve_points', {
    revision_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      primaryKey: true,
      references: { model: 'curve_revisions', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, primaryKey: true },
    flow_m3s: { type: DataTypes.DOUBLE, allowNull: false },
    head_m: { type: DataTypes.DOUBLE, allowNull: false },
    power_w: { type: DataTypes.DOUBLE, allowNull: true },
    efficiency: { type: DataTypes.DOUBLE, allowNull: true },
    npsh_required_m: { type: DataTypes.DOUBLE, allowNull: true },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('curve_points');
}
