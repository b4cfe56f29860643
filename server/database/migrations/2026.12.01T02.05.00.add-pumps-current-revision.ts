import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.addColumn('pumps', 'current_revision_id', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: 'curve_revisions', key: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  // MariaDB refuses to drop a column that a foreign key still uses: drop the key first, by whatever name it got.
  const references = (await context.queryInterface.getForeignKeyReferencesForTable('pumps')) as Array<{
    columnName: string;
    constraintName: string;
  }>;
  for (const reference of references.filter((candidate) => candidate.columnName === 'current_revision_id')) {
    await context.queryInterface.removeConstraint('pumps', reference.constraintName);
  }
  await context.queryInterface.removeColumn('pumps', 'current_revision_id');
}
