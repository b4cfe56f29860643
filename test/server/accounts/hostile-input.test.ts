import { expect } from 'chai';
import { Ajv2020 } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { listOperations, openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { createUserWithSession, tableChecksums, testPassword } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/*
 * Every field of the account routes' JSON bodies gets hostile values in an otherwise valid body.
 * Each answer is a 4xx problem, never a 5xx, and the tables (apart from the audit log, which
 * records failed sign-ins, and session last-use times) are unchanged.
 */
const accountOperations = [
  'signIn',
  'requestPasswordReset',
  'resetPassword',
  'acceptInvitation',
  'createApiToken',
  'updateUser',
  'inviteUser',
];

const hostileValues: Array<[string, unknown]> = [
  ['a 100 000-character string', 'w'.repeat(100_000)],
  ['an SQL fragment', "x'; DROP TABLE users; --"],
  ['a script fragment', '<script>alert(1)</script>'],
  ['a number', 12345],
  ['null', null],
  ['an array', ['admin']],
  ['an object', { $gt: '' }],
  ['true', true],
  ['a control character', 'line\u0000break'],
];

/** A body the operation would accept, so that only the field under test is hostile. */
const validBodies: Record<string, Record<string, unknown>> = {
  signIn: { email: 'nobody@accounts.test', password: 'not-the-password' },
  requestPasswordReset: { email: 'nobody@accounts.test' },
  resetPassword: { token: `rfl_${'R'.repeat(43)}`, password: 'weir-and-gravel-bed' },
  acceptInvitation: { token: `rfl_${'A'.repeat(43)}`, name: 'Robin Fenwick', password: 'weir-and-gravel-bed' },
  createApiToken: { name: 'Estimating sheet', scopes: ['catalog:read'], password: testPassword },
  updateUser: { name: 'Renamed', role: 'designer', supplierId: null, disabled: false },
  inviteUser: { email: 'invitee@accounts.test', role: 'designer', supplierId: null },
};

function bodySchemaOf(operationId: string): OpenAPIV3_1.SchemaObject {
  const operation = listOperations(openApiDocument).find((candidate) => candidate.operationId === operationId)!;
  const schemaRef = (
    (operation.definition.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json']
      .schema as OpenAPIV3_1.ReferenceObject
  ).$ref;
  return openApiDocument.components!.schemas![schemaRef.split('/').pop()!] as OpenAPIV3_1.SchemaObject;
}

const ajv = new Ajv2020({ strict: false, allowUnionTypes: true });
addFormats.default(ajv);
ajv.addSchema({ $id: 'contract.json', components: openApiDocument.components });

/** Values the field's own schema admits (null for an optional supplier, an SQL-looking name) are not hostile there. */
function admittedByField(operationId: string, field: string, value: unknown): boolean {
  const fieldSchema = JSON.parse(JSON.stringify(bodySchemaOf(operationId).properties![field]), (key, item) =>
    key === '$ref' && String(item).startsWith('#/') ? `contract.json${item}` : item,
  );
  return ajv.validate(fieldSchema, value);
}

describe('hostile input on the account routes', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let tokens: { admin: string; designer: string };
  let targetUserId: number;
  const generous = { limit: 100_000, windowMs: 60_000 };

  before(async () => {
    scratch = await createScratchDatabase('hostile_input');
    tokens = {
      admin: (await createUserWithSession(scratch.sequelize, 'admin')).token,
      designer: (await createUserWithSession(scratch.sequelize, 'designer')).token,
    };
    targetUserId = (await createUserWithSession(scratch.sequelize, 'integrator')).user.id;
    app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': generous, 'email-link': generous, invitation: generous } },
    });
  });

  after(async () => {
    await scratch?.drop();
  });

  function send(operationId: string, body: unknown) {
    const operation = listOperations(openApiDocument).find((candidate) => candidate.operationId === operationId)!;
    const path = `/api/v1${operation.path.replace('{userId}', String(targetUserId))}`;
    const pending = request(app)[operation.method](path);
    if (operationId === 'updateUser' || operationId === 'inviteUser')
      pending.set('Authorization', `Bearer ${tokens.admin}`);
    if (operationId === 'createApiToken') pending.set('Authorization', `Bearer ${tokens.designer}`);
    return pending.send(body as object);
  }

  it('has a valid body for each route that the server accepts as well formed', async () => {
    for (const operationId of accountOperations) {
      const response = await send(operationId, validBodies[operationId]);
      expect(response.status, `${operationId}: ${JSON.stringify(response.body)}`).not.to.equal(400);
    }
  });

  for (const operationId of accountOperations) {
    for (const field of Object.keys(bodySchemaOf(operationId).properties ?? {})) {
      it(`${operationId} /body/${field}: every hostile value is a 4xx problem and writes nothing`, async () => {
        const before = await tableChecksums(scratch.sequelize, ['audit_events', 'sessions']);
        const hostileHere = hostileValues.filter(([, value]) => !admittedByField(operationId, field, value));
        expect(hostileHere.length).to.be.greaterThan(4);
        for (const [what, value] of hostileHere) {
          const response = await send(operationId, { ...validBodies[operationId], [field]: value });
          expect(response.status, `${what}: ${JSON.stringify(response.body).slice(0, 200)}`).to.be.within(400, 499);
          expect(response.type, what).to.equal('application/problem+json');
          if (response.status === 400) {
            const pointers: string[] = response.body.errors.map((error: { pointer: string }) => error.pointer);
            expect(
              pointers.some((pointer) => pointer === `/body/${field}` || pointer.startsWith(`/body/${field}/`)),
              `${what}: ${pointers.join(' ')}`,
            ).to.equal(true);
          }
        }
        expect(await tableChecksums(scratch.sequelize, ['audit_events', 'sessions'])).to.deep.equal(before);
      });
    }
  }

  it('stores a name that merely looks like SQL verbatim, through bound parameters', async () => {
    const name = "Robin'); DROP TABLE users; --";
    const response = await send('updateUser', { name }).expect(200);
    expect(response.body.name).to.equal(name);
    const [rows] = await scratch.sequelize.query('SELECT name FROM users WHERE id = ?', {
      replacements: [targetUserId],
    });
    expect(rows).to.deep.equal([{ name }]);
  });

  it('refuses a body that is not JSON, and unknown fields, naming them', async () => {
    const malformed = await request(app)
      .post('/api/v1/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email": ')
      .expect(400);
    expect(malformed.body.pointer).to.equal('/body');
    const extra = await send('signIn', { ...validBodies.signIn, role: 'admin' }).expect(400);
    expect(extra.body.pointer).to.equal('/body/role');
  });
});
