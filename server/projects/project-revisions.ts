import type { Request, Response } from 'express';
import type { Transaction } from 'sequelize';
import type {
  Project as ProjectView,
  ProjectChoice,
  ProjectClient,
  ProjectChoiceInput,
  ProjectRevisionView,
} from '../../shared/api/api-schemas';
import { ProblemError } from '../api/problem-details';
import { unprocessable } from '../calculations/engine-problem';
import { CurveRevision, Project, ProjectRevision, Pump, Supplier, User } from '../database/models';
import type { StoredChoice } from '../database/models/project-revision';

/*
 * A project's revisions: every save is one, numbered from 1, and the highest is the project as
 * it stands. Its ETag names the project and that number, so a save made on an older one is told.
 */

export function etagOf(projectId: number, revision: number): string {
  return `"p${projectId}r${revision}"`;
}

/** The project's newest revision; every project has one (migrated projects their first). */
export async function latestRevision(project: Project, transaction?: Transaction): Promise<ProjectRevision> {
  const revision = await ProjectRevision.findOne({
    where: { projectId: project.id },
    order: [['number', 'DESC']],
    transaction,
  });
  if (!revision) throw new Error(`project ${project.id} has no revision`);
  return revision;
}

/**
 * Refuses a save whose `If-Match` names another revision (412, nothing written). A save without
 * `If-Match` is taken as it comes: the contract says why.
 */
export function requireCurrent(request: Request, project: Project, current: number): void {
  const header = request.get('If-Match');
  if (header === undefined) return;
  const tags = header.split(',').map((tag) => tag.trim());
  if (tags.includes('*') || tags.includes(etagOf(project.id, current))) return;
  throw new ProblemError(
    412,
    'Project saved since',
    `the project was saved since you opened it (it is at revision ${current} now): reload it, or save yours as a new project`,
    [{ pointer: '/headers/if-match', detail: "is not the project's current revision" }],
    'project-saved-since',
    { currentRevision: current },
  );
}

/** The choice as stored: the curve revision named, or the pump's current one; a 422 for another pump's. */
export async function storedChoice(
  input: ProjectChoiceInput,
  pointer: string,
  transaction?: Transaction,
): Promise<StoredChoice> {
  if (input.arrangement.installed < input.arrangement.running)
    throw unprocessable(`${pointer}/arrangement/installed`, 'must not be less than running');
  const pump = await Pump.findByPk(input.pumpId, { transaction });
  if (!pump) throw unprocessable(`${pointer}/pumpId`, 'is not a catalog pump');
  const curveRevisionId = input.curveRevisionId ?? pump.currentRevisionId;
  if (curveRevisionId === null) throw unprocessable(`${pointer}/pumpId`, 'has no curve on file');
  if (input.curveRevisionId !== undefined) {
    const revision = await CurveRevision.findByPk(curveRevisionId, { attributes: ['id', 'pumpId'], transaction });
    if (revision?.pumpId !== pump.id)
      throw unprocessable(`${pointer}/curveRevisionId`, 'is not a curve revision of that pump');
  }
  return {
    pumpId: pump.id,
    installed: input.arrangement.installed,
    running: input.arrangement.running,
    speedRpm: input.speedRpm ?? null,
    curveRevisionId,
  };
}

/** The stored choice as the answer shows it, with the pump's names and the curve revision's number. */
export async function choiceView(choice: StoredChoice | null): Promise<ProjectChoice | null> {
  if (!choice) return null;
  const [pump, revision] = await Promise.all([
    Pump.findByPk(choice.pumpId, { include: [{ model: Supplier, as: 'supplier' }] }),
    CurveRevision.findByPk(choice.curveRevisionId, { attributes: ['id', 'number'] }),
  ]);
  return {
    pumpId: choice.pumpId,
    supplier: pump?.supplier?.name ?? '',
    model: pump?.displayName ?? '',
    modelCode: pump?.modelCode ?? '',
    arrangement: { installed: choice.installed, running: choice.running },
    speedRpm: choice.speedRpm,
    curveRevisionId: choice.curveRevisionId,
    curveRevisionNumber: revision?.number ?? 0,
  };
}

/** The project's client and site; null where none is recorded. */
export function projectClientView(project: Project): ProjectClient {
  return {
    clientName: project.clientName ?? null,
    clientEmail: project.clientEmail ?? null,
    clientPhone: project.clientPhone ?? null,
    siteAddress: project.siteAddress ?? null,
  };
}

export async function projectView(project: Project, revision: ProjectRevision): Promise<ProjectView> {
  return {
    id: project.id,
    name: project.name,
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
    revision: revision.number,
    visitedOn: revision.visitedOn,
    notes: revision.notes,
    choice: await choiceView(revision.choice),
    client: projectClientView(project),
    design: revision.design,
  };
}

/** Answers the project with the ETag of its revision. */
export async function answerProject(
  response: Response,
  status: number,
  project: Project,
  revision: ProjectRevision,
): Promise<void> {
  response
    .status(status)
    .set('ETag', etagOf(project.id, revision.number))
    .json(await projectView(project, revision));
}

export async function revisionView(revision: ProjectRevision): Promise<ProjectRevisionView> {
  const author = revision.authorUserId === null ? null : await User.findByPk(revision.authorUserId);
  return {
    number: revision.number,
    visitedOn: revision.visitedOn,
    author: author ? { id: author.id, name: author.name } : null,
    notes: revision.notes,
    savedAt: revision.createdAt.toISOString(),
    design: revision.design,
    choice: await choiceView(revision.choice),
  };
}
