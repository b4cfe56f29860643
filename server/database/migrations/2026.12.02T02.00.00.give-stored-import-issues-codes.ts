import { QueryTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/*
 * Import reports stored before issues carried codes hold sentences only. Each such issue gets the
 * code `recorded-as-text` with its sentence as the value, so every stored report answers in the
 * contract's shape (code, params, message). Down takes away only what up added.
 */

interface StoredIssue {
  code?: string;
  params?: Record<string, unknown>;
  message?: string;
  expected?: string;
}

interface StoredReport {
  errors?: StoredIssue[];
  warnings?: StoredIssue[];
  pumps?: Array<{ warnings?: StoredIssue[] }>;
}

function issueLists(report: StoredReport): StoredIssue[][] {
  return [report.errors ?? [], report.warnings ?? [], ...(report.pumps ?? []).map((pump) => pump.warnings ?? [])];
}

async function rewriteReports(context: MigrationContext, change: (issue: StoredIssue) => boolean): Promise<void> {
  const rows = await context.sequelize.query<{ id: number; report: string | StoredReport }>(
    'SELECT id, report FROM curve_imports',
    { type: QueryTypes.SELECT },
  );
  for (const row of rows) {
    const report = (typeof row.report === 'string' ? JSON.parse(row.report) : row.report) as StoredReport;
    const changed = issueLists(report)
      .flat()
      .map(change)
      .some((was) => was);
    if (changed) {
      await context.sequelize.query('UPDATE curve_imports SET report = ? WHERE id = ?', {
        replacements: [JSON.stringify(report), row.id],
      });
    }
  }
}

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await rewriteReports(context, (issue) => {
    if (issue.code !== undefined) return false;
    issue.code = 'recorded-as-text';
    issue.params = { message: issue.message ?? '', ...(issue.expected ? { expected: issue.expected } : {}) };
    return true;
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await rewriteReports(context, (issue) => {
    if (issue.code !== 'recorded-as-text') return false;
    delete issue.code;
    delete issue.params;
    return true;
  });
}
