import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import type { SelectionResponse } from '../../../shared/api/api-schemas';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from './synthetic-catalog';

/*
 * Narrowing the search by pump kind and by the solids a pump passes: every candidate answered
 * meets the filter, every pump of the catalog that meets it and is found without the filter is
 * found with it, and a pump whose catalog entry gives no solids size is left out when a size is asked.
 */
describe('POST /api/v1/selections filters by kind and solids', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;

  const search = {
    units: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' },
    system: {
      staticHead: 14.5,
      frictionMethod: 'hazen-williams',
      segments: [{ length: 240, pipe: 'pvc-sch40-3', fittings: [] }],
    },
    duty: { flowMin: 90, flowMax: 130 },
    arrangements: [1, 2],
    energy: { hoursPerDay: 24 },
    limit: 200,
  };
  const post = (body: object) =>
    request(app).post('/api/v1/selections').set('Authorization', `Bearer ${token}`).send(body);

  before(async () => {
    scratch = await createScratchDatabase('selection_filters');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(90, 7));
    // a third external centrifugal; solids: none given for ids divisible by 5, else 2, 6 or 10 mm by id
    await scratch.sequelize.query(
      `UPDATE pumps SET kind = IF(id % 3 = 0, 'external-centrifugal', 'submersible'),
         solids_handling_mm = IF(id % 5 = 0, NULL, ELT(1 + id % 3, 2, 6, 10)), updated_at = NOW(3)`,
    );
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  it('answers each candidate with its kind and solids size as the catalog holds them', async () => {
    const body = (await post(search).expect(200)).body as SelectionResponse;
    expect(body.candidates.length).to.be.greaterThan(5);
    for (const candidate of body.candidates) {
      expect(candidate.kind).to.equal(candidate.pumpId % 3 === 0 ? 'external-centrifugal' : 'submersible');
      expect(candidate.solidsHandlingMm).to.equal(candidate.pumpId % 5 === 0 ? null : [2, 6, 10][candidate.pumpId % 3]);
    }
  });

  it('keeps only the kinds asked, and every such pump found without the filter', async () => {
    const all = (await post(search).expect(200)).body as SelectionResponse;
    const body = (await post({ ...search, filters: { kinds: ['external-centrifugal'] } }).expect(200))
      .body as SelectionResponse;
    expect(body.candidates.length).to.be.greaterThan(0);
    expect(body.candidates.every((candidate) => candidate.kind === 'external-centrifugal')).to.equal(true);
    const key = (candidate: SelectionResponse['candidates'][number]) =>
      `${candidate.pumpId}x${candidate.arrangement.running}`;
    expect(body.candidates.map(key).sort()).to.deep.equal(
      all.candidates
        .filter((candidate) => candidate.kind === 'external-centrifugal')
        .map(key)
        .sort(),
    );
  });

  it('keeps only pumps passing solids at least as large as asked, leaving out those that do not say', async () => {
    const all = (await post(search).expect(200)).body as SelectionResponse;
    const body = (await post({ ...search, filters: { minSolidsMm: 6 } }).expect(200)).body as SelectionResponse;
    const expected = all.candidates.filter(
      (candidate) => candidate.solidsHandlingMm !== null && candidate.solidsHandlingMm >= 6,
    );
    expect(expected.length).to.be.greaterThan(0);
    expect(expected.length).to.be.lessThan(all.candidates.length);
    expect(body.candidates.map((candidate) => candidate.pumpId).sort()).to.deep.equal(
      expected.map((candidate) => candidate.pumpId).sort(),
    );
  });

  it('refuses a solids size that is not a positive number up to 500 mm, naming it', async () => {
    for (const minSolidsMm of [0, -3, 501]) {
      const response = await post({ ...search, filters: { minSolidsMm } }).expect(400);
      expect(response.body.errors?.[0]?.pointer ?? response.body.detail).to.contain('minSolidsMm');
    }
  });
});
