import type { MigrationContext } from '../migrator';

const constraintName = 'curve_imports_imported_by_user_id_fk';

/** Who loaded a curve table is a user of this site (or nobody, for the command line and the demo seed). */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  // a row naming a user that is gone keeps its label (imported_by) and loses the id
  await context.sequelize.query(
    'UPDATE curve_imports c LEFT JOIN users u ON u.id = c.imported_by_user_id SET c.imported_by_user_id = NULL WHERE u.id IS NULL',
  );
  await context.queryInterface.addConstraint('curve_imports', {
    type: 'foreign key',
    name: constraintName,
    fields: ['imported_by_user_id'],
    references: { table: 'users', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.removeConstraint('curve_imports', constraintName);
}
