import { expect } from 'chai';
import request from 'supertest';
import type { Preferences } from '../../../shared/api/api-schemas';
import { apiScopes, candidateColumns } from '../../../shared/vocabularies';
import { createApp } from '../../../server/app';
import { UserPreference } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createApiToken, createSession, createUserWithSession, tableChecksums } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';

/*
 * Each user's preferences, kept on the server: the candidates table's shown columns follow the
 * user to another browser (another session), are the user's own, and a wrong column id is refused
 * naming its index, with nothing written.
 */
describe('accounts: preferences kept on the server', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  const preferencesSchema = contractSchemaValidator('Preferences');

  before(async () => {
    scratch = await createScratchDatabase('preferences');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
  });

  after(async () => {
    await scratch?.drop();
  });

  const read = (token: string) =>
    request(app).get('/api/v1/account/preferences').set('Authorization', `Bearer ${token}`);
  const save = (token: string, body: unknown) =>
    request(app)
      .put('/api/v1/account/preferences')
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);

  function expectContract(body: unknown): Preferences {
    expect(preferencesSchema(body), JSON.stringify(preferencesSchema.errors)).to.equal(true);
    return body as Preferences;
  }

  it('answers null for a user who never chose, then keeps a choice for every session of that user', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer');
    const first = expectContract((await read(token).expect(200)).body);
    expect(first).to.deep.equal({ candidateColumns: null, updatedAt: null });

    const chosen = ['flow', 'head', 'bep', 'lifeCycleCost', 'misses'];
    const saved = expectContract((await save(token, { candidateColumns: chosen }).expect(200)).body);
    expect(saved.candidateColumns).to.deep.equal(chosen);
    expect(Date.parse(saved.updatedAt!)).to.be.closeTo(Date.now(), 60_000);

    // another browser is another session of the same user
    const elsewhere = await createSession(user.id);
    expect((await read(elsewhere).expect(200)).body).to.deep.equal(saved);
    // and the row is in the database, not in this app's memory
    const row = await UserPreference.findByPk(user.id);
    expect(row?.candidateColumns).to.deep.equal(chosen);
    const restarted = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    const afterRestart = await request(restarted)
      .get('/api/v1/account/preferences')
      .set('Authorization', `Bearer ${elsewhere}`)
      .expect(200);
    expect(afterRestart.body.candidateColumns).to.deep.equal(chosen);
  });

  it('replaces the choice on the next save, and keeps an empty one (every column hidden)', async () => {
    const { token } = await createUserWithSession(scratch.sequelize, 'integrator');
    const first = (await save(token, { candidateColumns: [...candidateColumns] }).expect(200)).body as Preferences;
    expect(first.candidateColumns).to.deep.equal([...candidateColumns]);
    await save(token, { candidateColumns: ['reasons', 'flow'] }).expect(200);
    expect((await read(token).expect(200)).body.candidateColumns).to.deep.equal(['reasons', 'flow']);
    const emptied = (await save(token, { candidateColumns: [] }).expect(200)).body as Preferences;
    expect(emptied.candidateColumns).to.deep.equal([]);
    expect((await read(token).expect(200)).body.candidateColumns).to.deep.equal([]);
    expect(Date.parse(emptied.updatedAt!)).to.be.at.least(Date.parse(first.updatedAt!));
  });

  it("keeps each user's choice their own: another user reads and writes only theirs", async () => {
    const mine = await createUserWithSession(scratch.sequelize, 'designer');
    const theirs = await createUserWithSession(scratch.sequelize, 'designer');
    await save(mine.token, { candidateColumns: ['flow'] }).expect(200);
    expect((await read(theirs.token).expect(200)).body).to.deep.equal({ candidateColumns: null, updatedAt: null });
    await save(theirs.token, { candidateColumns: ['head', 'warnings'] }).expect(200);
    expect((await read(mine.token).expect(200)).body.candidateColumns).to.deep.equal(['flow']);
    expect((await read(theirs.token).expect(200)).body.candidateColumns).to.deep.equal(['head', 'warnings']);
    // the route names no user: a user id in the path or the body reaches nothing
    await request(app)
      .get(`/api/v1/account/preferences/${mine.user.id}`)
      .set('Authorization', `Bearer ${theirs.token}`)
      .expect(404);
    const smuggled = await save(theirs.token, { candidateColumns: ['energy'], userId: mine.user.id });
    expect(smuggled.status).to.equal(400);
    expect(smuggled.body.pointer).to.equal('/body/userId');
    expect((await read(mine.token).expect(200)).body.candidateColumns).to.deep.equal(['flow']);
  });

  it('is for signed-in sessions: anonymous callers get 401, an API token with every scope 403', async () => {
    const { user } = await createUserWithSession(scratch.sequelize, 'designer');
    await request(app).get('/api/v1/account/preferences').expect(401);
    await request(app)
      .put('/api/v1/account/preferences')
      .send({ candidateColumns: ['flow'] })
      .expect(401);
    const apiToken = await createApiToken(scratch.sequelize, user.id, apiScopes);
    expect((await read(apiToken)).status).to.equal(403);
    expect((await save(apiToken, { candidateColumns: ['flow'] })).status).to.equal(403);
    expect(await UserPreference.findByPk(user.id)).to.equal(null);
  });

  describe('refuses a wrong list, naming the entry, and writes nothing', () => {
    let token: string;

    before(async () => {
      ({ token } = await createUserWithSession(scratch.sequelize, 'designer'));
      await save(token, { candidateColumns: ['flow', 'head'] }).expect(200);
    });

    const refusals: Array<{ why: string; body: unknown; status: number; pointer: string; detail: RegExp }> = [
      {
        why: 'an id that is no column',
        body: { candidateColumns: ['flow', 'head', 'npshMargin'] },
        status: 422,
        pointer: '/body/candidateColumns/2',
        detail: /must be one of: arrangement, flow, .*reasons/,
      },
      {
        why: 'an id in the wrong case',
        body: { candidateColumns: ['Flow'] },
        status: 422,
        pointer: '/body/candidateColumns/0',
        detail: /must be one of/,
      },
      {
        why: 'a sticky column, which is never hidden',
        body: { candidateColumns: ['flow', 'pump'] },
        status: 422,
        pointer: '/body/candidateColumns/1',
        detail: /must be one of/,
      },
      {
        why: 'an id given twice',
        body: { candidateColumns: ['flow', 'head', 'flow'] },
        status: 422,
        pointer: '/body/candidateColumns/2',
        detail: /earlier index/,
      },
      {
        why: 'a bidirectional override inside an id',
        body: { candidateColumns: ['head', 'fl\u202Eow'] },
        status: 422,
        pointer: '/body/candidateColumns/1',
        detail: /bidirectional/,
      },
      {
        why: 'markup as an id',
        body: { candidateColumns: ['<b>flow</b>'] },
        status: 422,
        pointer: '/body/candidateColumns/0',
        detail: /angle brackets/,
      },
      {
        why: 'a number among the ids',
        body: { candidateColumns: ['flow', 7] },
        status: 400,
        pointer: '/body/candidateColumns/1',
        detail: /string/,
      },
      {
        why: 'an empty id',
        body: { candidateColumns: [''] },
        status: 400,
        pointer: '/body/candidateColumns/0',
        detail: /fewer than 1/,
      },
      {
        why: 'one string instead of a list',
        body: { candidateColumns: 'flow' },
        status: 400,
        pointer: '/body/candidateColumns',
        detail: /array/,
      },
      {
        why: 'no list at all',
        body: {},
        status: 400,
        pointer: '/body/candidateColumns',
        detail: /required/,
      },
      {
        why: 'more entries than the table could ever have',
        body: { candidateColumns: Array.from({ length: 41 }, () => 'flow') },
        status: 400,
        pointer: '/body/candidateColumns',
        detail: /more than 40/,
      },
    ];

    for (const refusal of refusals) {
      it(`${refusal.why} -> ${refusal.status} at ${refusal.pointer}`, async () => {
        const before = await tableChecksums(scratch.sequelize, ['sessions']);
        const response = await save(token, refusal.body);
        expect(response.status, JSON.stringify(response.body)).to.equal(refusal.status);
        expect(response.type).to.equal('application/problem+json');
        expect(response.body.pointer).to.equal(refusal.pointer);
        expect(response.body.errors[0].detail).to.match(refusal.detail);
        expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
        expect((await read(token).expect(200)).body.candidateColumns).to.deep.equal(['flow', 'head']);
      });
    }
  });
});
