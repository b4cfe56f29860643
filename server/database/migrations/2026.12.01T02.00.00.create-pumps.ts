import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable(
    'pumps',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      supplier_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'suppliers', key: 'id' },
        onDelete: 'RESTRICT',
        onUpdate: 'CASCADE',
      },
      model_code: { type: DataTypes.STRING(64), allowNull: false },
      display_name: { type: DataTypes.STRING(160), allowNull: false },
      kind: { type: DataTypes.ENUM('submersible', 'external-centrifugal', 'mixed-flow'), allowNull: false },
      nominal_speed_rpm: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      voltage_v: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
      phase_count: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
      discharge_size_mm: { type: DataTypes.DOUBLE, allowNull: true },
      solids_handling_mm: { type: DataTypes.DOUBLE, allowNull: true },
      list_price: { type: DataTypes.DECIMAL(12, 2), allowNull: true },
      price_currency: { type: DataTypes.CHAR(3), allowNull: true },
      status: { type: DataTypes.ENUM('active', 'retired'), allowNull: false, defaultValue: 'active' },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    },
    { uniqueKeys: { pumps_supplier_model_code: { fields: ['supplier_id', 'model_code'] } } },
  );
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('pumps');
}
