import { createServer, type Server } from 'node:http';
import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import { QueryTypes, type Transaction } from 'sequelize';
import request from 'supertest';
import type { Project, ProjectInput } from '../../../shared/api/api-schemas';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { ProjectReport } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from '../selection/synthetic-catalog';

/*
 * Making a proposal that its caller cancels: when the connection closes before the PDF is stored,
 * nothing is stored. The suite holds the server at the moment of storing with a lock of its own
 * (a locking read of the reports table keeps any insert waiting), cancels or not, then lets go.
 */
describe('reports: a proposal cancelled before it is stored is not kept', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let server: Server;
  let token: string;
  let project: Project;

  before(async () => {
    scratch = await createScratchDatabase('report_cancel');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(40, 3));
    const app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    // a server of the suite's own, so that it can count the connections still open
    server = createServer(app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    const operation = (openApiDocument.paths?.['/projects'] as OpenAPIV3_1.PathItemObject)
      .post as OpenAPIV3_1.OperationObject;
    const example = (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json']
      .example as ProjectInput;
    project = (
      await request(server).post('/api/v1/projects').set('Authorization', `Bearer ${token}`).send(example).expect(201)
    ).body as Project;
  });

  after(async () => {
    await new Promise((resolve) => server?.close(resolve));
    await scratch?.drop();
  });

  async function until(condition: () => Promise<boolean>, what: string): Promise<void> {
    const deadline = Date.now() + 20_000;
    while (!(await condition())) {
      if (Date.now() > deadline) throw new Error(`waited 20 s for ${what}`);
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
  }

  const count = async (sql: string) =>
    Number((await scratch.sequelize.query<{ n: number | string }>(sql, { type: QueryTypes.SELECT }))[0].n);
  const insertsWaiting = () =>
    count("SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE 'INSERT INTO `project_reports`%'");
  /** The stored proposals once every write to them has ended: a locking read waits for an open insert's commit or rollback. */
  const settledReportCount = () =>
    scratch.sequelize.transaction(async (transaction) =>
      Number(
        (
          await scratch.sequelize.query<{ n: number | string }>(
            'SELECT COUNT(*) AS n FROM project_reports LOCK IN SHARE MODE',
            { type: QueryTypes.SELECT, transaction },
          )
        )[0].n,
      ),
    );
  const openConnections = () =>
    new Promise<number>((resolve, reject) =>
      server.getConnections((error, connections) => (error ? reject(error) : resolve(connections))),
    );

  /** Starts making a proposal and holds it at the moment of storing, with the lock to release. */
  async function makeAndHold(): Promise<{ pending: request.Test; release: () => Promise<void> }> {
    const lock: Transaction = await scratch.sequelize.transaction();
    await scratch.sequelize.query('SELECT id FROM project_reports FOR UPDATE', { transaction: lock });
    const pending = request(server)
      .post(`/api/v1/projects/${project.id}/reports`)
      .set('Authorization', `Bearer ${token}`)
      .send({ paper: 'a4' });
    return { pending, release: () => lock.commit() };
  }

  it('answers 201 and keeps the proposal when the caller waits (the lock holds it, then lets it through)', async () => {
    const before = await ProjectReport.count();
    const { pending, release } = await makeAndHold();
    const answer = pending.then((response) => response);
    await until(async () => (await insertsWaiting()) === 1, 'the server to reach the insert');
    await release();
    const response = await answer;
    expect(response.status, JSON.stringify(response.body)).to.equal(201);
    expect(await ProjectReport.count()).to.equal(before + 1);
  });

  it('stores nothing when the caller cancels while the proposal is being stored', async () => {
    const before = await ProjectReport.count();
    const { pending, release } = await makeAndHold();
    let answered = false;
    pending.end(() => (answered = true));
    await until(async () => (await insertsWaiting()) === 1, 'the server to reach the insert');
    pending.abort();
    await until(async () => (await openConnections()) === 0, 'the server to see the connection close');
    await release();
    await until(async () => (await insertsWaiting()) === 0, 'the insert to run');
    expect(await settledReportCount()).to.equal(before);
    expect(answered, 'a cancelled request has no answer').to.equal(false);
    // and the next proposal is made and kept as usual
    await request(server)
      .post(`/api/v1/projects/${project.id}/reports`)
      .set('Authorization', `Bearer ${token}`)
      .send({ paper: 'letter' })
      .expect(201);
    expect(await ProjectReport.count()).to.equal(before + 1);
  });
});
