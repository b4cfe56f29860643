import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../server/app';
import { AuditEvent } from '../../server/database/models';
import { createLogger } from '../../server/logging';
import { createScratchDatabase } from '../support/test-database';

/* Supertest connects from loopback; the forged header names an address that is not the caller's. */
describe('client address behind proxies', function () {
  this.timeout(60_000);
  let drop: () => Promise<void>;
  let sequelize: Awaited<ReturnType<typeof createScratchDatabase>>['sequelize'];
  const forged = '203.0.113.77';

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('trusted_proxies'));
  });

  after(async () => {
    await drop?.();
  });

  async function auditedAddressOfFailedSignIn(trustedProxies: string[] | undefined, email: string): Promise<string> {
    const app = createApp({ sequelize, logger: createLogger('silent'), trustedProxies });
    const response = await request(app)
      .post('/api/v1/auth/sign-in')
      .set('X-Forwarded-For', forged)
      .send({ email, password: 'not the password' });
    expect(response.status).to.equal(401);
    const event = await AuditEvent.findOne({ where: { email, action: 'sign-in-failed' }, rejectOnEmpty: true });
    return event.ip ?? '';
  }

  it('by default ignores X-Forwarded-For, even from loopback, and records the connection address', async () => {
    const address = await auditedAddressOfFailedSignIn(undefined, 'nobody-default@proxies.test');
    expect(address).not.to.equal(forged);
    expect(address).to.match(/127\.0\.0\.1|::1/);
  });

  it('with 127.0.0.1 trusted, records the address the proxy forwarded', async () => {
    const address = await auditedAddressOfFailedSignIn(['127.0.0.1'], 'nobody-trusted@proxies.test');
    expect(address).to.equal(forged);
  });
});
