import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import type {
  Project,
  ProjectInput,
  ReportList,
  ReportSummary,
  SelectionResponse,
} from '../../../shared/api/api-schemas';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { ProjectReport, Pump } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createApiToken, createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from '../selection/synthetic-catalog';
import { binaryBody, readPdf } from './pdf-text';

/*
 * Proposals of a saved design: made, stored with their checksum, listed and downloaded as made;
 * read back with pdf.js, their figures are the selection search's for the same design.
 */

function projectExample(): ProjectInput {
  const operation = (openApiDocument.paths?.['/projects'] as OpenAPIV3_1.PathItemObject)
    .post as OpenAPIV3_1.OperationObject;
  return structuredClone(
    (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'].example as ProjectInput,
  );
}

/** The selection request the design pages send for the contract's example project, written out by hand. */
const exampleSelection = {
  units: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' },
  system: {
    staticHead: 14.5,
    outletPressureHead: 0,
    frictionMethod: 'hazen-williams',
    waterTemperatureC: 20,
    segments: [
      {
        length: 240,
        pipe: 'pvc-sch40-3',
        fittings: [
          { kind: 'elbow-90-standard', count: 4 },
          { kind: 'exit', count: 1 },
        ],
        minorLossK: 0,
      },
    ],
  },
  duty: { flowMin: 90, flowMax: 130 },
  arrangements: [1, 2],
  requireOneFailed: true,
  standby: false,
  filters: { onlyPreferredRegion: false },
  energy: { hoursPerDay: 24, tariffPerKWh: 0.18 },
  limit: 20,
};

describe('reports: proposals of a saved design as PDF', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let designerToken: string;
  let project: Project;

  before(async () => {
    scratch = await createScratchDatabase('reports');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(200, 11));
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    designerToken = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    project = (
      await request(app)
        .post('/api/v1/projects')
        .set('Authorization', `Bearer ${designerToken}`)
        .send(projectExample())
        .expect(201)
    ).body as Project;
  });

  after(async () => {
    await scratch?.drop();
  });

  const as = (token: string) => ({
    get: (path: string) => request(app).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
    post: (path: string, body: object) =>
      request(app).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body),
    put: (path: string, body: object) =>
      request(app).put(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body),
  });

  async function download(token: string, path: string): Promise<request.Response> {
    return request(app)
      .get(path)
      .set('Authorization', `Bearer ${token}`)
      .buffer(true)
      .parse(binaryBody as never);
  }

  it('makes a proposal, stores it with its sha-256, lists it and gives back the same bytes', async () => {
    const designer = as(designerToken);
    const made = (await designer.post(`/projects/${project.id}/reports`, { paper: 'a4' }).expect(201))
      .body as ReportSummary;
    expect(made.projectId).to.equal(project.id);
    expect(made.paper).to.equal('a4');
    expect(made.downloadPath).to.equal(`/api/v1/projects/${project.id}/reports/${made.id}.pdf`);
    expect(made.catalogRevision).to.be.above(0);

    const listed = (await designer.get(`/projects/${project.id}/reports`).expect(200)).body as ReportList;
    expect(listed.reports.map((report) => report.id)).to.include(made.id);
    expect(listed.reports.find((report) => report.id === made.id)).to.deep.equal(made);

    const answer = await download(designerToken, made.downloadPath);
    expect(answer.status).to.equal(200);
    expect(answer.headers['content-type']).to.match(/^application\/pdf/);
    const bytes = answer.body as Buffer;
    expect(bytes.subarray(0, 5).toString('latin1')).to.equal('%PDF-');
    expect(bytes.length).to.equal(made.byteLength);
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    expect(sha256).to.equal(made.sha256);
    expect(answer.headers['repr-digest']).to.equal(`sha-256=:${Buffer.from(sha256, 'hex').toString('base64')}:`);
    const stored = await ProjectReport.findByPk(made.id);
    expect(createHash('sha256').update(stored!.pdf).digest('hex')).to.equal(made.sha256);
  });

  it("prints the selection search's duty flow, TDH and energy for the same design, on the paper asked for", async () => {
    const designer = as(designerToken);
    const selection = (await designer.post('/selections', exampleSelection).expect(200)).body as SelectionResponse;
    expect(selection.candidates.length, 'the synthetic catalog meets the example').to.be.above(1);
    const [chosen, alternative] = selection.candidates;
    // a list price for the chosen pump, so that first and life-cycle cost are printed
    await Pump.update({ listPrice: '412.50', priceCurrency: 'USD' }, { where: { id: chosen.pumpId } });

    for (const [paper, size] of [
      ['letter', [612, 792]],
      ['a4', [595, 842]],
    ] as const) {
      const made = (
        await designer
          .post(`/projects/${project.id}/reports`, { paper, clientName: 'Ada Moss', siteAddress: '4 Orchard Row' })
          .expect(201)
      ).body as ReportSummary;
      const pdf = await readPdf((await download(designerToken, made.downloadPath)).body as Buffer);
      expect(
        pdf.sizes.every(([width, height]) => width === size[0] && height === size[1]),
        paper,
      ).to.equal(true);
      const text = pdf.pages.join(' ');
      expect(text).to.include('Ada Moss').and.to.include('4 Orchard Row').and.to.include(project.name);
      expect(text).to.include(`Catalog revision ${made.catalogRevision}`);
      expect(text).to.include(`${chosen.model} (${chosen.modelCode})`);
      expect(text).to.include(
        `${chosen.operatingPoint.flow.toFixed(1)} gpm at ${chosen.operatingPoint.head.toFixed(2)} ft TDH`,
      );
      expect(text).to.include(`${chosen.annualKWh!.toFixed(0)} kWh per year`);
      expect(text).to.include(alternative.modelCode);
      const firstCost = 412.5 * chosen.arrangement.installed;
      expect(text).to.include(`${firstCost.toFixed(0)} USD`);
      expect(text).to.include(`${(firstCost + 10 * chosen.annualCost!).toFixed(0)} USD`);
      expect(text).to.include('Electricity near water').and.to.include('water hammer').and.to.include('Suction lift');
      expect(text).to.include("Crew's parts list");
      // 240 ft of 3" pipe and 10 % allowance: 264 ft, 27 sticks of 10 ft
      expect(text).to.include('264 ft');
    }
  });

  it("lets an admin make and read a designer's reports, and no other designer or integrator", async () => {
    const admin = as((await createUserWithSession(scratch.sequelize, 'admin')).token);
    const made = (await admin.post(`/projects/${project.id}/reports`, { paper: 'letter' }).expect(201))
      .body as ReportSummary;
    expect((await download(designerToken, made.downloadPath)).status).to.equal(200);

    const other = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const refused = await other.post(`/projects/${project.id}/reports`, { paper: 'letter' }).expect(404);
    expect(refused.body.pointer).to.equal('/path/projectId');
    await other.get(`/projects/${project.id}/reports`).expect(404);
    expect(
      (await download((await createUserWithSession(scratch.sequelize, 'designer')).token, made.downloadPath)).status,
    ).to.equal(404);
    await as((await createUserWithSession(scratch.sequelize, 'integrator')).token)
      .post(`/projects/${project.id}/reports`, { paper: 'letter' })
      .expect(403);
    expect(await tableChecksums(scratch.sequelize, ['sessions', 'users'])).to.deep.equal(
      Object.fromEntries(Object.entries(before).filter(([table]) => table !== 'users')),
    );
  });

  it('answers an API token with projects:write, and refuses one without it', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'designer');
    const own = (
      await request(app)
        .post('/api/v1/projects')
        .set('Authorization', `Bearer ${await createApiToken(scratch.sequelize, user.id, ['projects:write'])}`)
        .send(projectExample())
        .expect(201)
    ).body as Project;
    await as(await createApiToken(scratch.sequelize, user.id, ['projects:write']))
      .get(`/projects/${own.id}/reports`)
      .expect(200);
    await as(await createApiToken(scratch.sequelize, user.id, ['calculations:run']))
      .get(`/projects/${own.id}/reports`)
      .expect(403);
  });

  it('refuses a bad paper, an unknown report and an unreadable name with problem details, writing nothing', async () => {
    const designer = as(designerToken);
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const paper = await designer.post(`/projects/${project.id}/reports`, { paper: 'a3' }).expect(400);
    expect(paper.headers['content-type']).to.match(/^application\/problem\+json/);
    expect(paper.body.pointer).to.equal('/body/paper');
    const name = await designer
      .post(`/projects/${project.id}/reports`, { paper: 'a4', clientName: 'Ada \u202Eevil' })
      .expect(422);
    expect(name.body.pointer).to.equal('/body/clientName');
    const missing = await download(designerToken, `/api/v1/projects/${project.id}/reports/999999.pdf`);
    expect(missing.status).to.equal(404);
    await designer.get(`/projects/${project.id}/reports/abc.pdf`).expect(400);
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it("gives the crew's parts list as CSV with the sticks after the allowance asked for", async () => {
    const designer = as(designerToken);
    const answer = await designer.get(`/projects/${project.id}/parts-list.csv`).expect(200);
    expect(answer.headers['content-type']).to.match(/^text\/csv/);
    expect(answer.headers['content-disposition']).to.equal('attachment; filename="hillside-cascade-parts-list.csv"');
    const lines = answer.text.trim().split('\n');
    expect(lines[0]).to.equal('section,item,size,quantity,unit,sticks_10ft,sticks_20ft,sticks_6m,notes');
    // 240 ft + 10 % = 264 ft: 26.4 -> 27 of 10 ft, 13.2 -> 14 of 20 ft, 80.47 m / 6 = 13.4 -> 14 of 6 m
    expect(lines[1]).to.match(/^pipe,[^,]+,"?3"?.*,264,ft,27,14,14,/);
    const none = await designer.get(`/projects/${project.id}/parts-list.csv?wasteAllowancePercent=0`).expect(200);
    // 240 ft exactly: 24 of 10 ft, 12 of 20 ft; 73.15 m / 6 = 12.2 -> 13 of 6 m
    expect(none.text.split('\n')[1]).to.match(/,240,ft,24,12,13,/);
    expect(none.text).to.match(/\nfitting,90-degree standard elbow,[^\n]*,4,each,/);
    expect(none.text).to.match(/\npump,/);
    expect(none.text).not.to.match(/\n[a-z]+,[^,]*exit/i);
    const bad = await designer.get(`/projects/${project.id}/parts-list.csv?wasteAllowancePercent=150`).expect(400);
    expect(bad.body.pointer).to.equal('/query/wasteAllowancePercent');
  });

  it('adds the cable to each pump of the first-ranked set once the design gives a cable run', async () => {
    const designer = as(designerToken);
    const input = projectExample();
    await designer
      .put(`/projects/${project.id}`, { ...input, design: { ...input.design, cableLength: 60 } })
      .expect(200);
    const csv = (await designer.get(`/projects/${project.id}/parts-list.csv`).expect(200)).text;
    const pumps = [...csv.matchAll(/\npump,[^\n]*?,(\d+),each,,,,(duty|standby)/g)].reduce(
      (sum, [, count]) => sum + Number(count),
      0,
    );
    expect(pumps).to.be.greaterThan(0);
    // the synthetic pumps carry no motor rating: the cable is listed, its size left to the electrician
    const cable =
      /\nelectrical,Copper pump cable,to be sized,([\d.]+),ft,,,,"?(\d+) circuits? of 60 ft one way \+ 10 % allowance; the catalog gives no/.exec(
        csv,
      );
    expect(cable, csv).to.not.equal(null);
    expect(Number(cable![2])).to.equal(pumps);
    expect(Number(cable![1])).to.be.closeTo(60 * pumps * 1.1, 0.05);
  });
});
