import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { AuditEvent, User } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import {
  createApiToken,
  createSession,
  createUserWithSession,
  tableChecksums,
  testPassword,
} from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

describe('changing one’s own password', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  const newPassword = 'upflow-manifold-spray-7';

  before(async () => {
    scratch = await createScratchDatabase('password_change');
    app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': { limit: 1000, windowMs: 60_000 } } },
    });
  });

  after(async () => {
    await scratch?.drop();
  });

  const change = (token: string, body: object, server = app) =>
    request(server).put('/api/v1/account/password').set('Authorization', `Bearer ${token}`).send(body);
  const me = (token: string) => request(app).get('/api/v1/auth/me').set('Authorization', `Bearer ${token}`);
  const signIn = (email: string, password: string) =>
    request(app).post('/api/v1/auth/sign-in').send({ email, password });

  it('changes the password, keeps this session, signs out the others and leaves API tokens working', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer');
    const otherSession = await createSession(user.id);
    const apiToken = await createApiToken(scratch.sequelize, user.id, ['catalog:read']);

    const changed = await change(token, { currentPassword: testPassword, newPassword }).expect(200);
    expect(changed.body).to.deep.equal({ revokedApiTokenCount: 0, revokedApiTokens: [] });

    await me(token).expect(200);
    await me(otherSession).expect(401);
    await me(apiToken).expect(200);
    await signIn(user.email, testPassword).expect(401);
    await signIn(user.email, newPassword).expect(200);
    const audit = await AuditEvent.findAll({ where: { subjectUserId: user.id, action: 'password-changed' } });
    expect(audit).to.have.length(1);
    expect(JSON.stringify(audit[0].toJSON())).not.to.contain(newPassword);
  });

  it('refuses a wrong current password with 422 naming the field, and changes nothing', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'integrator');
    const otherSession = await createSession(user.id);
    // sessions change only in their last-used time, which every authenticated request may write
    const before = await tableChecksums(scratch.sequelize, ['audit_events', 'sessions']);
    const response = await change(token, { currentPassword: 'not-the-password', newPassword }).expect(422);
    expect(response.type).to.equal('application/problem+json');
    expect(response.body.errors).to.deep.equal([{ pointer: '/body/currentPassword', detail: 'is not right' }]);
    expect(await tableChecksums(scratch.sequelize, ['audit_events', 'sessions'])).to.deep.equal(before);
    await me(otherSession).expect(200);
    expect(await AuditEvent.count({ where: { subjectUserId: user.id, action: 'password-change-failed' } })).to.equal(1);
  });

  it('refuses a weak new password with 422 at /body/newPassword, and one holding the e-mail address', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'admin', {
      email: 'weir.keeper@accounts.test',
    });
    const short = await change(token, { currentPassword: testPassword, newPassword: 'pond1' }).expect(422);
    expect(short.body.errors[0].pointer).to.equal('/body/newPassword');
    const withEmail = await change(token, {
      currentPassword: testPassword,
      newPassword: 'weir.keeper@accounts.test!',
    }).expect(422);
    expect(withEmail.body.errors[0].pointer).to.equal('/body/newPassword');
    const stored = await User.findByPk(user.id, { rejectOnEmpty: true });
    await signIn(stored.email, testPassword).expect(200);
  });

  it('names a missing field with 400 and refuses API tokens (sessions only)', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer');
    const missing = await change(token, { currentPassword: testPassword }).expect(400);
    expect(JSON.stringify(missing.body)).to.contain('newPassword');
    const apiToken = await createApiToken(scratch.sequelize, user.id, [
      'catalog:read',
      'calculations:run',
      'projects:write',
      'curves:import',
    ]);
    await change(apiToken, { currentPassword: testPassword, newPassword }).expect(403);
  });

  it('limits guessing of the current password like failed sign-ins (429)', async () => {
    const limited = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': { limit: 3, windowMs: 60_000 } } },
    });
    const { token } = await createUserWithSession(scratch.sequelize, 'designer');
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 4; attempt += 1)
      statuses.push((await change(token, { currentPassword: `guess-${attempt}`, newPassword }, limited)).status);
    expect(statuses.slice(0, 3)).to.deep.equal([422, 422, 422]);
    expect(statuses[3]).to.equal(429);
  });
});
