import { mock } from 'node:test';
import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import type { DesignDraft, Project, ProjectInput } from '../../../shared/api/api-schemas';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { createApiToken, createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/** The contract's own example of a project to save. */
function contractExample(): ProjectInput {
  const operation = (openApiDocument.paths?.['/projects'] as OpenAPIV3_1.PathItemObject)
    .post as OpenAPIV3_1.OperationObject;
  return structuredClone(
    (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'].example as ProjectInput,
  );
}

describe('projects: saved designs', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;

  before(async () => {
    scratch = await createScratchDatabase('projects');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
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
    delete: (path: string) => request(app).delete(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
  });

  it("keeps a design's cable run length, and refuses one of 0 naming the field", async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const example = contractExample();
    const design: DesignDraft = { ...example.design, cableLength: 45 };
    const created = (await designer.post('/projects', { ...example, design }).expect(201)).body as Project;
    expect(created.design.cableLength).to.equal(45);
    expect((await designer.get(`/projects/${created.id}`).expect(200)).body.design.cableLength).to.equal(45);
    const refused = await designer.post('/projects', { ...example, design: { ...design, cableLength: 0 } }).expect(400);
    expect(refused.body.pointer).to.equal('/body/design/cableLength');
  });

  it('saves a design, lists it, gives it back as saved, saves it again changed, and deletes it', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const example = contractExample();
    const created = (await designer.post('/projects', example).expect(201)).body as Project;
    expect(created.name).to.equal('Hillside cascade');
    expect(created.design).to.deep.equal(example.design);

    const changed: DesignDraft = structuredClone(example.design);
    changed.system.segments[0].length = 260;
    changed.unitSystem = 'us';
    const second = (await designer.post('/projects', { name: '  Lower pond  ', design: example.design }).expect(201))
      .body as Project;
    expect(second.name).to.equal('Lower pond');
    // the clock moves on a second (updatedAt keeps whole seconds) without waiting for it
    mock.timers.enable({ apis: ['Date'], now: Date.now() });
    let updated: Project;
    try {
      mock.timers.tick(1100);
      updated = (
        await designer
          .put(`/projects/${created.id}`, { name: 'Hillside cascade, longer run', design: changed })
          .expect(200)
      ).body as Project;
    } finally {
      mock.timers.reset();
    }
    expect(updated.design.system.segments[0].length).to.equal(260);
    expect(Date.parse(updated.updatedAt)).to.be.greaterThan(Date.parse(created.updatedAt));

    const list = (await designer.get('/projects').expect(200)).body as {
      projects: Array<{ id: number; name: string }>;
    };
    expect(list.projects.map((project) => project.name)).to.deep.equal(['Hillside cascade, longer run', 'Lower pond']);
    expect((await designer.get(`/projects/${created.id}`).expect(200)).body.design).to.deep.equal(changed);

    await designer.delete(`/projects/${created.id}`).expect(204);
    await designer.get(`/projects/${created.id}`).expect(404);
    expect(((await designer.get('/projects').expect(200)).body as { projects: unknown[] }).projects).to.have.length(1);
  });

  it("keeps each designer's projects to that designer: another's is a 404 and stays as it was", async () => {
    const owner = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const other = as((await createUserWithSession(scratch.sequelize, 'integrator')).token);
    const project = (await owner.post('/projects', contractExample()).expect(201)).body as Project;
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const refused = await other.get(`/projects/${project.id}`).expect(404);
    expect(refused.body.errors[0].pointer).to.equal('/path/projectId');
    await other.put(`/projects/${project.id}`, contractExample()).expect(404);
    await other.delete(`/projects/${project.id}`).expect(404);
    expect(((await other.get('/projects').expect(200)).body as { projects: unknown[] }).projects).to.deep.equal([]);
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it('refuses a pipe size the catalogue does not know (422) and a malformed design (400), naming the field, writing nothing', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const unknownSize = contractExample();
    unknownSize.design.system.segments[0].size = 'pvc-sch40-7';
    const sizeProblem = await designer.post('/projects', unknownSize).expect(422);
    expect(sizeProblem.body.errors[0].pointer).to.equal('/body/design/system/segments/0/size');
    const unknownSeries = contractExample();
    unknownSeries.design.system.segments[0].series = 'clay';
    expect((await designer.post('/projects', unknownSeries).expect(422)).body.errors[0].pointer).to.equal(
      '/body/design/system/segments/0/series',
    );
    const band = contractExample();
    band.design.band = { flowMin: 130, flowMax: 90 };
    expect((await designer.post('/projects', band).expect(422)).body.errors[0].pointer).to.equal(
      '/body/design/band/flowMax',
    );
    const malformed = contractExample() as unknown as { design: { system: { waterTemperatureC: number } } };
    malformed.design.system.waterTemperatureC = 80;
    expect((await designer.post('/projects', malformed).expect(400)).body.errors[0].pointer).to.equal(
      '/body/design/system/waterTemperatureC',
    );
    await designer.post('/projects', { ...contractExample(), name: '<b>pond</b>' }).expect(400);
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it('lets an API token with projects:write save projects, and not one without', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'integrator');
    await as(await createApiToken(scratch.sequelize, user.id, ['projects:write']))
      .post('/projects', contractExample())
      .expect(201);
    await as(await createApiToken(scratch.sequelize, user.id, ['calculations:run']))
      .post('/projects', contractExample())
      .expect(403);
  });
});
