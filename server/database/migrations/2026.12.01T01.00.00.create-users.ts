import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'supplier-admin', 'designer', 'integrator'), allowNull: false },
    supplier_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'suppliers', key: 'id' },
      onDelete: 'RESTRICT',
      onUpdate: 'CASCADE',
    },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('users');
}
