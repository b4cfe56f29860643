import type { Request, RequestHandler } from 'express';
import type { Transaction } from 'sequelize';
import type { DesignSystem, ProjectInput, ProjectList } from '../../shared/api/api-schemas';
import { PIPE_SERIES } from '../../shared/hydraulics';
import { currentUser } from '../accounts/authenticated-user';
import { ProblemError } from '../api/problem-details';
import { unprocessable } from '../calculations/engine-problem';
import { Project, ProjectRevision } from '../database/models';
import type { StoredChoice } from '../database/models/project-revision';
import { checkedName } from '../api/checked-text';
import { answerProject, latestRevision, requireCurrent, storedChoice } from './project-revisions';

/*
 * A designer's saved designs. Each caller sees its own projects only: another's is as absent as
 * one that never existed. Fittings are checked by the contract; pipe series and sizes here, so a
 * saved design always opens in the design pages. Every save is a new revision (a site visit) in
 * the same transaction as the project row, which it locks, so two saves cannot both pass the
 * If-Match check.
 */

function checkSegments(segments: DesignSystem['segments'], at: string): void {
  segments.forEach((segment, index) => {
    const pointer = `${at}/segments/${index}`;
    const series = PIPE_SERIES.find((candidate) => candidate.id === segment.series);
    if (!series)
      throw unprocessable(`${pointer}/series`, `is not a pipe series of the catalogue (GET /pipe-sizes lists them)`);
    if (!series.sizes.some((size) => size.id === segment.size))
      throw unprocessable(`${pointer}/size`, `is not a size of ${series.label}`);
  });
}

/** The request's project input, every pipe a size of its series in the catalogue, branch names unique. */
function checkedInput(request: Request): ProjectInput {
  const input = request.body as ProjectInput;
  const { system } = input.design;
  checkSegments(system.segments, '/body/design/system');
  if (system.segments.length === 0 && !system.branches)
    throw unprocessable('/body/design/system/segments', 'needs at least one segment without branches');
  const branches = system.branches?.map((branch, index) => {
    const at = `/body/design/system/branches/${index}`;
    checkSegments(branch.segments, at);
    const name = checkedName(branch.name, `${at}/name`);
    if (system.branches!.slice(0, index).some((other) => other.name.trim() === name))
      throw unprocessable(`${at}/name`, 'names another branch of the system already');
    return { ...branch, name };
  });
  if (input.design.band.flowMin > input.design.band.flowMax)
    throw unprocessable('/body/design/band/flowMax', 'must not be less than flowMin');
  const design = branches ? { ...input.design, system: { ...system, branches } } : input.design;
  return { ...input, design, name: checkedName(input.name, '/body/name') };
}

/** The save as revision `number` of the project: its visit (today, UTC, when it names none) and design. */
function recordVisit(
  projectId: number,
  number: number,
  input: ProjectInput,
  authorUserId: number,
  choice: StoredChoice | null,
  transaction: Transaction,
): Promise<ProjectRevision> {
  return ProjectRevision.create(
    {
      projectId,
      number,
      visitedOn: input.visit?.visitedOn ?? new Date().toISOString().slice(0, 10),
      authorUserId,
      notes: input.visit?.notes ?? null,
      design: input.design,
      choice,
    },
    { transaction },
  );
}

export async function ownProject(request: Request): Promise<Project> {
  const projectId = Number(request.params.projectId);
  const project = await Project.findOne({ where: { id: projectId, ownerUserId: currentUser(request).id } });
  if (!project)
    throw new ProblemError(404, 'Not found', `You have no project ${projectId}`, [
      { pointer: '/path/projectId', detail: 'is not one of your projects' },
    ]);
  return project;
}

export function createProjectHandlers(): Record<
  'listProjects' | 'createProject' | 'getProject' | 'updateProject' | 'deleteProject',
  RequestHandler
> {
  return {
    listProjects: async (request, response) => {
      const projects = await Project.findAll({
        where: { ownerUserId: currentUser(request).id },
        attributes: ['id', 'name', 'createdAt', 'updatedAt'],
        order: [
          ['updatedAt', 'DESC'],
          ['id', 'DESC'],
        ],
      });
      const answer: ProjectList = {
        projects: projects.map(({ id, name, createdAt, updatedAt }) => ({
          id,
          name,
          createdAt: createdAt.toISOString(),
          updatedAt: updatedAt.toISOString(),
        })),
      };
      response.json(answer);
    },

    createProject: async (request, response) => {
      const input = checkedInput(request);
      const author = currentUser(request).id;
      const sequelize = Project.sequelize!;
      const [project, revision] = await sequelize.transaction(async (transaction) => {
        const choice = input.choice ? await storedChoice(input.choice, '/body/choice', transaction) : null;
        const made = await Project.create(
          { ownerUserId: author, name: input.name, design: input.design },
          { transaction },
        );
        return [made, await recordVisit(made.id, 1, input, author, choice, transaction)] as const;
      });
      await answerProject(response, 201, project, revision);
    },

    getProject: async (request, response) => {
      const project = await ownProject(request);
      await answerProject(response, 200, project, await latestRevision(project));
    },

    updateProject: async (request, response) => {
      const input = checkedInput(request);
      const owned = await ownProject(request);
      const sequelize = Project.sequelize!;
      const [project, revision] = await sequelize.transaction(async (transaction) => {
        const locked = await Project.findByPk(owned.id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!locked)
          throw new ProblemError(404, 'Not found', `You have no project ${owned.id}`, [
            { pointer: '/path/projectId', detail: 'is not one of your projects' },
          ]);
        const previous = await latestRevision(locked, transaction);
        requireCurrent(request, locked, previous.number);
        const choice =
          input.choice === undefined
            ? previous.choice
            : input.choice === null
              ? null
              : await storedChoice(input.choice, '/body/choice', transaction);
        locked.name = input.name;
        locked.design = input.design;
        locked.changed('design', true);
        await locked.save({ transaction });
        const next = previous.number + 1;
        return [
          locked,
          await recordVisit(locked.id, next, input, currentUser(request).id, choice, transaction),
        ] as const;
      });
      await answerProject(response, 200, project, revision);
    },

    deleteProject: async (request, response) => {
      await (await ownProject(request)).destroy();
      response.status(204).end();
    },
  };
}
