import { ProblemError } from '../api/problem-details';
import { ProjectReport, type Project } from '../database/models';

/** A file name from the project's name: ASCII letters, digits and hyphens only. */
export function fileStem(project: Project): string {
  return (
    project.name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'project'
  );
}

/** The name a proposal goes to a client with: `proposal-<project>-<the day it was made, UTC>.pdf`. */
export function proposalFileName(project: Project, report: ProjectReport): string {
  return `proposal-${fileStem(project)}-${report.createdAt.toISOString().slice(0, 10)}.pdf`;
}

/** One stored report of the project, its bytes included; a 422 naming `pointer` when the project has none by that id. */
export async function storedReportOf(project: Project, reportId: number, pointer: string): Promise<ProjectReport> {
  const report = await ProjectReport.findOne({ where: { id: reportId, projectId: project.id } });
  if (!report)
    throw new ProblemError(422, 'No such proposal', `Project ${project.id} has no stored proposal ${reportId}`, [
      { pointer, detail: 'is not a stored proposal of this project (POST /projects/{projectId}/reports makes one)' },
    ]);
  return report;
}
