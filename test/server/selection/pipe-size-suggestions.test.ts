import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import type { SelectionResponse } from '../../../shared/api/api-schemas';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from './synthetic-catalog';

/*
 * The pipe sizes a selection suggests where a segment runs over 5 ft/s at the top of the band,
 * checked by continuity worked by hand from the Schedule 40 bores (ASTM D1785, as the pipe
 * catalogue quotes them): V = Q / (pi d^2 / 4).
 */

const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' } as const;
const ftPerSecond = (gpm: number, boreInches: number) =>
  // a US gallon is 231 in3, a cubic foot 1728 in3
  (gpm * (231 / 1728)) / 60 / ((Math.PI * (boreInches / 12) ** 2) / 4);

describe('POST /api/v1/selections suggests larger pipe where the velocity is over the limit', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;

  const post = (body: unknown) =>
    request(app)
      .post('/api/v1/selections')
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);

  before(async () => {
    scratch = await createScratchDatabase('pipe-suggestions');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(40, 5));
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  it('names the 2" segment at 130 gpm (12.4 ft/s) and suggests 3" (5.6 ft/s is still over: 4")', async () => {
    const response = await post({
      units,
      system: {
        staticHead: 6,
        frictionMethod: 'hazen-williams',
        segments: [
          { length: 40, pipe: 'pvc-sch40-4' },
          { length: 80, pipe: 'pvc-sch40-2' },
          { length: 10, insideDiameter: 1.5, hazenWilliamsC: 150 },
        ],
      },
      duty: { flowMin: 90, flowMax: 130 },
    }).expect(200);
    const validate = contractSchemaValidator('SelectionResponse');
    expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
    const body = response.body as SelectionResponse;
    // 4" (bore 4.026 in) carries 130 gpm at 3.3 ft/s: fine; the custom 1.5" bore has no series to suggest from
    expect(ftPerSecond(130, 4.026)).to.be.lessThan(5);
    expect(body.pipeSizeSuggestions.map((entry) => entry.segment)).to.deep.equal(['/body/system/segments/1']);
    const [two] = body.pipeSizeSuggestions;
    expect(two.velocity).to.be.closeTo(ftPerSecond(130, 2.067), 0.01);
    // 3" (3.068 in) runs 5.64 ft/s at 130 gpm, over the limit; 4" is the smallest under it
    expect(ftPerSecond(130, 3.068)).to.be.greaterThan(5);
    expect(two).to.include({ pipe: 'pvc-sch40-2', suggestedPipe: 'pvc-sch40-4', flow: 130 });
    expect(two.suggestedLabel).to.contain('4"');
  });

  it('judges each branch at its share of the band top, and answers none when every segment is under', async () => {
    const branched = await post({
      units,
      system: {
        frictionMethod: 'hazen-williams',
        segments: [{ length: 10, pipe: 'pvc-sch40-6' }],
        branches: [
          { name: 'falls', staticHead: 1, segments: [{ length: 40, pipe: 'pvc-sch40-1.5' }] },
          { name: 'filter-return', staticHead: 6, segments: [{ length: 20, pipe: 'pvc-sch40-6' }] },
        ],
      },
      duty: { flowMin: 90, flowMax: 130 },
    }).expect(200);
    const suggestions = (branched.body as SelectionResponse).pipeSizeSuggestions;
    expect(suggestions.map((entry) => entry.segment)).to.deep.equal(['/body/system/branches/0/segments/0']);
    // the falls takes less than the total: its flow is its share of 130 gpm
    expect(suggestions[0].flow).to.be.greaterThan(0).and.lessThan(130);
    expect(suggestions[0].velocity).to.be.closeTo(ftPerSecond(suggestions[0].flow, 1.61), 0.01);

    const calm = await post({
      units,
      system: { staticHead: 6, frictionMethod: 'hazen-williams', segments: [{ length: 40, pipe: 'pvc-sch40-4' }] },
      duty: { flowMin: 90, flowMax: 130 },
    }).expect(200);
    expect((calm.body as SelectionResponse).pipeSizeSuggestions).to.deep.equal([]);
  });
});
