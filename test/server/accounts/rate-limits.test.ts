import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { createUserWithSession, testPassword } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

describe('abuse limits on sign-in and the e-mail routes', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;

  before(async () => {
    scratch = await createScratchDatabase('rate_limits');
  });

  after(async () => {
    await scratch?.drop();
  });

  it('allows 10 failed sign-ins per 15 minutes from one address by default, then answers 429 problem details with Retry-After', async () => {
    const app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    const { user } = await createUserWithSession(scratch.sequelize, 'designer');
    for (let attempt = 1; attempt <= 10; attempt++) {
      await request(app)
        .post('/api/v1/auth/sign-in')
        .send({ email: user.email, password: `wrong-${attempt}` })
        .expect(401);
    }
    const limited = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: user.email, password: testPassword })
      .expect(429);
    expect(limited.type).to.equal('application/problem+json');
    expect(limited.body).to.include({ status: 429, title: 'Too many attempts', limit: 'sign-in' });
    const retryAfter = Number(limited.headers['retry-after']);
    expect(retryAfter).to.be.within(1, 900);
    expect(limited.body.detail).to.contain(`try again in ${retryAfter} seconds`);
  });

  it('counts only failed sign-ins', async () => {
    const app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': { limit: 2, windowMs: 60_000 } } },
    });
    const { user } = await createUserWithSession(scratch.sequelize, 'designer');
    for (let attempt = 0; attempt < 5; attempt++)
      await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: testPassword }).expect(200);
    await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: 'wrong-one' }).expect(401);
    await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: 'wrong-two' }).expect(401);
    await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: testPassword }).expect(429);
  });

  it('limits reset and invitation-acceptance requests together, each of which may send mail', async () => {
    const app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'email-link': { limit: 3, windowMs: 60_000 } } },
    });
    await request(app).post('/api/v1/auth/forgot-password').send({ email: 'nobody-1@accounts.test' }).expect(202);
    await request(app).post('/api/v1/auth/forgot-password').send({ email: 'nobody-2@accounts.test' }).expect(202);
    await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token: `rfl_${'Q'.repeat(43)}`, name: 'No One', password: 'weir-and-gravel-bed' })
      .expect(410);
    const limited = await request(app)
      .post('/api/v1/auth/forgot-password')
      .send({ email: 'nobody-3@accounts.test' })
      .expect(429);
    expect(limited.body.limit).to.equal('email-link');
  });

  it('limits invitations', async () => {
    const app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { invitation: { limit: 1, windowMs: 60_000 } } },
    });
    const { token } = await createUserWithSession(scratch.sequelize, 'admin');
    await request(app)
      .post('/api/v1/admin/invitations')
      .set('Authorization', `Bearer ${token}`)
      .send({ email: 'first-invitee@accounts.test', role: 'designer' })
      .expect(201);
    const limited = await request(app)
      .post('/api/v1/admin/invitations')
      .set('Authorization', `Bearer ${token}`)
      .send({ email: 'second-invitee@accounts.test', role: 'designer' })
      .expect(429);
    expect(limited.body.limit).to.equal('invitation');
  });
});
