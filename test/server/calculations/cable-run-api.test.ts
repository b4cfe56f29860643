import { expect } from 'chai';
import request from 'supertest';
import type { CableRunResponse, PumpPage } from '../../../shared/api/api-schemas';
import { createApp } from '../../../server/app';
import { snapshotClock, STAMP_REUSE_MS } from '../../../server/catalog/catalog-snapshot';
import { Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { importText, seedDemoCatalog } from '../../data-import/catalog-fixtures';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';

/*
 * The cable run to a pump through the HTTP stack. Drops worked by hand from the tables' figures
 * (from memory: NEC Chapter 9 Table 8 ohm/kft at 75 C; IEC 60228 class 2 ohm/km at 20 C times
 * 1 + 0.00393 x 55 = 1.21615 for 75 C): single phase 2 L I R, three phase sqrt(3) L I R.
 */

const validAnswer = contractSchemaValidator('CableRunResponse');

describe('POST /calculations/cable-run', function () {
  this.timeout(60_000);
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let token: string;

  before(async () => {
    scratch = await createScratchDatabase('cable_run');
    await seedDemoCatalog(scratch.sequelize);
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  const post = (body: object) =>
    request(app).post('/api/v1/calculations/cable-run').set('Authorization', `Bearer ${token}`).send(body);
  const pumpIdOf = async (modelCode: string) =>
    (
      (await request(app).get(`/api/v1/pumps?search=${modelCode}`).set('Authorization', `Bearer ${token}`).expect(200))
        .body as PumpPage
    ).items[0].id;

  it('gives the drop through a named conductor and the smallest of each series under 3 % (by hand)', async () => {
    const response = await post({
      units: { length: 'm' },
      current: 9.5,
      voltage: 230,
      phases: 1,
      length: 45,
      conductor: 'mm2-2.5',
    }).expect(200);
    const answer = response.body as CableRunResponse;
    expect(validAnswer(answer), JSON.stringify(validAnswer.errors)).to.equal(true);
    // 2 x 45 x 9.5 x 7.41e-3 x 1.21615 = 7.705 V = 3.35 % of 230 V: over the 3 % default
    expect(answer.conductor!.volts).to.be.closeTo(7.705, 0.001);
    expect(answer.conductor!.percent).to.be.closeTo(3.35, 0.001);
    expect(answer.conductor!.withinLimit).to.equal(false);
    expect(answer.maxDropPercent).to.equal(3);
    // 12 AWG: 2 x 45 x 9.5 x 1.98 / 304.8 = 5.554 V (2.41 %); 14 AWG 8.81 V. 4 mm2: 4.79 V (2.08 %)
    expect(answer.smallest.awg!.conductor.id).to.equal('awg-12');
    expect(answer.smallest.awg!.volts).to.be.closeTo(5.554, 0.001);
    expect(answer.smallest.metric!.conductor.id).to.equal('mm2-4');
    expect(answer.smallest.metric!.percent).to.be.closeTo(2.084, 0.001);
    expect(answer.caution.code).to.equal('cable-run-electrician-decides');
    expect(answer.caution.text).to.contain('GFCI/RCD').and.contain('licensed electrician').and.contain('local');
  });

  it('takes the length in feet, one way: 16 A at 120 V over 100 ft of 12 AWG drops 6.336 V; under 5 % 10 AWG', async () => {
    const answer = (
      await post({
        units: { length: 'ft' },
        current: 16,
        voltage: 120,
        phases: 1,
        length: 100,
        conductor: 'awg-12',
        maxDropPercent: 5,
      }).expect(200)
    ).body as CableRunResponse;
    // 2 x 100 ft x 16 A x 1.98 ohm/kft = 6.336 V (5.28 %); 10 AWG: 3.968 V (3.31 %)
    expect(answer.conductor!.volts).to.be.closeTo(6.336, 0.0005);
    expect(answer.smallest.awg!.conductor.label).to.equal('10 AWG');
    expect(answer.smallest.awg!.percent).to.be.closeTo(3.307, 0.001);
    expect(answer.units).to.deep.equal({ length: 'ft' });
  });

  it("takes a catalog pump's full-load current, voltage and phases (the demo's three-phase AB-MXF-50)", async () => {
    const pumpId = await pumpIdOf('AB-MXF-50');
    const answer = (await post({ units: { length: 'm' }, pumpId, length: 80, conductor: 'mm2-2.5' }).expect(200))
      .body as CableRunResponse;
    expect(validAnswer(answer), JSON.stringify(validAnswer.errors)).to.equal(true);
    expect([answer.pumpId, answer.current, answer.voltage, answer.phases]).to.deep.equal([pumpId, 11.8, 400, 3]);
    // sqrt(3) x 80 x 11.8 x 9.0117e-3 = 14.735 V = 3.68 % of 400 V
    expect(answer.conductor!.volts).to.be.closeTo(14.735, 0.002);
    expect(answer.smallest.metric!.conductor.id).to.equal('mm2-4');
  });

  it('leaves a series out with a warning when none of its sizes is enough, and answers 422 when neither is', async () => {
    // 100 A at 230 V over 200 m: 4/0 AWG drops 3.47 %; 120 mm2 3.24 %, 150 mm2 2.62 %
    const answer = (
      await post({ units: { length: 'm' }, current: 100, voltage: 230, phases: 1, length: 200 }).expect(200)
    ).body as CableRunResponse;
    expect(answer.smallest.awg).to.equal(null);
    expect(answer.smallest.metric!.conductor.id).to.equal('mm2-150');
    expect(answer.warnings).to.have.length(1);
    expect(answer.warnings[0]).to.contain('no AWG conductor').and.contain('4/0 AWG');
    const refused = await post({ units: { length: 'm' }, current: 100, voltage: 120, phases: 1, length: 2000 }).expect(
      422,
    );
    expect(refused.body.pointer).to.equal('/body/length');
    expect(refused.body.detail).to.contain('300 mm2').and.contain('4/0 AWG');
  });

  it('refuses bad input naming the field: 4xx, never 500', async () => {
    const run = { units: { length: 'm' }, current: 8, voltage: 230, phases: 1, length: 30 };
    const cases: Array<[object, number, string]> = [
      [{ ...run, length: -5 }, 400, '/body/length'],
      [{ ...run, voltage: 0 }, 400, '/body/voltage'],
      [{ ...run, phases: 2 }, 400, '/body/phases'],
      [{ ...run, maxDropPercent: 0 }, 400, '/body/maxDropPercent'],
      [{ ...run, conductor: 'awg-13' }, 422, '/body/conductor'],
      [{ units: { length: 'm' }, current: 8, phases: 1, length: 30 }, 422, '/body/voltage'],
      [{ units: { length: 'm' }, pumpId: 999_999, length: 30 }, 404, '/body/pumpId'],
      [{ ...run, pumpId: 1 }, 422, '/body/current'],
    ];
    for (const [body, status, pointer] of cases) {
      const response = await post(body);
      expect([response.status, response.body.pointer], JSON.stringify(body)).to.deep.equal([status, pointer]);
    }
  });

  it('answers 422 naming pumpId for a catalog pump whose curve table gives no full-load current', async () => {
    const supplier = await Supplier.create({ code: 'CABLELESS', name: 'Cableless Demo Supply' });
    const report = await importText(
      scratch.sequelize,
      supplier,
      [
        'riffle-curve-table,1',
        'flow-unit,m3/h',
        'head-unit,m',
        'model_code,display_name,kind,voltage,phases,flow,head',
        'CL-1,Cableless test pump,submersible,230,1,0,8',
        'CL-1,,,,,4,7',
        'CL-1,,,,,8,4.5',
      ].join('\n'),
    );
    expect(report.errors).to.deep.equal([]);
    const pumpId = await pumpIdOf('CL-1');
    // past the catalog snapshot's stamp reuse, so the new pump is in it
    const realClock = snapshotClock.now;
    snapshotClock.now = () => realClock() + STAMP_REUSE_MS + 50;
    const response = await Promise.resolve(post({ units: { length: 'm' }, pumpId, length: 30 })).finally(
      () => (snapshotClock.now = realClock),
    );
    expect(response.status).to.equal(422);
    expect(response.body.pointer).to.equal('/body/pumpId');
    expect(response.body.detail).to.contain('full-load current');
  });
});
