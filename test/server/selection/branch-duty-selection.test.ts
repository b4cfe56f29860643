import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import type { PipeSystem, SelectionResponse } from '../../../shared/api/api-schemas';
import { branchedSystemInputOf } from '../../../shared/api/system-input';
import {
  branchDutyBand,
  branchFlowsAt,
  compileBranchedSystem,
  flowFromSI,
  flowToSI,
  solveParallelIdentical,
  type PumpCurveFit,
} from '../../../shared/hydraulics';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from './synthetic-catalog';

/*
 * A selection whose duty band is one branch's flow ("the falls must get 60 to 90 gpm whatever
 * the filter return takes"), over 400 invented pumps, checked against putting every pump on
 * the branched system with the engine's own solver and reading the falls' flow there.
 */

const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' } as const;
const pipe = (length: number, minorLossK = 0) => [{ length, insideDiameter: 1.61, hazenWilliamsC: 150, minorLossK }];
const pondSystem = {
  frictionMethod: 'hazen-williams',
  segments: [{ length: 20, insideDiameter: 2.067, hazenWilliamsC: 150 }],
  branches: [
    { name: 'falls', staticHead: 9, segments: pipe(60, 2) },
    { name: 'filter-return', staticHead: 1, segments: pipe(30, 8) },
  ],
} satisfies PipeSystem;
const duty = { flowMin: 60, flowMax: 90, branch: 'falls' };
const search = { units, system: pondSystem, duty, arrangements: [1, 2], limit: 200 };

describe('POST /api/v1/selections with a duty band on one branch', function () {
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
    scratch = await createScratchDatabase('branch-duty');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(400, 11));
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  it('ranks on the total flows that keep the falls in its band, as every pump put on the system says', async () => {
    const body = (await post(search).expect(200)).body as SelectionResponse;
    const system = compileBranchedSystem(branchedSystemInputOf(pondSystem, units)!);
    const band = branchDutyBand(system, 'falls', flowToSI(60, 'gpm'), flowToSI(90, 'gpm'));
    expect(body.totalFlowBand!.flowMin).to.be.closeTo(flowFromSI(band.totalFlowMin, 'gpm'), 1e-9);
    expect(body.totalFlowBand!.flowMax).to.be.closeTo(flowFromSI(band.totalFlowMax, 'gpm'), 1e-9);
    // The filter return takes its share on top: the total band lies above the falls' own.
    expect(body.totalFlowBand!.flowMin).to.be.greaterThan(60);

    const rows = await scratch.sequelize.query<{ fit: string | PumpCurveFit }>(
      'SELECT r.fit FROM pumps p JOIN curve_revisions r ON r.id = p.current_revision_id',
      { type: QueryTypes.SELECT },
    );
    let fallsInBand = 0;
    for (const row of rows) {
      const fit = (typeof row.fit === 'string' ? JSON.parse(row.fit) : row.fit) as PumpCurveFit;
      for (const running of [1, 2]) {
        const point = solveParallelIdentical(fit, system, running, running);
        if (!point.ok) continue;
        const falls = flowFromSI(branchFlowsAt(system, point.totalFlow).branches[0].flow, 'gpm');
        if (falls >= 60 && falls <= 90) fallsInBand += 1;
      }
    }
    expect(fallsInBand, 'the synthetic catalog should put some pumps in this band').to.be.greaterThan(5);
    expect(body.inBand).to.equal(fallsInBand);
    expect(body.considered).to.equal(rows.length * 2);

    const inBand = body.candidates.filter((candidate) => candidate.inBand);
    expect(inBand.length).to.equal(Math.min(fallsInBand, 200));
    for (const candidate of body.candidates) {
      const branches = candidate.operatingPoint.branches!;
      expect(branches.map((branch) => branch.name)).to.deep.equal(['falls', 'filter-return']);
      expect(branches[0].flow + branches[1].flow).to.be.closeTo(candidate.operatingPoint.flow, 1e-6);
      const fallsFlow = branches[0].flow;
      expect(fallsFlow >= 60 - 1e-6 && fallsFlow <= 90 + 1e-6, `${candidate.model}: falls ${fallsFlow} gpm`).to.equal(
        candidate.inBand,
      );
    }
  });

  it('answers without totalFlowBand when the band is the total', async () => {
    const body = (await post({ ...search, duty: { flowMin: 120, flowMax: 180 } }).expect(200))
      .body as SelectionResponse;
    expect(body.totalFlowBand).to.equal(undefined);
    for (const candidate of body.candidates.filter((one) => one.inBand))
      expect(candidate.operatingPoint.flow).to.be.within(120 - 1e-6, 180 + 1e-6);
  });

  const singleRoute = { staticHead: 5, frictionMethod: 'hazen-williams', segments: pipe(50) };
  const badDuties: Array<[string, unknown, string]> = [
    ['a branch the system does not have', { ...search, duty: { ...duty, branch: 'stream' } }, '/body/duty/branch'],
    ['a branch on a system without branches', { ...search, system: singleRoute }, '/body/duty/branch'],
  ];
  for (const [name, body, pointer] of badDuties) {
    it(`answers 422 naming ${pointer} for ${name}`, async () => {
      const response = await post(body).expect(422);
      expect(response.type).to.equal('application/problem+json');
      expect(response.body.errors[0].pointer).to.equal(pointer);
    });
  }

  it('names the branches there are when the duty names another', async () => {
    const response = await post({ ...search, duty: { ...duty, branch: 'stream' } }).expect(422);
    expect(response.body.errors[0].detail).to.equal(
      "no branch is named 'stream'; the branches are falls, filter-return",
    );
  });
});
