import { expect } from 'chai';
import fc from 'fast-check';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { readAccessDeclaration } from '../../../server/accounts/access-declaration';
import { listOperations, openApiDocument, type ApiOperation } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/*
 * Every operation of openapi.yaml, called by a caller it admits, with random path values, queries
 * and JSON bodies drawn from its own schemas mixed with hostile values: no answer may be a 5xx.
 */

type Schema = OpenAPIV3_1.SchemaObject & { $ref?: string; const?: unknown };

const operations = listOperations(openApiDocument);
const runsPerOperation = 100;
const seed = 20_260_301;
const generous = { limit: 1_000_000, windowMs: 60_000 };

const hostileNumbers = [Infinity, -Infinity, -0, 1e-300, -1e-300, 1e300, Number.MAX_SAFE_INTEGER + 2, -1, 0, 0.5];
const hostileTexts = ['1e400', '-0', '1e-300', 'NaN', 'Infinity', '', ' ', '\u202Eevil', '%', 'x'.repeat(20_000)];
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom<unknown>(...hostileNumbers, ...hostileTexts, null, true, [], {}),
  fc.string({ maxLength: 40 }),
  fc.double(),
  fc.integer(),
);

/**
 * JSON text of a body, keeping what JSON.stringify would lose: 1e400 stays 1e400 (the server's
 * parser reads Infinity) and -0 stays -0.
 */
function jsonText(body: unknown): string {
  const marker = '\u0000number:';
  const text = JSON.stringify(body, (_key, value: unknown) =>
    typeof value === 'number' && (!Number.isFinite(value) || Object.is(value, -0))
      ? `${marker}${Object.is(value, -0) ? '-0' : value > 0 ? '1e400' : '-1e400'}`
      : value,
  );
  return text.replace(/"\\u0000number:([^"]+)"/g, '$1');
}

function resolve(schema: Schema): Schema {
  if (!schema.$ref) return schema;
  const name = schema.$ref.replace('#/components/schemas/', '');
  return (openApiDocument.components?.schemas?.[name] ?? {}) as Schema;
}

/** Values shaped by the schema (so requests reach the handlers), now and then replaced by hostile ones. */
function valueOf(raw: Schema, depth = 0): fc.Arbitrary<unknown> {
  const schema = resolve(raw);
  const shaped = shapedValueOf(schema, depth);
  return fc.oneof({ arbitrary: shaped, weight: 12 }, { arbitrary: hostileValue, weight: 1 });
}

function shapedValueOf(schema: Schema, depth: number): fc.Arbitrary<unknown> {
  const variants = (schema.oneOf ?? schema.anyOf) as Schema[] | undefined;
  if (variants) return fc.oneof(...variants.map((variant) => valueOf(variant, depth + 1)));
  if (schema.allOf) return valueOf((schema.allOf as Schema[])[0], depth + 1);
  if (schema.const !== undefined) return fc.constant(schema.const);
  if (schema.enum) return fc.constantFrom(...(schema.enum as unknown[]));
  const type = Array.isArray(schema.type) ? schema.type.find((name) => name !== 'null') : schema.type;
  const low = schema.minimum ?? (schema.exclusiveMinimum as number | undefined) ?? -1e6;
  const high = schema.maximum ?? (schema.exclusiveMaximum as number | undefined) ?? 1e6;
  switch (type) {
    case 'integer':
      return fc.integer({ min: Math.max(Math.ceil(low), -1e9), max: Math.min(Math.floor(high), 1e9) });
    case 'number':
      return fc.oneof(fc.double({ min: low, max: high, noNaN: true }), fc.constantFrom(low, high, (low + high) / 2));
    case 'boolean':
      return fc.boolean();
    case 'string':
      return schema.format === 'email' ? fc.emailAddress() : fc.string({ maxLength: schema.maxLength ?? 60 });
    case 'array':
      return depth > 4
        ? fc.constant([])
        : fc.array(valueOf(((schema as { items?: Schema }).items ?? {}) as Schema, depth + 1), { maxLength: 4 });
    case 'object': {
      if (depth > 4) return fc.constant({});
      const properties = Object.entries(schema.properties ?? {});
      const required = new Set(schema.required ?? []);
      return fc.record(
        Object.fromEntries(properties.map(([name, property]) => [name, valueOf(property as Schema, depth + 1)])),
        { requiredKeys: properties.map(([name]) => name).filter((name) => required.has(name)) },
      );
    }
    default:
      return hostileValue;
  }
}

function parametersOf(operation: ApiOperation, location: 'path' | 'query'): OpenAPIV3_1.ParameterObject[] {
  return [...(operation.pathItem.parameters ?? []), ...(operation.definition.parameters ?? [])].filter(
    (parameter): parameter is OpenAPIV3_1.ParameterObject => (parameter as OpenAPIV3_1.ParameterObject).in === location,
  );
}

/** Path and query parameters travel as text. */
function textOf(schema: Schema): fc.Arbitrary<string> {
  return fc.oneof(
    {
      arbitrary: valueOf(schema).map((value) => (typeof value === 'string' ? value : (JSON.stringify(value) ?? ''))),
      weight: 3,
    },
    { arbitrary: fc.constantFrom(...hostileTexts), weight: 1 },
  );
}

function requestOf(operation: ApiOperation) {
  const pathParameters = parametersOf(operation, 'path');
  const queryParameters = parametersOf(operation, 'query');
  const body = operation.definition.requestBody as OpenAPIV3_1.RequestBodyObject | undefined;
  const bodySchema = body?.content?.['application/json']?.schema as Schema | undefined;
  return fc.record({
    path: fc.record(
      Object.fromEntries(
        pathParameters.map((parameter) => [parameter.name, textOf((parameter.schema ?? {}) as Schema)]),
      ),
    ),
    query: fc.record(
      Object.fromEntries(
        queryParameters.map((parameter) => [parameter.name, textOf((parameter.schema ?? {}) as Schema)]),
      ),
      { requiredKeys: [] },
    ),
    body: bodySchema ? valueOf(bodySchema) : fc.constant(undefined),
  });
}

describe('no input makes any operation of openapi.yaml answer 5xx', function () {
  this.timeout(120_000);
  let drop: () => Promise<void>;
  let sequelize: Awaited<ReturnType<typeof createScratchDatabase>>['sequelize'];
  let app: ReturnType<typeof createApp>;
  let supplierId: number;
  let requestsSent = 0;

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('no_server_errors'));
    supplierId = (await Supplier.create({ code: 'HOSTILE', name: 'Hostile Input Demo Supply' })).id;
    app = createApp({
      sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': generous, 'email-link': generous, invitation: generous } },
    });
  });

  after(async () => {
    await drop?.();
    expect(requestsSent).to.equal(operations.length * runsPerOperation);
  });

  for (const operation of operations) {
    it(`${operation.method.toUpperCase()} ${operation.path} (${operation.operationId})`, async () => {
      const access = readAccessDeclaration(operation, openApiDocument.security);
      // A caller of its own per operation: sign-out, password changes or role changes end only that one.
      const token = access.public
        ? undefined
        : (await createUserWithSession(sequelize, access.roles[0], { supplierId })).token;
      await fc.assert(
        fc.asyncProperty(requestOf(operation), async ({ path, query, body }) => {
          let url = `/api/v1${operation.path}`;
          for (const [name, value] of Object.entries(path)) url = url.replace(`{${name}}`, encodeURIComponent(value));
          const pending = request(app)[operation.method](url).query(query);
          if (token) pending.set('Authorization', `Bearer ${token}`);
          const response = await (body === undefined
            ? pending
            : pending.set('Content-Type', 'application/json').send(jsonText(body)));
          requestsSent++;
          expect(response.status, `${url} ${JSON.stringify(query)} ${JSON.stringify(body)?.slice(0, 400)}`).to.be.below(
            500,
          );
        }),
        { seed, numRuns: runsPerOperation, endOnFailure: true },
      );
    });
  }
});
