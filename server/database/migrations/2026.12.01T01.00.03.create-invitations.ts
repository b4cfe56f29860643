import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('invitations', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'supplier-admin', 'designer', 'integrator'), allowNull: false },
    supplier_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'suppliers', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    invited_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
      onUpdate: 'CASCADE',
    },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('invitations');
}
