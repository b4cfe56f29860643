import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('api_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    name: { type: DataTypes.STRING(80), allowNull: false },
    // The first characters of the token, shown so that its owner can tell tokens apart.
    token_prefix: { type: DataTypes.STRING(16), allowNull: false },
    // SHA-256 of the token, hex; the token itself is shown once and never stored.
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    // Space-separated scope names.
    scopes: { type: DataTypes.STRING(255), allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    last_used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('api_tokens');
}
