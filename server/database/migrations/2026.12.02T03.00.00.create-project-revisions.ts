import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('project_revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    project_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'projects', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    // 1, 2, 3 ... within the project; the highest is the project as it stands
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    // the site visit the measurements come from
    visited_on: { type: DataTypes.DATEONLY, allowNull: false },
    author_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
      onUpdate: 'CASCADE',
    },
    notes: { type: DataTypes.TEXT, allowNull: true },
    // the design as the design pages keep it (DesignDraft in openapi.yaml)
    design: { type: DataTypes.JSON, allowNull: false },
    // the chosen candidate with the curve revision it was chosen on, or null
    choice: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await context.queryInterface.addIndex('project_revisions', ['project_id', 'number'], { unique: true });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('project_revisions');
}
