import type { Request, RequestHandler } from 'express';
import type { ProjectRecheck, RevisionComparison } from '../../shared/api/api-schemas';
import { ProblemError } from '../api/problem-details';
import { unprocessable } from '../calculations/engine-problem';
import { Pump, ProjectRevision } from '../database/models';
import type { StoredChoice } from '../database/models/project-revision';
import { designChanges } from './design-changes';
import { chosenCurve, choiceOutcome, designOutcome, designUnits, type ChosenCurve } from './design-evaluation';
import { ownProject } from './project-handlers';
import { choiceView, latestRevision, revisionView } from './project-revisions';

/* A project's site visits, what changed between two of them, and its choice against today's catalog. */

async function revisionNumbered(projectId: number, number: number, pointer: string): Promise<ProjectRevision> {
  const revision = await ProjectRevision.findOne({ where: { projectId, number } });
  if (!revision)
    throw new ProblemError(404, 'Not found', `The project has no revision ${number}`, [
      { pointer, detail: 'is not a revision of this project' },
    ]);
  return revision;
}

async function curveOf(choice: StoredChoice): Promise<ChosenCurve> {
  const curve = await chosenCurve(choice.pumpId, choice.curveRevisionId);
  if (!curve) throw new Error(`stored choice names curve revision ${choice.curveRevisionId} of another pump`);
  return curve;
}

/** What the outcome on the current curve changes against the saved one, in words; empty when nothing. */
function answerChanges(saved: ProjectRecheck['saved'], current: ProjectRecheck['current']): string[] {
  if (!current) return ['the pump is no longer an active catalog pump'];
  const changes: string[] = [];
  if (saved.inBand !== current.inBand) changes.push(current.inBand ? 'now in the duty band' : 'out of the duty band');
  if (saved.region !== current.region)
    changes.push(`region ${saved.region ?? 'none'} becomes ${current.region ?? 'none'}`);
  if (saved.redundant !== current.redundant) changes.push(current.redundant ? 'now redundant' : 'no longer redundant');
  return changes;
}

export function createProjectHistoryHandlers(): Record<
  'listProjectRevisions' | 'compareProjectRevisions' | 'recheckProject',
  RequestHandler
> {
  return {
    listProjectRevisions: async (request, response) => {
      const project = await ownProject(request);
      const revisions = await ProjectRevision.findAll({ where: { projectId: project.id }, order: [['number', 'ASC']] });
      response.json({ revisions: await Promise.all(revisions.map(revisionView)) });
    },

    compareProjectRevisions: async (request: Request, response) => {
      const project = await ownProject(request);
      const query = request.query as unknown as { from: number; to: number };
      const before = await revisionNumbered(project.id, query.from, '/query/from');
      const after = await revisionNumbered(project.id, query.to, '/query/to');
      const choice = after.choice ?? before.choice;
      const chosen = choice
        ? {
            curve: await curveOf(choice),
            arrangement: { installed: choice.installed, running: choice.running, speedRpm: choice.speedRpm },
          }
        : null;
      const units = designUnits(after.design.unitSystem);
      const answer: RevisionComparison = {
        from: before.number,
        to: after.number,
        changes: designChanges(before.design, after.design),
        before: designOutcome(before.design, units, chosen),
        after: designOutcome(after.design, units, chosen),
      };
      response.json(answer);
    },

    recheckProject: async (request, response) => {
      const project = await ownProject(request);
      const revision = await latestRevision(project);
      const choice = revision.choice;
      if (!choice)
        throw unprocessable('/path/projectId', 'has no chosen pump to re-check: save the project with a choice');
      const arrangement = { installed: choice.installed, running: choice.running, speedRpm: choice.speedRpm };
      const units = designUnits(revision.design.unitSystem);
      const savedCurve = await curveOf(choice);
      const saved = choiceOutcome(revision.design, savedCurve, arrangement, units);
      const pump = await Pump.findByPk(choice.pumpId);
      const currentCurve =
        pump?.status === 'active' && pump.currentRevisionId !== null
          ? await chosenCurve(pump.id, pump.currentRevisionId)
          : null;
      const current = currentCurve ? choiceOutcome(revision.design, currentCurve, arrangement, units) : null;
      const newerCurve = currentCurve !== null && currentCurve.revisionNumber > savedCurve.revisionNumber;
      const changes = answerChanges(saved, current);
      const code = savedCurve.pump.modelCode;
      const summary =
        changes.length > 0
          ? `${currentCurve ? `curve revision ${currentCurve.revisionNumber} of ${code}` : 'the current catalog'} changes the answer: ${changes.join('; ')}`
          : newerCurve
            ? `curve revision ${currentCurve.revisionNumber} of ${code} leaves the answer as it was`
            : `${code} has no newer curve revision: the answer stands`;
      const answer: ProjectRecheck = {
        revision: revision.number,
        choice: (await choiceView(choice))!,
        newerCurve,
        changesAnswer: changes.length > 0,
        summary,
        saved,
        current,
      };
      response.json(answer);
    },
  };
}
