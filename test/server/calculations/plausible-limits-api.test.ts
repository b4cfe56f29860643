import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import type { PlausibleLimitName } from '../../../shared/hydraulics';
import { plausibleInputProblem } from '../../../src/app/design/plausible-inputs';
import { unitSystems } from '../../../src/app/design/unit-systems';
import { createUserWithSession } from '../../support/accounts';
import { PLAUSIBLE_LIMIT_CASES } from '../../support/plausible-limit-cases';
import { createScratchDatabase } from '../../support/test-database';

/*
 * Every plausibility limit of the table, in both unit systems of the forms: the client's check
 * and the API refuse a value just outside the limit and accept one just inside it.
 */

type Units = (typeof unitSystems)['us']['units'];

/** A request putting `value` (in `units`) where the limit applies, and the pointer it names. */
function requestFor(
  limit: PlausibleLimitName,
  value: number,
  units: Units,
): { path: string; body: object; pointer: string } {
  const bore = units.diameter === 'in' ? 3 : 76;
  const segment = { length: 50, insideDiameter: bore, hazenWilliamsC: 150 };
  const system = { staticHead: 3, frictionMethod: 'hazen-williams', segments: [segment] };
  const curve = (flow: number, head: number) => ({
    units,
    system,
    pump: {
      curve: [
        { flow: 0, head },
        { flow: flow / 2, head: head * 0.8 },
        { flow, head: head * 0.3 },
      ],
    },
  });
  const systemCurve = (changed: object, flows = [10]) => ({
    path: '/calculations/system-curve',
    body: { units, system: { ...system, ...changed }, flows },
  });
  switch (limit) {
    case 'staticHead':
      return { ...systemCurve({ staticHead: value }), pointer: '/body/system/staticHead' };
    case 'outletPressureHead':
      return { ...systemCurve({ outletPressureHead: value }), pointer: '/body/system/outletPressureHead' };
    case 'segmentLength':
      return {
        ...systemCurve({ segments: [{ ...segment, length: value }] }),
        pointer: '/body/system/segments/0/length',
      };
    case 'insideDiameter':
      return {
        ...systemCurve({ segments: [{ ...segment, insideDiameter: value }] }),
        pointer: '/body/system/segments/0/insideDiameter',
      };
    case 'roughness':
      return {
        ...systemCurve({
          frictionMethod: 'darcy-weisbach',
          segments: [{ length: 50, insideDiameter: bore, roughness: value }],
        }),
        pointer: '/body/system/segments/0/roughness',
      };
    case 'extraK':
      return {
        ...systemCurve({ segments: [{ ...segment, minorLossK: value }] }),
        pointer: '/body/system/segments/0/minorLossK',
      };
    case 'flow':
      return { ...systemCurve({}, [value]), pointer: '/body/flows/0' };
    case 'pumpCurveFlow':
      return { path: '/calculations/operating-point', body: curve(value, 30), pointer: '/body/pump/curve/2/flow' };
    case 'pumpCurveHead':
      return { path: '/calculations/operating-point', body: curve(100, value), pointer: '/body/pump/curve/0/head' };
  }
}

describe('plausibility limits, client and API alike', function () {
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let token: string;

  before(async function () {
    this.timeout(60_000);
    scratch = await createScratchDatabase('plausible-limits');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  async function pointerOfAnswer(limit: PlausibleLimitName, value: number, units: Units) {
    const { path, body, pointer } = requestFor(limit, value, units);
    const response = await request(app).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body);
    const named = response.body.pointer ?? response.body.errors?.[0]?.pointer;
    const detail = response.body.errors?.[0]?.detail as string | undefined;
    return { status: response.status, named, pointer, detail };
  }

  for (const { limit, system, units, side, edge, outside, inside } of PLAUSIBLE_LIMIT_CASES) {
    it(`${limit} ${side} in ${system} units: refused just outside, accepted just inside`, async () => {
      expect(plausibleInputProblem(limit, outside, units), 'client, outside').to.be.a('string');
      expect(plausibleInputProblem(limit, inside, units), 'client, inside').to.equal(null);
      const refused = await pointerOfAnswer(limit, outside, units);
      expect(refused.named, refused.detail).to.equal(refused.pointer);
      // below a floor of zero the contract itself refuses (400); every other limit is the engine's 422
      expect(refused.status, refused.detail).to.equal(edge === 0 && side === 'min' ? 400 : 422);
      if (refused.status === 422) expect(refused.detail).to.equal(plausibleInputProblem(limit, outside, units));
      const accepted = await pointerOfAnswer(limit, inside, units);
      expect(accepted.named, accepted.detail).to.not.equal(accepted.pointer);
    });
  }

  it('states the limit in the units of the request', async () => {
    const us = await pointerOfAnswer('staticHead', 2000, unitSystems.us.units);
    expect(us.detail).to.equal('static head must be at most 1640 ft');
    const si = await pointerOfAnswer('staticHead', 600, unitSystems.si.units);
    expect(si.detail).to.equal('static head must be at most 500 m');
  });
});
