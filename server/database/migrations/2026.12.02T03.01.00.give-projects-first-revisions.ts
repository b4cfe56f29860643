import type { MigrationContext } from '../migrator';

/*
 * Projects saved before revisions existed get their design as revision 1: visited on the day the
 * project was made, by its owner, without notes or a chosen pump, so they open as they were.
 * Down takes away only those lone first revisions; the projects keep their design either way.
 */

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.sequelize.query(`
    INSERT INTO project_revisions (project_id, number, visited_on, author_user_id, notes, design, choice, created_at)
    SELECT p.id, 1, DATE(p.created_at), p.owner_user_id, NULL, p.design, NULL, p.updated_at
    FROM projects p
    WHERE NOT EXISTS (SELECT 1 FROM project_revisions r WHERE r.project_id = p.id)`);
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.sequelize.query(`
    DELETE r FROM project_revisions r
    WHERE r.number = 1 AND r.notes IS NULL AND r.choice IS NULL
      AND NOT EXISTS (SELECT 1 FROM (SELECT project_id FROM project_revisions WHERE number > 1) later
                      WHERE later.project_id = r.project_id)`);
}
