import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** The facts a proposal was made with (company, client, site, chosen pump and duty), for the client's read-only page. */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.addColumn('project_reports', 'facts', { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.removeColumn('project_reports', 'facts');
}
