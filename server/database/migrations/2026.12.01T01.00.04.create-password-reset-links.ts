import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('password_reset_links', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('password_reset_links');
}
