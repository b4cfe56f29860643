import { expect } from 'chai';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { createApp, riffleVersion } from '../../server/app';
import { createSequelize } from '../../server/database/connection';
import { PrivateMariaDb } from '../../server/database/private-mariadb';
import { createLogger } from '../../server/logging';
import { freeLoopbackPort } from '../support/free-port';

describe('GET /api/v1/health', function () {
  this.timeout(120_000);
  const folder = mkdtempSync(join(tmpdir(), 'riffle-health-db-'));
  let port: number;
  let database: PrivateMariaDb;
  let sequelize: Sequelize;
  let app: ReturnType<typeof createApp>;

  before(async () => {
    port = await freeLoopbackPort();
    database = await PrivateMariaDb.startOrReuse({ folder, port });
    await database.ensureDatabase('riffle_health');
    sequelize = createSequelize({ host: '127.0.0.1', port, name: 'riffle_health', user: 'root', password: '' });
    app = createApp({ sequelize, logger: createLogger('silent') });
  });

  after(async () => {
    await sequelize?.close();
    await database?.stop();
    rmSync(folder, { recursive: true, force: true });
  });

  it('answers 200 with the version while the database is up', async () => {
    const response = await request(app).get('/api/v1/health').expect(200);
    expect(response.body).to.deep.equal({ status: 'ok', database: 'up', version: riffleVersion });
  });

  it('sends a content security policy that allows this origin only for scripts, styles and fonts', async () => {
    const policy = (await request(app).get('/api/v1/health')).headers['content-security-policy'] as string;
    const directive = (name: string) =>
      policy
        .split(';')
        .find((part) => part.trim().startsWith(`${name} `))
        ?.trim();
    expect(directive('script-src')).to.equal("script-src 'self'");
    expect(directive('font-src')).to.equal("font-src 'self' data:");
    expect(directive('style-src')).to.equal("style-src 'self' 'unsafe-inline'");
    expect(policy).not.to.match(/https:/);
  });

  it('answers 503 when the database is down, and recovers by itself when it is back', async () => {
    await database.stop();
    const down = await request(app).get('/api/v1/health').expect(503);
    expect(down.body).to.include({ status: 'degraded', database: 'down' });

    database = await PrivateMariaDb.startOrReuse({ folder, port });
    let status = 0;
    for (let attempt = 0; attempt < 20 && status !== 200; attempt++) {
      status = (await request(app).get('/api/v1/health')).status;
      if (status !== 200) await new Promise((resolve) => setTimeout(resolve, 250));
    }
    expect(status).to.equal(200);
  });
});

describe('the served contract and docs', () => {
  const app = createApp({
    sequelize: createSequelize({ host: '127.0.0.1', port: 1, name: 'unused', user: 'root', password: '' }),
    logger: createLogger('silent'),
  });

  it('serves openapi.yaml as OpenAPI 3.1', async () => {
    const response = await request(app).get('/api/v1/openapi.yaml').expect(200);
    expect(response.type).to.equal('application/yaml');
    expect(response.text).to.match(/^openapi: 3\.1\.\d/m);
  });

  it('serves Swagger UI from its own files, not a CDN', async () => {
    const page = await request(app).get('/api/docs/').expect(200);
    expect(page.text).to.contain('swagger-ui');
    expect(page.text).to.not.match(/(src|href)="https?:/);
    await request(app).get('/api/docs/swagger-ui-bundle.js').expect(200);
  });

  it('answers unknown API paths with problem details, not HTML', async () => {
    const response = await request(app).get('/api/v1/no-such-thing').expect(404);
    expect(response.type).to.equal('application/problem+json');
    expect(response.body).to.include({ status: 404, title: 'Not found' });
  });

  it('answers malformed JSON with a 400 pointing at the body', async () => {
    const response = await request(app)
      .post('/api/v1/health')
      .set('Content-Type', 'application/json')
      .send('{"oops"')
      .expect(400);
    expect(response.body).to.include({ title: 'Malformed JSON', pointer: '/body' });
  });
});
