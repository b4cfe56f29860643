import type { Request, RequestHandler } from 'express';
import type { Project as ProjectView, ProjectInput, ProjectList } from '../../shared/api/api-schemas';
import { PIPE_SERIES } from '../../shared/hydraulics';
import { currentUser } from '../accounts/authenticated-user';
import { ProblemError } from '../api/problem-details';
import { unprocessable } from '../calculations/engine-problem';
import { Project } from '../database/models';
import { checkedName } from '../api/checked-text';

/*
 * A designer's saved designs. Each caller sees its own projects only: another's is as absent as
 * one that never existed. Fittings are checked by the contract; pipe series and sizes here, so a
 * saved design always opens in the design pages.
 */

function view(project: Project): ProjectView {
  return {
    id: project.id,
    name: project.name,
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
    design: project.design,
  };
}

/** The request's project input, every pipe a size of its series in the catalogue. */
function checkedInput(request: Request): ProjectInput {
  const input = request.body as ProjectInput;
  input.design.system.segments.forEach((segment, index) => {
    const pointer = `/body/design/system/segments/${index}`;
    const series = PIPE_SERIES.find((candidate) => candidate.id === segment.series);
    if (!series)
      throw unprocessable(`${pointer}/series`, `is not a pipe series of the catalogue (GET /pipe-sizes lists them)`);
    if (!series.sizes.some((size) => size.id === segment.size))
      throw unprocessable(`${pointer}/size`, `is not a size of ${series.label}`);
  });
  if (input.design.band.flowMin > input.design.band.flowMax)
    throw unprocessable('/body/design/band/flowMax', 'must not be less than flowMin');
  return { name: checkedName(input.name, '/body/name'), design: input.design };
}

async function ownProject(request: Request): Promise<Project> {
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
      const project = await Project.create({
        ownerUserId: currentUser(request).id,
        name: input.name,
        design: input.design,
      });
      response.status(201).json(view(project));
    },

    getProject: async (request, response) => {
      response.json(view(await ownProject(request)));
    },

    updateProject: async (request, response) => {
      const input = checkedInput(request);
      const project = await ownProject(request);
      project.name = input.name;
      project.design = input.design;
      project.changed('design', true);
      await project.save();
      response.json(view(project));
    },

    deleteProject: async (request, response) => {
      await (await ownProject(request)).destroy();
      response.status(204).end();
    },
  };
}
