import { expect } from 'chai';
import request from 'supertest';
import { newSecretToken } from '../../../server/accounts/secret-tokens';
import { createApp } from '../../../server/app';
import { ApiToken, AuditEvent, PasswordResetLink } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createApiToken, createUserWithSession, tableChecksums, testPassword } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/** API tokens need the password to be made, die with a password reset, and may die with a password change. */
describe('API tokens against a stolen session', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  const generous = { limit: 10_000, windowMs: 60_000 };

  before(async () => {
    scratch = await createScratchDatabase('credential_revocation');
    app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': generous, 'email-link': generous } },
    });
  });

  after(async () => {
    await scratch?.drop();
  });

  const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
  const me = (token: string) => request(app).get('/api/v1/auth/me').set(bearer(token));
  const createToken = (session: string, body: object, server = app) =>
    request(server).post('/api/v1/account/api-tokens').set(bearer(session)).send(body);
  const listTokens = async (session: string) =>
    (await request(app).get('/api/v1/account/api-tokens').set(bearer(session)).expect(200)).body.tokens as Array<{
      name: string;
      revokedAt: string | null;
      revokedReason: string | null;
    }>;

  /** A reset link as the e-mail would carry it. */
  async function resetLinkFor(userId: number): Promise<string> {
    const { token, hash } = newSecretToken('emailLink');
    await PasswordResetLink.create({ userId, tokenHash: hash, expiresAt: new Date(Date.now() + 3_600_000) });
    return token;
  }

  it('makes a token only with the right password; a wrong one is a 403 at /body/password that makes nothing', async () => {
    const { user, token: session } = await createUserWithSession(scratch.sequelize, 'designer');
    const before = await tableChecksums(scratch.sequelize, ['audit_events', 'sessions']);
    const wrong = await createToken(session, { name: 'Stolen', scopes: ['catalog:read'], password: 'a-guess-1234' });
    expect(wrong.status).to.equal(403);
    expect(wrong.type).to.equal('application/problem+json');
    expect(wrong.body.errors).to.deep.equal([{ pointer: '/body/password', detail: 'is not right' }]);
    expect(await tableChecksums(scratch.sequelize, ['audit_events', 'sessions'])).to.deep.equal(before);
    expect(await AuditEvent.count({ where: { subjectUserId: user.id, action: 'api-token-create-failed' } })).to.equal(
      1,
    );
    await me(session).expect(200);

    const missing = await createToken(session, { name: 'No password', scopes: ['catalog:read'] }).expect(400);
    expect(JSON.stringify(missing.body.errors)).to.contain('password');
    expect(await ApiToken.count({ where: { userId: user.id } })).to.equal(0);

    const made = await createToken(session, { name: 'Sheet', scopes: ['catalog:read'], password: testPassword });
    expect(made.status).to.equal(201);
    expect(made.body.apiToken).to.include({ revokedAt: null, revokedReason: null });
    await me(made.body.token).expect(200);
  });

  it('counts wrong passwords for a token like failed sign-ins (429)', async () => {
    const limited = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: { rateLimits: { 'sign-in': { limit: 3, windowMs: 60_000 } } },
    });
    const { token: session } = await createUserWithSession(scratch.sequelize, 'integrator');
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 4; attempt += 1) {
      const body = { name: 'Guess', scopes: ['catalog:read'], password: `guess-${attempt}` };
      statuses.push((await createToken(session, body, limited)).status);
    }
    expect(statuses).to.deep.equal([403, 403, 403, 429]);
  });

  it('a password reset revokes every live token, answers which, and the list says why', async () => {
    const { user, token: session } = await createUserWithSession(scratch.sequelize, 'designer');
    const made = await createToken(session, {
      name: 'Made by a thief',
      scopes: ['catalog:read'],
      password: testPassword,
    }).expect(201);
    const older = await createApiToken(scratch.sequelize, user.id, ['projects:write'], { name: 'Estimating sheet' });
    const expired = await createApiToken(scratch.sequelize, user.id, ['catalog:read'], {
      name: 'Long gone',
      expiresAt: new Date(Date.now() - 60_000),
    });
    const ownRevoked = await createToken(session, {
      name: 'Retired',
      scopes: ['catalog:read'],
      password: testPassword,
    }).expect(201);
    await request(app)
      .delete(`/api/v1/account/api-tokens/${ownRevoked.body.apiToken.id}`)
      .set(bearer(session))
      .expect(204);
    // used just before, so that a remembered lookup would still say yes
    await me(made.body.token).expect(200);
    await me(older).expect(200);

    const reset = await request(app)
      .post('/api/v1/auth/reset-password')
      .send({ token: await resetLinkFor(user.id), password: 'after-the-theft-42' })
      .expect(200);
    expect(reset.body.revokedApiTokenCount).to.equal(2);
    expect(reset.body.revokedApiTokens.map((token: { name: string }) => token.name).sort()).to.deep.equal([
      'Estimating sheet',
      'Made by a thief',
    ]);
    expect(JSON.stringify(reset.body)).not.to.contain(made.body.token);

    await me(made.body.token).expect(401);
    await me(older).expect(401);
    await me(expired).expect(401);
    await me(session).expect(401);
    const signedIn = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: user.email, password: 'after-the-theft-42' })
      .expect(200);
    const listed = await listTokens(signedIn.body.token);
    const byName = Object.fromEntries(listed.map((token) => [token.name, token]));
    expect(byName['Made by a thief'].revokedReason).to.equal('password-reset');
    expect(byName['Estimating sheet'].revokedReason).to.equal('password-reset');
    // the database keeps whole seconds
    const revokedAt = Date.parse(byName['Made by a thief'].revokedAt!);
    expect(Math.abs(revokedAt - Date.parse(reset.body.revokedApiTokens[0].revokedAt))).to.be.below(1000);
    expect(byName['Retired'].revokedReason).to.equal('owner');
    expect(byName['Long gone']).to.include({ revokedAt: null, revokedReason: null });
    const audit = await AuditEvent.findOne({ where: { subjectUserId: user.id, action: 'password-reset' } });
    expect(audit?.detail).to.contain(made.body.apiToken.prefix);
  });

  it('a password change revokes the tokens only when asked, says how many, and keeps this session', async () => {
    const { user, token: session } = await createUserWithSession(scratch.sequelize, 'integrator');
    const first = await createApiToken(scratch.sequelize, user.id, ['calculations:run'], { name: 'Controls' });
    const second = await createApiToken(scratch.sequelize, user.id, ['catalog:read'], { name: 'Drawing export' });
    await me(first).expect(200);

    const changed = await request(app)
      .put('/api/v1/account/password')
      .set(bearer(session))
      .send({ currentPassword: testPassword, newPassword: 'changed-weir-phrase-7', revokeApiTokens: true })
      .expect(200);
    expect(changed.body.revokedApiTokenCount).to.equal(2);
    expect(changed.body.revokedApiTokens.map((token: { revokedReason: string }) => token.revokedReason)).to.deep.equal([
      'password-change',
      'password-change',
    ]);
    await me(first).expect(401);
    await me(second).expect(401);
    await me(session).expect(200);
    const listed = await listTokens(session);
    expect(listed.map((token) => token.revokedReason)).to.deep.equal(['password-change', 'password-change']);

    const kept = await createApiToken(scratch.sequelize, user.id, ['catalog:read'], { name: 'Kept' });
    const again = await request(app)
      .put('/api/v1/account/password')
      .set(bearer(session))
      .send({ currentPassword: 'changed-weir-phrase-7', newPassword: 'changed-again-phrase-8', revokeApiTokens: false })
      .expect(200);
    expect(again.body).to.deep.equal({ revokedApiTokenCount: 0, revokedApiTokens: [] });
    await me(kept).expect(200);
  });

  it('a wrong current password revokes nothing, even when asked to', async () => {
    const { user, token: session } = await createUserWithSession(scratch.sequelize, 'designer');
    const apiToken = await createApiToken(scratch.sequelize, user.id, ['catalog:read']);
    await request(app)
      .put('/api/v1/account/password')
      .set(bearer(session))
      .send({ currentPassword: 'not-the-password', newPassword: 'changed-weir-phrase-7', revokeApiTokens: true })
      .expect(422);
    await me(apiToken).expect(200);
    expect((await listTokens(session))[0].revokedReason).to.equal(null);
  });
});
