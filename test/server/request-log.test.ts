import { Writable } from 'node:stream';
import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createLogger, formatLogLine } from '../../server/logging';
import { createUserWithSession } from '../support/accounts';
import { createScratchDatabase } from '../support/test-database';

describe('request log', function () {
  this.timeout(60_000);
  let drop: () => Promise<void>;
  let sequelize: Awaited<ReturnType<typeof createScratchDatabase>>['sequelize'];

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('request_log'));
  });

  after(async () => {
    await drop?.();
  });

  it('holds method, path, status, time and id of a signed-in request, never its token or headers', async () => {
    const lines: string[] = [];
    const capture = new Writable({
      write(chunk: Buffer, _encoding, done) {
        lines.push(...chunk.toString('utf8').split('\n').filter(Boolean));
        done();
      },
    });
    const app = createApp({ sequelize, logger: createLogger('info', capture) });
    const { token } = await createUserWithSession(sequelize, 'designer');
    const response = await request(app)
      .get('/api/v1/auth/me?probe=1')
      .set('Authorization', `Bearer ${token}`)
      .set('Cookie', 'riffle=cookie-value');
    expect(response.status).to.equal(200);

    const captured = lines.join('\n');
    expect(captured).not.to.include(token);
    expect(captured.toLowerCase()).not.to.include('authorization');
    expect(captured).not.to.include('cookie-value');
    type Entry = { req?: { id: unknown }; res?: unknown; responseTime?: unknown };
    const entry = lines.map((line) => JSON.parse(line) as Entry).find((line) => line.req);
    expect(entry?.req).to.deep.equal({ id: entry?.req?.id, method: 'GET', path: '/api/v1/auth/me' });
    expect(entry?.req?.id).to.not.equal(undefined);
    expect(entry?.res).to.deep.equal({ statusCode: 200 });
    expect(entry?.responseTime).to.be.a('number');
  });

  it('formats an entry as one line for a terminal', () => {
    const line = formatLogLine({
      level: 30,
      time: Date.UTC(2026, 0, 2, 3, 4, 5, 6),
      msg: 'request completed',
      req: { id: 7, method: 'GET', path: '/api/v1/health' },
      res: { statusCode: 200 },
      responseTime: 3,
    });
    expect(line).to.equal('03:04:05.006 INFO  request completed GET /api/v1/health 200 3 ms #7\n');
  });
});
