import { mock } from 'node:test';
import { expect } from 'chai';
import { createHash } from 'node:crypto';
import { Writable } from 'node:stream';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { ApiToken, Session, User } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { newSecretToken } from '../../../server/accounts/secret-tokens';
import { createApiToken, createUserWithSession, testPassword } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/** SHA-256 in hex, computed here with node:crypto independently of the server's code. */
function sha256(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

describe('bearer tokens: sessions and personal API tokens', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  const logLines: string[] = [];

  before(async () => {
    scratch = await createScratchDatabase('bearer_tokens');
    const logStream = new Writable({
      write(chunk, _encoding, done) {
        logLines.push(String(chunk));
        done();
      },
    });
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('trace', logStream) });
  });

  after(async () => {
    await scratch?.drop();
  });

  const me = (token: string) => request(app).get('/api/v1/auth/me').set('Authorization', `Bearer ${token}`);

  it('signs in with the contract names, stores only the SHA-256 of the session token and an argon2id password hash', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'designer', {
      email: 'Tarn.Designer@accounts.test',
    });
    const response = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: ' tarn.designer@ACCOUNTS.test', password: testPassword })
      .expect(200);
    expect(Object.keys(response.body).sort()).to.deep.equal(['expiresAt', 'token', 'user']);
    expect(response.body.user).to.deep.equal({
      id: user.id,
      email: 'tarn.designer@accounts.test',
      name: user.name,
      role: 'designer',
      supplierId: null,
    });
    const hoursLeft = (Date.parse(response.body.expiresAt) - Date.now()) / 3600_000;
    expect(hoursLeft).to.be.within(11.9, 12.01);

    const [sessions] = await scratch.sequelize.query('SELECT * FROM sessions');
    expect(JSON.stringify(sessions)).not.to.contain(response.body.token);
    expect((sessions as Array<{ token_hash: string }>).map((row) => row.token_hash)).to.include(
      sha256(response.body.token),
    );

    const [users] = await scratch.sequelize.query('SELECT password_hash FROM users WHERE id = ?', {
      replacements: [user.id],
    });
    const passwordHash = (users as Array<{ password_hash: string }>)[0].password_hash;
    expect(passwordHash).to.match(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(passwordHash).not.to.contain(testPassword);
    await me(response.body.token).expect(200);
  });

  it('answers a wrong password and an unknown e-mail with the same 401', async () => {
    await createUserWithSession(scratch.sequelize, 'integrator', { email: 'known@accounts.test' });
    const wrong = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'known@accounts.test', password: 'not-the-password' })
      .expect(401);
    const unknown = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'nobody@accounts.test', password: 'not-the-password' })
      .expect(401);
    expect(wrong.type).to.equal('application/problem+json');
    const { instance: _a, ...wrongProblem } = wrong.body;
    const { instance: _b, ...unknownProblem } = unknown.body;
    expect(wrongProblem).to.deep.equal(unknownProblem);
  });

  it('stores only the hash and the shown prefix of an API token, lists it without the token, and updates last use', async () => {
    const { token: session } = await createUserWithSession(scratch.sequelize, 'integrator');
    const created = await request(app)
      .post('/api/v1/account/api-tokens')
      .set('Authorization', `Bearer ${session}`)
      .send({
        name: 'Estimating sheet',
        scopes: ['calculations:run', 'catalog:read'],
        expiresInDays: 30,
        password: testPassword,
      })
      .expect(201);
    const token: string = created.body.token;
    expect(token.startsWith(created.body.apiToken.prefix)).to.equal(true);
    expect(created.body.apiToken.prefix.length).to.be.lessThan(token.length / 3);
    const row = await ApiToken.findByPk(created.body.apiToken.id, { rejectOnEmpty: true });
    expect(row.tokenHash).to.equal(sha256(token));
    expect(JSON.stringify(row.get({ plain: true }))).not.to.contain(token);
    expect((row.expiresAt!.getTime() - Date.now()) / 86_400_000).to.be.within(29.9, 30.01);

    await me(token).expect(200);
    const listed = await request(app)
      .get('/api/v1/account/api-tokens')
      .set('Authorization', `Bearer ${session}`)
      .expect(200);
    expect(JSON.stringify(listed.body)).not.to.contain(token);
    expect(listed.body.tokens[0]).to.include({ name: 'Estimating sheet', prefix: created.body.apiToken.prefix });
    expect(listed.body.tokens[0].lastUsedAt).to.be.a('string');
  });

  it("refuses a revoked API token, and revoking another user's token is a 404 that changes nothing", async () => {
    const owner = await createUserWithSession(scratch.sequelize, 'integrator');
    const stranger = await createUserWithSession(scratch.sequelize, 'designer');
    const created = await request(app)
      .post('/api/v1/account/api-tokens')
      .set('Authorization', `Bearer ${owner.token}`)
      .send({ name: 'CAD plug-in', scopes: ['catalog:read'], password: testPassword })
      .expect(201);
    await request(app)
      .delete(`/api/v1/account/api-tokens/${created.body.apiToken.id}`)
      .set('Authorization', `Bearer ${stranger.token}`)
      .expect(404);
    await me(created.body.token).expect(200);
    await request(app)
      .delete(`/api/v1/account/api-tokens/${created.body.apiToken.id}`)
      .set('Authorization', `Bearer ${owner.token}`)
      .expect(204);
    const refused = await me(created.body.token).expect(401);
    expect(refused.body.detail).to.match(/unknown, expired or revoked/);
  });

  it('refuses an expired API token and an expired session', async () => {
    const { user, token: session } = await createUserWithSession(scratch.sequelize, 'integrator');
    const expiredToken = await createApiToken(scratch.sequelize, user.id, ['catalog:read'], {
      expiresAt: new Date(Date.now() - 1000),
    });
    await me(expiredToken).expect(401);
    await me(session).expect(200);
    await Session.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    await me(session).expect(401);
  });

  it('refuses every session and token of a disabled user', async () => {
    const { user, token: session } = await createUserWithSession(scratch.sequelize, 'integrator');
    const apiToken = await createApiToken(scratch.sequelize, user.id, ['catalog:read']);
    await User.update({ disabled: true }, { where: { id: user.id } });
    await me(session).expect(401);
    await me(apiToken).expect(401);
  });

  it('signs out: the session stops working, other sessions of the user do not', async () => {
    const { user, token: first } = await createUserWithSession(scratch.sequelize, 'designer');
    const second = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: user.email, password: testPassword })
      .expect(200);
    await request(app).post('/api/v1/auth/sign-out').set('Authorization', `Bearer ${first}`).expect(204);
    await me(first).expect(401);
    await me(second.body.token).expect(200);
  });

  for (const [what, header] of [
    ['a bare scheme', 'Bearer'],
    ['another scheme', 'Basic ZGVzaWduZXI6cmlmZmxl'],
    ['two words after Bearer', 'Bearer rfs_a rfs_b'],
    ['a token of the wrong shape', 'Bearer rfs_short'],
    ['an e-mail link token used as a bearer', `Bearer rfl_${'A'.repeat(43)}`],
    ['a well-formed token nobody was given', `Bearer rfs_${'x'.repeat(43)}`],
    ['a quote and SQL', "Bearer ' OR '1'='1"],
  ] as const) {
    it(`refuses ${what} with 401 problem details`, async () => {
      const response = await request(app).get('/api/v1/auth/me').set('Authorization', header).expect(401);
      expect(response.type).to.equal('application/problem+json');
      expect(response.headers['www-authenticate']).to.equal('Bearer realm="riffle"');
    });
  }

  it('remembers a live session briefly: repeated requests do not look it up again', async () => {
    const { token } = await createUserWithSession(scratch.sequelize, 'designer');
    const findOne = Session.findOne;
    let lookups = 0;
    Session.findOne = ((...args: Parameters<typeof findOne>) => {
      lookups += 1;
      return findOne.apply(Session, args);
    }) as typeof findOne;
    try {
      for (let call = 0; call < 5; call += 1) await me(token).expect(200);
    } finally {
      Session.findOne = findOne;
    }
    expect(lookups).to.equal(1);
  });

  it('never trusts a remembered session past its own expiry', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'designer');
    const { token, hash } = newSecretToken('session');
    // the clock passes the expiry without waiting for it
    mock.timers.enable({ apis: ['Date'], now: Date.now() });
    try {
      // whole seconds, as the column keeps them
      await Session.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + 2000) });
      await me(token).expect(200);
      mock.timers.tick(2100);
      await me(token).expect(401);
    } finally {
      mock.timers.reset();
    }
  });

  it('applies a role change by an admin to a session at once, though the session was just used', async () => {
    const { token: adminToken } = await createUserWithSession(scratch.sequelize, 'admin');
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer');
    const users = () => request(app).get('/api/v1/admin/users').set('Authorization', `Bearer ${token}`);
    await users().expect(403);
    await request(app)
      .patch(`/api/v1/admin/users/${user.id}`)
      .set('Authorization', `Bearer ${adminToken}`)
      .send({ role: 'admin' })
      .expect(200);
    await users().expect(200);
    expect((await me(token).expect(200)).body.role).to.equal('admin');
  });

  it('refuses a token in the address rather than the header', async () => {
    const { token } = await createUserWithSession(scratch.sequelize, 'designer');
    const response = await request(app).get(`/api/v1/auth/me?access_token=${token}`).expect(400);
    expect(response.body.pointer).to.equal('/query/access_token');
  });

  it('never writes a password or a token to the log, and never answers a password hash', async () => {
    const admin = await createUserWithSession(scratch.sequelize, 'admin');
    const signedIn = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: admin.user.email, password: testPassword })
      .expect(200);
    const users = await request(app)
      .get('/api/v1/admin/users')
      .set('Authorization', `Bearer ${signedIn.body.token}`)
      .expect(200);
    expect(JSON.stringify(users.body)).not.to.match(/argon2|password/i);
    expect(logLines.length).to.be.greaterThan(5);
    const log = logLines.join('');
    expect(log).to.contain('/api/v1/auth/sign-in');
    expect(log).not.to.contain(testPassword);
    expect(log).not.to.contain(signedIn.body.token);
    expect(log).not.to.contain(admin.token);
  });
});
