import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('curve_imports', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    supplier_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'suppliers', key: 'id' },
      onDelete: 'RESTRICT',
      onUpdate: 'CASCADE',
    },
    // The account's id when an account imported; the command line and the demo seed have none.
    imported_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    imported_by: { type: DataTypes.STRING(200), allowNull: false },
    channel: { type: DataTypes.ENUM('api', 'command', 'demo-seed'), allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    file_checksum: { type: DataTypes.CHAR(64), allowNull: false },
    file_units: { type: DataTypes.JSON, allowNull: false },
    row_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    pump_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    new_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    changed_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    unchanged_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    report: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('curve_imports');
}
