import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import type { Project, ProjectInput } from '../../../shared/api/api-schemas';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp, type AppDependencies } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { createUserWithSession, testMailboxFolder } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from '../selection/synthetic-catalog';
import { binaryBody } from './pdf-text';

/** The answer matches the contract's schema of that name. */
export function expectConforms(schema: string, body: unknown): void {
  const validate = contractSchemaValidator(schema);
  expect(validate(body), `${schema}: ${JSON.stringify(validate.errors)}`).to.equal(true);
}

/** The contract's example project (a US design the synthetic catalog has pumps for). */
export function projectExample(): ProjectInput {
  const operation = (openApiDocument.paths?.['/projects'] as OpenAPIV3_1.PathItemObject)
    .post as OpenAPIV3_1.OperationObject;
  return structuredClone(
    (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'].example as ProjectInput,
  );
}

/** A response body kept as bytes (a PDF). */
export const binary = (pending: request.Test) => pending.buffer(true).parse(binaryBody as never);

export interface SendingFixture {
  sequelize: Sequelize;
  app: ReturnType<typeof createApp>;
  /** Another app over the same database, with other mail or limits. */
  appWith: (accounts: AppDependencies['accounts']) => ReturnType<typeof createApp>;
  /** Jo Fenwick of Millrace Pond Works, who owns `project`. */
  designerToken: string;
  /** A designer who owns nothing here. */
  otherToken: string;
  project: Project;
  as: (
    token: string,
    target?: () => ReturnType<typeof createApp>,
  ) => Record<'get' | 'delete', (path: string) => request.Test> &
    Record<'post' | 'put', (path: string, body: object) => request.Test>;
}

/**
 * Hooks for the calling describe: a scratch database with a synthetic catalog, a designer with a
 * company profile and the example project, and the app (links at http://riffle.example.test,
 * generous limits); filled in when its `before` has run.
 */
export function useSendingFixture(label: string): SendingFixture {
  const fixture = {} as SendingFixture;
  let drop: (() => Promise<void>) | undefined;
  const generous = { limit: 10_000, windowMs: 60_000 };

  fixture.as = (token, target = () => fixture.app) => {
    const auth = (pending: request.Test) => pending.set('Authorization', `Bearer ${token}`);
    return {
      get: (path) => auth(request(target()).get(`/api/v1${path}`)),
      delete: (path) => auth(request(target()).delete(`/api/v1${path}`)),
      post: (path, body) => auth(request(target()).post(`/api/v1${path}`)).send(body),
      put: (path, body) => auth(request(target()).put(`/api/v1${path}`)).send(body),
    };
  };

  before(async () => {
    const scratch = await createScratchDatabase(label);
    drop = scratch.drop;
    fixture.sequelize = scratch.sequelize;
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(120, 7));
    fixture.appWith = (accounts) =>
      createApp({ sequelize: scratch.sequelize, logger: createLogger('silent'), accounts });
    fixture.app = fixture.appWith({
      publicUrl: 'http://riffle.example.test',
      demoMailboxFolder: testMailboxFolder(),
      rateLimits: { 'proposal-mail': generous, 'client-link': generous },
    });
    fixture.designerToken = (await createUserWithSession(scratch.sequelize, 'designer', { name: 'Jo Fenwick' })).token;
    fixture.otherToken = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    fixture.project = (await fixture.as(fixture.designerToken).post('/projects', projectExample()).expect(201))
      .body as Project;
    await fixture
      .as(fixture.designerToken)
      .put('/account/profile', { name: 'Millrace Pond Works', address: '', phone: '', email: '', licenceNumber: '' })
      .expect(200);
  });

  after(async () => {
    await drop?.();
  });

  return fixture;
}
