import { createHash } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import type { ReportList, ReportRequest, ReportSummary } from '../../shared/api/api-schemas';
import { currentUser } from '../accounts/authenticated-user';
import { callerPresence } from '../api/caller-presence';
import { ProblemError } from '../api/problem-details';
import type { CatalogSnapshot } from '../catalog/catalog-snapshot';
import { CompanyProfile, CurveRevision, Project, ProjectReport, Pump } from '../database/models';
import { designFigures, type DesignFigures } from './design-selection';
import { DEFAULT_WASTE_ALLOWANCE_PERCENT, partsList, partsListCsv, type PumpElectrical } from './parts-list';
import { optionalText } from './profile-handlers';
import type { PumpPrice } from './proposal-costs';
import { proposalPdf } from './proposal-pdf';
import { proposalFacts } from './proposal-facts';
import { fileStem } from './stored-reports';

/*
 * Proposals and parts lists of a saved design. The project's owner and admins may make and read
 * them; to anyone else the project is as absent as one that never existed. Every figure comes from
 * the selection search the API answers with, run again on the saved design.
 */

/** The project named by the path, when the caller owns it or is an admin. */
async function reachableProject(request: Request): Promise<Project> {
  const projectId = Number(request.params.projectId);
  const user = currentUser(request);
  const project = await Project.findOne({
    where: user.role === 'admin' ? { id: projectId } : { id: projectId, ownerUserId: user.id },
  });
  if (!project)
    throw new ProblemError(404, 'Not found', `You have no project ${projectId}`, [
      { pointer: '/path/projectId', detail: 'is not one of your projects' },
    ]);
  return project;
}

/** The saved design's figures; a design the engine refuses is a 422 on the project, not on this request's body. */
/** The catalog's motor rating of the first-ranked pump, for the parts list's cable; null without one. */
async function chosenPumpElectrical(catalog: CatalogSnapshot, figures: DesignFigures): Promise<PumpElectrical | null> {
  const chosen = figures.selection.candidates[0];
  return chosen ? ((await catalog.findPump(chosen.pumpId))?.electrical ?? null) : null;
}

async function savedDesignFigures(catalog: CatalogSnapshot, project: Project): Promise<DesignFigures> {
  try {
    return await designFigures(catalog, project.design);
  } catch (error) {
    if (!(error instanceof ProblemError) || error.status !== 422) throw error;
    throw new ProblemError(422, 'Design cannot be computed', `The saved design cannot be computed: ${error.detail}`, [
      { pointer: '/path/projectId', detail: `its saved design: ${error.fieldProblems[0]?.detail ?? error.detail}` },
    ]);
  }
}

async function pricesOf(figures: DesignFigures): Promise<Map<number, PumpPrice>> {
  const ids = [...new Set(figures.selection.candidates.map((candidate) => candidate.pumpId))];
  if (ids.length === 0) return new Map();
  const pumps = await Pump.findAll({ where: { id: ids }, attributes: ['id', 'listPrice', 'priceCurrency'] });
  return new Map(
    pumps
      .filter((pump) => pump.listPrice !== null && pump.priceCurrency !== null)
      .map((pump) => [pump.id, { listPrice: Number(pump.listPrice), currency: pump.priceCurrency! }]),
  );
}

/** Rolls back a proposal whose caller cancelled before it was stored. */
class CallerGone extends Error {}

function summary(report: ProjectReport): ReportSummary {
  return {
    id: report.id,
    projectId: report.projectId,
    paper: report.paper,
    createdAt: report.createdAt.toISOString(),
    byteLength: report.byteLength,
    sha256: report.sha256,
    catalogRevision: report.catalogRevision,
    downloadPath: `/api/v1/projects/${report.projectId}/reports/${report.id}.pdf`,
  };
}

export function createReportHandlers(
  catalog: CatalogSnapshot,
): Record<
  'createProjectReport' | 'listProjectReports' | 'downloadProjectReport' | 'getProjectPartsList',
  RequestHandler
> {
  return {
    createProjectReport: async (request, response) => {
      const caller = callerPresence(response);
      const body = request.body as ReportRequest;
      const givenClient = optionalText(body.clientName ?? '', '/body/clientName');
      const givenSite = optionalText(body.siteAddress ?? '', '/body/siteAddress');
      const project = await reachableProject(request);
      // the request's client and site, else those recorded on the project
      const clientName = givenClient || (project.clientName ?? '');
      const siteAddress = givenSite || (project.siteAddress ?? '');
      const figures = await savedDesignFigures(catalog, project);
      const [prices, catalogRevision, profile] = await Promise.all([
        pricesOf(figures),
        CurveRevision.max<number | null, CurveRevision>('id'),
        CompanyProfile.findByPk(project.ownerUserId),
      ]);
      // cancelled while the figures were worked out: no PDF is made
      if (caller.gone) return;
      const pdf = await proposalPdf({
        paper: body.paper,
        profile: {
          name: profile?.name ?? '',
          address: profile?.address ?? '',
          phone: profile?.phone ?? '',
          email: profile?.email ?? '',
          licenceNumber: profile?.licenceNumber ?? '',
          logo: profile?.logo ?? null,
        },
        projectName: project.name,
        clientName,
        siteAddress,
        clientContact: [project.clientEmail, project.clientPhone].filter(Boolean).join(', '),
        design: project.design,
        figures,
        prices,
        parts: partsList(
          project.design,
          figures.selection.candidates[0] ?? null,
          body.wasteAllowancePercent ?? DEFAULT_WASTE_ALLOWANCE_PERCENT,
          await chosenPumpElectrical(catalog, figures),
        ),
        madeAt: new Date(),
        catalogRevision: catalogRevision ?? 0,
      });
      // A proposal nobody waited for is not kept: the caller who cancelled is asked nothing
      // about it and would find it listed unasked. The last look is taken just before the commit.
      const report = await ProjectReport.sequelize!.transaction(async (transaction) => {
        const made = await ProjectReport.create(
          {
            projectId: project.id,
            madeByUserId: currentUser(request).id,
            paper: body.paper,
            pdf,
            byteLength: pdf.length,
            sha256: createHash('sha256').update(pdf).digest('hex'),
            catalogRevision: catalogRevision ?? 0,
            facts: proposalFacts(project, profile?.name ?? '', clientName, siteAddress, figures),
          },
          { transaction },
        );
        if (caller.gone) throw new CallerGone();
        return made;
      }).catch((error: unknown) => {
        if (error instanceof CallerGone) return null;
        throw error;
      });
      if (report) response.status(201).json(summary(report));
    },

    listProjectReports: async (request, response) => {
      const project = await reachableProject(request);
      const reports = await ProjectReport.findAll({
        where: { projectId: project.id },
        attributes: { exclude: ['pdf'] },
        order: [
          ['createdAt', 'DESC'],
          ['id', 'DESC'],
        ],
      });
      const answer: ReportList = { reports: reports.map(summary) };
      response.json(answer);
    },

    downloadProjectReport: async (request, response) => {
      const project = await reachableProject(request);
      const reportId = Number(request.params.reportId);
      const report = await ProjectReport.findOne({ where: { id: reportId, projectId: project.id } });
      if (!report)
        throw new ProblemError(404, 'Not found', `Project ${project.id} has no report ${reportId}`, [
          { pointer: '/path/reportId', detail: 'is not a report of this project' },
        ]);
      response
        .type('application/pdf')
        .set('Content-Disposition', `attachment; filename="${fileStem(project)}-report-${report.id}.pdf"`)
        .set('Repr-Digest', `sha-256=:${Buffer.from(report.sha256, 'hex').toString('base64')}:`)
        .send(report.pdf);
    },

    getProjectPartsList: async (request, response) => {
      const query = request.query as { wasteAllowancePercent?: number };
      const project = await reachableProject(request);
      const figures = await savedDesignFigures(catalog, project);
      const lines = partsList(
        project.design,
        figures.selection.candidates[0] ?? null,
        query.wasteAllowancePercent ?? DEFAULT_WASTE_ALLOWANCE_PERCENT,
        await chosenPumpElectrical(catalog, figures),
      );
      response
        .type('text/csv; charset=utf-8')
        .set('Content-Disposition', `attachment; filename="${fileStem(project)}-parts-list.csv"`)
        .send(partsListCsv(lines));
    },
  };
}
