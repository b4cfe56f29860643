import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('project_reports', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    project_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'projects', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    made_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    paper: { type: DataTypes.ENUM('a4', 'letter'), allowNull: false },
    // the PDF's bytes: a proposal with its chart and logo stays well under MEDIUMBLOB's 16 MiB
    pdf: { type: DataTypes.BLOB('medium'), allowNull: false },
    byte_length: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    catalog_revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    // milliseconds, so that reports made within a second keep their order
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await context.queryInterface.addIndex('project_reports', ['project_id', 'created_at']);
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('project_reports');
}
