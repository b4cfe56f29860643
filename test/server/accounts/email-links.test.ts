import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { Invitation, PasswordResetLink, Supplier, User } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { readMailbox } from '../../../server/mail/mailbox';
import {
  createUserWithSession,
  linkTokenIn,
  testMailboxFolder,
  testPassword,
  waitForMail,
} from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/*
 * Invitations and password resets end to end: the API asks nodemailer to send, the fake SMTP
 * server that `npm test` runs receives the message over SMTP and keeps it, and the test follows
 * the link in the received text.
 */
describe('invitations and password reset through the fake SMTP server', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let adminToken: string;
  let supplier: Supplier;
  const generous = { limit: 10_000, windowMs: 60_000 };
  let addressCount = 0;
  const freshAddress = (what: string) => `${what}-${process.pid}-${Date.now()}-${++addressCount}@mail.accounts.test`;

  before(async () => {
    scratch = await createScratchDatabase('email_links');
    supplier = await Supplier.create({ code: 'LINKTEST', name: 'Link Test Demo Supply' });
    adminToken = (await createUserWithSession(scratch.sequelize, 'admin', { name: 'Wren Admin' })).token;
    app = createApp({
      sequelize: scratch.sequelize,
      logger: createLogger('silent'),
      accounts: {
        publicUrl: 'http://riffle.example.test',
        demoMailboxFolder: testMailboxFolder(),
        rateLimits: { 'sign-in': generous, 'email-link': generous, invitation: generous },
      },
    });
  });

  after(async () => {
    await scratch?.drop();
  });

  const invite = (body: object) =>
    request(app).post('/api/v1/admin/invitations').set('Authorization', `Bearer ${adminToken}`).send(body);

  it('invites by e-mail; the link works once, signs the new user in with the invited role, then not again', async () => {
    const email = freshAddress('invitee');
    const since = new Date(Date.now() - 1000);
    const invited = await invite({ email, role: 'supplier-admin', supplierId: supplier.id }).expect(201);
    expect(invited.body).to.include({ email, role: 'supplier-admin', supplierId: supplier.id });

    const message = await waitForMail(email, since);
    expect(message.subject).to.equal('You are invited to Riffle');
    expect(message.text).to.contain('Wren Admin invites you to Riffle as a supplier admin');
    expect(message.text).to.contain('http://riffle.example.test/accounts/accept-invitation?token=rfl_');
    const token = linkTokenIn(message);
    expect(JSON.stringify(await Invitation.findAll({ raw: true }))).not.to.contain(token);

    const accepted = await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token, name: ' Robin Fenwick ', password: 'weir-and-gravel-bed' })
      .expect(200);
    expect(accepted.body.user).to.include({
      email,
      name: 'Robin Fenwick',
      role: 'supplier-admin',
      supplierId: supplier.id,
    });
    await request(app).get('/api/v1/auth/me').set('Authorization', `Bearer ${accepted.body.token}`).expect(200);
    await request(app).post('/api/v1/auth/sign-in').send({ email, password: 'weir-and-gravel-bed' }).expect(200);

    const again = await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token, name: 'Someone Else', password: 'another-long-phrase' })
      .expect(410);
    expect(again.body.pointer).to.equal('/body/token');
    expect(await User.count({ where: { email } })).to.equal(1);
  });

  it('lists the received message on the demo mailbox for admins', async () => {
    const email = freshAddress('mailbox');
    const since = new Date(Date.now() - 1000);
    await invite({ email, role: 'designer' }).expect(201);
    await waitForMail(email, since);
    const mailbox = await request(app)
      .get('/api/v1/admin/demo-mailbox')
      .set('Authorization', `Bearer ${adminToken}`)
      .expect(200);
    const listed = mailbox.body.messages.find((candidate: { to: string[] }) => candidate.to.includes(email));
    expect(listed.subject).to.equal('You are invited to Riffle');
  });

  it('refuses an expired invitation and creates no account', async () => {
    const email = freshAddress('late');
    const since = new Date(Date.now() - 1000);
    await invite({ email, role: 'designer' }).expect(201);
    const token = linkTokenIn(await waitForMail(email, since));
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token, name: 'Late Comer', password: 'weir-and-gravel-bed' })
      .expect(410);
    expect(await User.count({ where: { email } })).to.equal(0);
  });

  it('a weak password is a 422 naming the field, and leaves the invitation usable', async () => {
    const email = freshAddress('weak');
    const since = new Date(Date.now() - 1000);
    await invite({ email, role: 'integrator' }).expect(201);
    const token = linkTokenIn(await waitForMail(email, since));
    for (const password of ['short', 'password123', 'aaaaaaaaaaaa', `${email.split('@')[0]}-x`]) {
      const refused = await request(app)
        .post('/api/v1/auth/accept-invitation')
        .send({ token, name: 'Weak Example', password })
        .expect(422);
      expect(refused.body.pointer, password).to.equal('/body/password');
    }
    await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token, name: 'Weak Example', password: 'weir-and-gravel-bed' })
      .expect(200);
  });

  it('only the newest invitation to an address works', async () => {
    const email = freshAddress('twice');
    const firstSince = new Date(Date.now() - 1000);
    await invite({ email, role: 'designer' }).expect(201);
    const first = linkTokenIn(await waitForMail(email, firstSince));
    const secondSince = new Date();
    await invite({ email, role: 'integrator' }).expect(201);
    const messages = readMailbox(testMailboxFolder()).filter(
      (message) => message.to.includes(email) && message.receivedAt >= secondSince.toISOString(),
    );
    const second = linkTokenIn(messages[0] ?? (await waitForMail(email, secondSince)));
    expect(second).not.to.equal(first);
    await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token: first, name: 'Twice Invited', password: 'weir-and-gravel-bed' })
      .expect(410);
    const accepted = await request(app)
      .post('/api/v1/auth/accept-invitation')
      .send({ token: second, name: 'Twice Invited', password: 'weir-and-gravel-bed' })
      .expect(200);
    expect(accepted.body.user.role).to.equal('integrator');
  });

  it('refuses to invite an address that has an account, or a supplier-admin without a supplier', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'designer');
    const exists = await invite({ email: user.email, role: 'designer' }).expect(409);
    expect(exists.body.pointer).to.equal('/body/email');
    const unbound = await invite({ email: freshAddress('unbound'), role: 'supplier-admin' }).expect(422);
    expect(unbound.body.pointer).to.equal('/body/supplierId');
    const designerWithSupplier = await invite({
      email: freshAddress('bound'),
      role: 'designer',
      supplierId: supplier.id,
    }).expect(422);
    expect(designerWithSupplier.body.pointer).to.equal('/body/supplierId');
  });

  it('resets a password: same answer for a known and an unknown address, one message, the link works once', async () => {
    const { user, token: oldSession } = await createUserWithSession(scratch.sequelize, 'designer', {
      email: freshAddress('forgetful'),
    });
    const unknown = freshAddress('nobody');
    const since = new Date(Date.now() - 1000);
    const known = await request(app).post('/api/v1/auth/forgot-password').send({ email: user.email }).expect(202);
    const stranger = await request(app).post('/api/v1/auth/forgot-password').send({ email: unknown }).expect(202);
    expect(known.body).to.deep.equal(stranger.body);

    const message = await waitForMail(user.email, since);
    expect(message.subject).to.equal('Reset your Riffle password');
    const token = linkTokenIn(message);
    expect(readMailbox(testMailboxFolder()).some((candidate) => candidate.to.includes(unknown))).to.equal(false);

    await request(app)
      .post('/api/v1/auth/reset-password')
      .send({ token, password: 'new-pond-pump-phrase' })
      .expect(200);
    await request(app).get('/api/v1/auth/me').set('Authorization', `Bearer ${oldSession}`).expect(401);
    await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: testPassword }).expect(401);
    await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: user.email, password: 'new-pond-pump-phrase' })
      .expect(200);
    const again = await request(app)
      .post('/api/v1/auth/reset-password')
      .send({ token, password: 'third-pond-pump-phrase' })
      .expect(410);
    expect(again.body.pointer).to.equal('/body/token');
    await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: user.email, password: 'new-pond-pump-phrase' })
      .expect(200);
  });

  it('refuses an expired reset link and keeps the old password', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'integrator', { email: freshAddress('slow') });
    const since = new Date(Date.now() - 1000);
    await request(app).post('/api/v1/auth/forgot-password').send({ email: user.email }).expect(202);
    const token = linkTokenIn(await waitForMail(user.email, since));
    await PasswordResetLink.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    await request(app)
      .post('/api/v1/auth/reset-password')
      .send({ token, password: 'new-pond-pump-phrase' })
      .expect(410);
    await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: testPassword }).expect(200);
  });

  it('records sign-ins, failures, tokens, role changes and invitations in the audit log', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer', {
      email: freshAddress('audited'),
    });
    await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: user.email, password: 'not-the-password' })
      .expect(401);
    await request(app).post('/api/v1/auth/sign-in').send({ email: user.email, password: testPassword }).expect(200);
    const created = await request(app)
      .post('/api/v1/account/api-tokens')
      .set('Authorization', `Bearer ${token}`)
      .send({ name: 'Audit me', scopes: ['catalog:read'], password: testPassword })
      .expect(201);
    await request(app)
      .delete(`/api/v1/account/api-tokens/${created.body.apiToken.id}`)
      .set('Authorization', `Bearer ${token}`)
      .expect(204);
    await request(app)
      .patch(`/api/v1/admin/users/${user.id}`)
      .set('Authorization', `Bearer ${adminToken}`)
      .send({ role: 'integrator' })
      .expect(200);
    await request(app)
      .patch(`/api/v1/admin/users/${user.id}`)
      .set('Authorization', `Bearer ${adminToken}`)
      .send({ disabled: true })
      .expect(200);

    const log = await request(app)
      .get('/api/v1/admin/audit-events?limit=500')
      .set('Authorization', `Bearer ${adminToken}`)
      .expect(200);
    const about = log.body.events.filter(
      (event: { email: string | null; subjectEmail: string | null }) =>
        event.email === user.email || event.subjectEmail === user.email,
    );
    expect(about.map((event: { action: string }) => event.action).reverse()).to.deep.equal([
      'sign-in-failed',
      'sign-in',
      'api-token-created',
      'api-token-revoked',
      'role-changed',
      'user-disabled',
    ]);
    expect(about.find((event: { action: string }) => event.action === 'role-changed').detail).to.equal(
      'designer -> integrator',
    );
    expect(JSON.stringify(log.body)).not.to.contain(created.body.token);
  });
});
