import { expect } from 'chai';
import express from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { createOperationRouter } from '../../server/api/operation-router';
import { createProblemHandler } from '../../server/api/problem-details';
import { createLogger } from '../../server/logging';

/**
 * A small contract of the same form as openapi.yaml, to exercise the router on its own. (The
 * openapi-types schema type still has 3.0's boolean exclusiveMinimum, hence the cast.)
 */
const contract = {
  openapi: '3.1.0',
  info: { title: 'router test', version: '1' },
  paths: {
    '/ponds/{pondId}': {
      parameters: [{ name: 'pondId', in: 'path', required: true, schema: { type: 'integer', minimum: 1 } }],
      post: {
        operationId: 'measurePond',
        parameters: [{ name: 'depth', in: 'query', schema: { type: 'number', exclusiveMinimum: 0 } }],
        requestBody: {
          required: true,
          content: { 'application/json': { schema: { $ref: '#/components/schemas/Pond' } } },
        },
        responses: { '200': { description: 'ok' } },
      },
    },
  },
  components: {
    schemas: {
      Pond: {
        type: 'object',
        additionalProperties: false,
        required: ['volume', 'units'],
        properties: {
          volume: { type: 'number', exclusiveMinimum: 0 },
          units: { type: 'string', enum: ['gal', 'm3'] },
          segments: {
            type: 'array',
            items: { type: 'object', properties: { length: { type: 'number', exclusiveMinimum: 0 } } },
          },
        },
      },
    },
  },
} as unknown as OpenAPIV3_1.Document;

function appWith(handlers: Record<string, express.RequestHandler>) {
  const app = express();
  app.use(express.json());
  app.use(createOperationRouter({ document: contract, handlers }));
  app.use(createProblemHandler(createLogger('silent')));
  return app;
}

describe('operation router', () => {
  const app = appWith({
    measurePond: (req, res) => {
      res.json({ pondId: req.params.pondId, depth: (req.query as { depth?: number }).depth, body: req.body });
    },
  });

  it('passes a valid request through, with path and query values typed by the contract', async () => {
    const response = await request(app).post('/ponds/7?depth=1.5').send({ volume: 12, units: 'm3' }).expect(200);
    expect(response.body).to.deep.equal({ pondId: 7, depth: 1.5, body: { volume: 12, units: 'm3' } });
  });

  it('answers a bad field with problem details whose pointer names it', async () => {
    const response = await request(app)
      .post('/ponds/7')
      .send({ volume: 12, units: 'm3', segments: [{ length: 3 }, { length: -1 }] })
      .expect(400);
    expect(response.type).to.equal('application/problem+json');
    expect(response.body.pointer).to.equal('/body/segments/1/length');
  });

  it('names a missing field, an unknown field and a wrong enum value', async () => {
    const response = await request(app).post('/ponds/7').send({ units: 'acre-ft', colour: 'green' }).expect(400);
    const pointers = (response.body.errors as Array<{ pointer: string; detail: string }>).map((error) => error.pointer);
    expect(pointers).to.include.members(['/body/volume', '/body/colour', '/body/units']);
    const enumProblem = response.body.errors.find((error: { pointer: string }) => error.pointer === '/body/units');
    expect(enumProblem.detail).to.equal('must be one of: gal, m3');
  });

  it('checks path and query parameters', async () => {
    const path = await request(app).post('/ponds/0').send({ volume: 1, units: 'gal' }).expect(400);
    expect(path.body.pointer).to.equal('/path/pondId');
    const query = await request(app).post('/ponds/3?depth=deep').send({ volume: 1, units: 'gal' }).expect(400);
    expect(query.body.pointer).to.equal('/query/depth');
  });

  it('requires a JSON body where the contract does', async () => {
    const response = await request(app)
      .post('/ponds/3')
      .set('Content-Type', 'text/plain')
      .send('12 gallons')
      .expect(400);
    expect(response.body.pointer).to.equal('/body');
  });

  it('refuses to start when the route table and the contract disagree', () => {
    expect(() => appWith({})).to.throw(/no handler for \[measurePond\]/);
    expect(() => appWith({ measurePond: (_q, s) => s.end(), drainPond: (_q, s) => s.end() })).to.throw(
      /no operation for \[drainPond\]/,
    );
  });
});
