import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** Each time a client link was opened (the page or its PDF). */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('client_link_views', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    link_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'client_links', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    what: { type: DataTypes.ENUM('page', 'pdf'), allowNull: false },
    viewed_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await context.queryInterface.addIndex('client_link_views', ['link_id', 'viewed_at']);
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('client_link_views');
}
