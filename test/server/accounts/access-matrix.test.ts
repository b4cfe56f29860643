import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { readAccessDeclaration } from '../../../server/accounts/access-declaration';
import { apiScopes, roles, type ApiScope, type Role } from '../../../shared/vocabularies';
import { listOperations, openApiDocument, type ApiOperation } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { newSecretToken } from '../../../server/accounts/secret-tokens';
import {
  ClientLink,
  PasswordResetLink,
  Project,
  ProjectReport,
  Supplier,
  type User,
} from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createApiToken, createSession, createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/*
 * Generated from openapi.yaml: every operation, as it stands when the suite runs, is called
 * anonymously, by a session of every role, and by API tokens with and without its scopes. The
 * allowed callers send an empty body: a 400, 404 or 422 shows the guard let them through.
 */

const operations = listOperations(openApiDocument);
const generous = { limit: 100_000, windowMs: 60_000 };
const guardStatuses = [401, 403];

let suppliers: { own: Supplier; other: Supplier };
let usersByRole: Record<Role, User>;
let app: ReturnType<typeof createApp>;

function pathParameters(operation: ApiOperation): OpenAPIV3_1.ParameterObject[] {
  return [...(operation.pathItem.parameters ?? []), ...(operation.definition.parameters ?? [])].filter(
    (parameter): parameter is OpenAPIV3_1.ParameterObject => (parameter as OpenAPIV3_1.ParameterObject).in === 'path',
  );
}

/** The path with a supplier-admin's own supplier for supplier parameters and an absent row for the rest. */
function concretePath(operation: ApiOperation, supplier: Supplier = suppliers.own): string {
  let path = operation.path;
  for (const parameter of pathParameters(operation)) {
    const schema = (parameter.schema ?? {}) as OpenAPIV3_1.SchemaObject;
    const isNumber = schema.type === 'integer' || schema.type === 'number';
    const value = /supplier/i.test(parameter.name)
      ? isNumber
        ? String(supplier.id)
        : supplier.code
      : isNumber
        ? '999999'
        : 'no-such-row';
    path = path.replace(`{${parameter.name}}`, value);
  }
  return `/api/v1${path}`;
}

function call(operation: ApiOperation, token?: string, path = concretePath(operation)) {
  const pending = request(app)[operation.method](path);
  if (token) pending.set('Authorization', `Bearer ${token}`);
  const body = operation.definition.requestBody as OpenAPIV3_1.RequestBodyObject | undefined;
  return body?.content?.['application/json'] ? pending.send({}) : pending;
}

function describeStatus(response: request.Response): string {
  return `${response.status} ${JSON.stringify(response.body).slice(0, 300)}`;
}

describe('access matrix over every operation of openapi.yaml', function () {
  this.timeout(120_000);
  let drop: () => Promise<void>;
  let sequelize: Awaited<ReturnType<typeof createScratchDatabase>>['sequelize'];

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('access_matrix'));
    const [own, other] = await Supplier.bulkCreate([
      { code: 'MATRIXOWN', name: 'Matrix Own Demo Supply' },
      { code: 'MATRIXOTHER', name: 'Matrix Other Demo Supply' },
    ]);
    suppliers = { own, other };
    const entries = await Promise.all(
      roles.map(
        async (role) =>
          [
            role,
            (await createUserWithSession(sequelize, role, role === 'supplier-admin' ? { supplierId: own.id } : {}))
              .user,
          ] as const,
      ),
    );
    usersByRole = Object.fromEntries(entries) as Record<Role, User>;
    app = createApp({
      sequelize,
      logger: createLogger('silent'),
      accounts: {
        rateLimits: {
          'sign-in': generous,
          'email-link': generous,
          invitation: generous,
          'proposal-mail': generous,
          'client-link': generous,
        },
      },
    });
  });

  after(async () => {
    await drop?.();
  });

  it('covers every operation, and every guarded one declares the roles it is open to', () => {
    expect(operations.length).to.be.greaterThan(10);
    for (const operation of operations)
      expect(() => readAccessDeclaration(operation, openApiDocument.security), operation.operationId).not.to.throw();
  });

  for (const operation of operations) {
    const access = readAccessDeclaration(operation, openApiDocument.security);
    const name = `${operation.method.toUpperCase()} ${operation.path} (${operation.operationId})`;

    if (access.public) {
      it(`${name} is public: anonymous callers get through`, async () => {
        const response = await call(operation);
        expect(guardStatuses, describeStatus(response)).not.to.include(response.status);
      });
      continue;
    }

    describe(name, () => {
      it('anonymous -> 401 problem details with a bearer challenge', async () => {
        const response = await call(operation);
        expect(response.status, describeStatus(response)).to.equal(401);
        expect(response.type).to.equal('application/problem+json');
        expect(response.headers['www-authenticate']).to.match(/^Bearer /);
      });

      for (const role of roles) {
        const allowed = access.roles.includes(role);
        it(`${role} session -> ${allowed ? 'allowed (not 401/403)' : '403'}`, async () => {
          const response = await call(operation, await createSession(usersByRole[role].id));
          if (allowed) expect(guardStatuses, describeStatus(response)).not.to.include(response.status);
          else expect(response.status, describeStatus(response)).to.equal(403);
        });
      }

      const owner = access.roles[0];
      if (access.scopes.length === 0) {
        it('an API token, even with every scope -> 403 (sign-in only)', async () => {
          const response = await call(operation, await createApiToken(sequelize, usersByRole[owner].id, apiScopes));
          expect(response.status, describeStatus(response)).to.equal(403);
        });
        return;
      }
      it(`an API token with ${access.scopes[0]} of a ${owner} -> allowed (not 401/403)`, async () => {
        const response = await call(
          operation,
          await createApiToken(sequelize, usersByRole[owner].id, [access.scopes[0]]),
        );
        expect(guardStatuses, describeStatus(response)).not.to.include(response.status);
      });
      const otherScopes = apiScopes.filter((scope) => !access.scopes.includes(scope));
      if (otherScopes.length > 0) {
        it(`an API token with only ${otherScopes.join(', ')} -> 403`, async () => {
          const response = await call(
            operation,
            await createApiToken(sequelize, usersByRole[owner].id, otherScopes as ApiScope[]),
          );
          expect(response.status, describeStatus(response)).to.equal(403);
        });
      }
      const outsider = roles.find((role) => !access.roles.includes(role));
      if (outsider) {
        it(`an API token with ${access.scopes.join(', ')} owned by a ${outsider} -> 403`, async () => {
          const response = await call(
            operation,
            await createApiToken(sequelize, usersByRole[outsider].id, access.scopes),
          );
          expect(response.status, describeStatus(response)).to.equal(403);
        });
      }
    });
  }

  // A password reset answers a suspected compromise: a token made before it, with every scope, opens nothing after it.
  describe('an API token made before a password reset', () => {
    const tokensByRole = new Map<Role, string>();

    before(async () => {
      for (const role of roles) {
        const { user } = await createUserWithSession(
          sequelize,
          role,
          role === 'supplier-admin' ? { supplierId: suppliers.own.id } : {},
        );
        const apiToken = await createApiToken(sequelize, user.id, apiScopes);
        await request(app).get('/api/v1/auth/me').set('Authorization', `Bearer ${apiToken}`).expect(200);
        const link = newSecretToken('emailLink');
        await PasswordResetLink.create({
          userId: user.id,
          tokenHash: link.hash,
          expiresAt: new Date(Date.now() + 3_600_000),
        });
        await request(app)
          .post('/api/v1/auth/reset-password')
          .send({ token: link.token, password: `reset-after-theft-${role}` })
          .expect(200);
        tokensByRole.set(role, apiToken);
      }
    });

    for (const operation of operations) {
      const access = readAccessDeclaration(operation, openApiDocument.security);
      if (access.public || access.scopes.length === 0) continue;
      it(`${operation.method.toUpperCase()} ${operation.path} (${operation.operationId}) -> 401 after the reset`, async () => {
        const response = await call(operation, tokensByRole.get(access.roles[0]));
        expect(response.status, describeStatus(response)).to.equal(401);
        expect(response.type).to.equal('application/problem+json');
      });
    }
  });

  // A client's read-only link opens its proposal's page and PDF only: its token, live, is no credential anywhere else.
  describe('a live client link token, as a Bearer token or a cookie', () => {
    let clientToken: string;

    before(async () => {
      const designer = usersByRole.designer;
      const project = await Project.create({ ownerUserId: designer.id, name: 'Matrix pond', design: {} as never });
      const pdf = Buffer.from('%PDF-1.4 matrix');
      const report = await ProjectReport.create({
        projectId: project.id,
        madeByUserId: designer.id,
        paper: 'a4',
        pdf,
        byteLength: pdf.length,
        sha256: createHash('sha256').update(pdf).digest('hex'),
        catalogRevision: 0,
      });
      const secret = newSecretToken('clientLink');
      await ClientLink.create({
        projectId: project.id,
        reportId: report.id,
        tokenHash: secret.hash,
        createdByUserId: designer.id,
        expiresAt: new Date(Date.now() + 86_400_000),
      });
      clientToken = secret.token;
      await request(app).get('/api/v1/client-view/report.pdf').query({ token: clientToken }).expect(200);
    });

    for (const operation of operations) {
      const access = readAccessDeclaration(operation, openApiDocument.security);
      if (access.public) continue;
      it(`${operation.method.toUpperCase()} ${operation.path} (${operation.operationId}) -> 401 both ways`, async () => {
        const asBearer = await call(operation, clientToken);
        expect(asBearer.status, describeStatus(asBearer)).to.equal(401);
        const pending = request(app)[operation.method](concretePath(operation));
        pending.set('Cookie', `token=${clientToken}; session=${clientToken}; riffle_session=${clientToken}`);
        const asCookie = await pending;
        expect(asCookie.status, describeStatus(asCookie)).to.equal(401);
      });
    }
  });

  // Operations that name a supplier in their path: a supplier-admin of another supplier is refused and nothing changes.
  for (const operation of operations.filter((candidate) =>
    pathParameters(candidate).some((parameter) => /supplier/i.test(parameter.name)),
  )) {
    const access = readAccessDeclaration(operation, openApiDocument.security);
    if (access.public || !access.roles.includes('supplier-admin')) continue;
    it(`${operation.operationId}: a supplier-admin naming another supplier -> 403 or 404, nothing written`, async () => {
      const before = await tableChecksums(sequelize, ['audit_events', 'sessions']);
      const response = await call(
        operation,
        await createSession(usersByRole['supplier-admin'].id),
        concretePath(operation, suppliers.other),
      );
      expect([403, 404], describeStatus(response)).to.include(response.status);
      expect(await tableChecksums(sequelize, ['audit_events', 'sessions'])).to.deep.equal(before);
    });
  }
});
