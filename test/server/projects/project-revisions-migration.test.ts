import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import type { Project } from '../../../shared/api/api-schemas';
import { createApp } from '../../../server/app';
import { createMigrator } from '../../../server/database/migrator';
import { createLogger } from '../../../server/logging';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

const revisionsTable = '2026.12.02T03.00.00.create-project-revisions.ts';

/** A project as saved before revisions: a row with its design and nothing else. */
const oldDesign = {
  unitSystem: 'us',
  system: {
    staticMode: 'direct',
    staticHead: 9,
    intakeLevel: 0,
    dischargeLevel: 9,
    outletPressureHead: 0,
    waterTemperatureC: 15,
    frictionMethod: 'hazen-williams',
    segments: [{ series: 'pvc-sch40', size: 'pvc-sch40-3', length: 120, fittings: [], extraK: 0 }],
  },
  band: { flowMin: 60, flowMax: 80 },
  search: {
    arrangements: [1],
    requireOneFailed: false,
    standby: false,
    onlyPreferredRegion: false,
    maxInputPowerPerPump: null,
    hoursPerDay: 12,
    tariffPerKWh: null,
    limit: 10,
  },
};

describe('projects: the migration to revisions', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;

  before(async () => {
    scratch = await createScratchDatabase('project-revisions-migration');
  });

  after(async () => {
    await scratch?.drop();
  });

  const revisionRows = () =>
    scratch.sequelize.query<{ project_id: number; number: number; visited_on: string; author_user_id: number }>(
      "SELECT project_id, number, DATE_FORMAT(visited_on, '%Y-%m-%d') AS visited_on, author_user_id FROM project_revisions ORDER BY project_id",
      { type: QueryTypes.SELECT },
    );

  it('gives a project saved before revisions its design as revision 1, opens it unchanged, and goes down and up again', async () => {
    const migrator = createMigrator(scratch.sequelize);
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer');
    await migrator.down({ to: revisionsTable });
    await scratch.sequelize.query(
      `INSERT INTO projects (owner_user_id, name, design, created_at, updated_at)
       VALUES (?, 'Old pond', ?, '2026-11-03 08:00:00', '2026-11-05 17:30:00')`,
      { replacements: [user.id, JSON.stringify(oldDesign)] },
    );
    await migrator.up();
    const [{ id }] = await scratch.sequelize.query<{ id: number }>("SELECT id FROM projects WHERE name = 'Old pond'", {
      type: QueryTypes.SELECT,
    });
    expect(await revisionRows()).to.deep.equal([
      { project_id: id, number: 1, visited_on: '2026-11-03', author_user_id: user.id },
    ]);

    const app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    const opened = await request(app).get(`/api/v1/projects/${id}`).set('Authorization', `Bearer ${token}`).expect(200);
    expect(opened.headers.etag).to.equal(`"p${id}r1"`);
    expect((opened.body as Project).design).to.deep.equal(oldDesign);
    expect(opened.body).to.include({ revision: 1, visitedOn: '2026-11-03', notes: null, choice: null });

    // a later visit is kept going down past the first-revision step; only the lone first revisions go
    await request(app)
      .put(`/api/v1/projects/${id}`)
      .set('Authorization', `Bearer ${token}`)
      .set('If-Match', opened.headers.etag as string)
      .send({ name: 'Old pond', design: oldDesign })
      .expect(200);
    const firstRevisions = '2026.12.02T03.01.00.give-projects-first-revisions.ts';
    await migrator.down({ to: firstRevisions });
    expect((await revisionRows()).map((row) => row.number)).to.deep.equal([1, 2]);
    await scratch.sequelize.query('DELETE FROM project_revisions WHERE number = 2');
    await migrator.up();
    expect((await revisionRows()).map((row) => row.number)).to.deep.equal([1]);
    await migrator.down({ to: firstRevisions });
    expect(await revisionRows()).to.deep.equal([]);
    await migrator.up();
    expect((await revisionRows()).map((row) => row.number)).to.deep.equal([1]);
  });
});
