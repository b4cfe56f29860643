import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** How each user likes the pages laid out, kept on the server so that it follows them to any browser. */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('user_preferences', {
    // one row per user: the user is the key
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    // the candidates table's shown columns, in table order; null until the user first chooses
    candidate_columns: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('user_preferences');
}
