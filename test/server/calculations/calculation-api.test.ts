import { expect } from 'chai';
import { Ajv2020 } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import request from 'supertest';
import type { OpenAPIV3_1 } from 'openapi-types';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createApiToken, createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import {
  DIAMETER_UNITS,
  FITTING_KINDS,
  FLOW_UNITS,
  HEAD_UNITS,
  LENGTH_UNITS,
  PIPE_MATERIALS,
  fitPumpCurve,
  flowToSI,
  headFromSI,
  headToSI,
  polynomialValue,
  waterDensity,
  waterKinematicViscosity,
} from '../../../shared/hydraulics';

/*
 * The engine-only calculations through the whole HTTP stack. Independent figures:
 * - the practitioner's figure, common practice: 100 gpm through 240 ft of 3.000 in pipe, C = 150,
 *   14.5 ft static -> about 20.15 ft TDH;
 * - the US form of Hazen-Williams, h_f = 10.44 L Q^1.85 / (C^1.85 d^4.8655) (ft, gpm, in), worked
 *   here by hand; the engine uses the SI form, which differs by up to ~0.6 %;
 * - velocity V = Q / A from the definitions of the US gallon (231 in3) and the foot;
 * - Crane TP-410 A-26/A-29: K = n f_T, f_T = 0.25 / log10(0.0018 in / (3.7 d))^2;
 * - ASTM D1785 Table 1: 3" Schedule 40 has OD 3.500 in and minimum wall 0.216 in;
 * - ISO 4427-2: 50 mm PE100 SDR 11 has a 4.6 mm wall; Crane TP-410 A-26 for a sudden contraction;
 * - water density and viscosity at 20 C of the engine (python3-iapws in test/shared), 1 psi = 6894.757 Pa.
 */

describe('calculations API', function () {
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let designerToken: string;

  before(async function () {
    this.timeout(60_000);
    scratch = await createScratchDatabase('calculations');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    designerToken = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  const usUnits = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
  const practitionerSystem = {
    staticHead: 14.5,
    frictionMethod: 'hazen-williams',
    segments: [{ length: 240, insideDiameter: 3.0, hazenWilliamsC: 150 }],
  };
  /** The example pump's published points lie on H = 40 - 0.03125 Q - 0.00078125 Q^2 (ft, gpm), solved by hand from three of them. */
  const examplePumpHead = (flow: number) => 40 - 0.03125 * flow - 0.00078125 * flow * flow;
  const exampleCurve = [0, 40, 80, 120, 160].map((flow, index) => ({
    flow,
    head: examplePumpHead(flow),
    efficiency: [0, 42, 60, 63, 50][index],
  }));

  function hazenWilliamsUsFeet(lengthFt: number, flowGpm: number, diameterIn: number, c: number): number {
    return (10.44 * lengthFt * Math.pow(flowGpm, 1.85)) / (Math.pow(c, 1.85) * Math.pow(diameterIn, 4.8655));
  }

  /** Bisection on a decreasing difference, for figures the test works out itself. */
  function bisect(difference: (x: number) => number, lo: number, hi: number): number {
    for (let step = 0; step < 200; step++) {
      const mid = (lo + hi) / 2;
      if (difference(mid) > 0) lo = mid;
      else hi = mid;
    }
    return (lo + hi) / 2;
  }

  function operation(path: string, method: 'get' | 'post'): OpenAPIV3_1.OperationObject {
    return (openApiDocument.paths?.[path] as OpenAPIV3_1.PathItemObject)[method] as OpenAPIV3_1.OperationObject;
  }

  function requestExample(path: string, name = 'single-route'): Record<string, unknown> {
    const media = (operation(path, 'post').requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'];
    return (media.examples?.[name] as OpenAPIV3_1.ExampleObject).value as Record<string, unknown>;
  }

  function responseValidator(path: string, method: 'get' | 'post') {
    const ajv = new Ajv2020({ allErrors: true, strict: true, strictRequired: false, allowUnionTypes: true });
    ajv.addVocabulary(['example', 'xml', 'externalDocs', 'discriminator', 'components']);
    addFormats.default(ajv);
    ajv.addSchema({ $id: 'contract.json', components: openApiDocument.components });
    const schema = (
      (operation(path, method).responses?.['200'] as OpenAPIV3_1.ResponseObject).content?.[
        'application/json'
      ] as OpenAPIV3_1.MediaTypeObject
    ).schema;
    return ajv.compile(
      JSON.parse(JSON.stringify(schema), (key, value) =>
        key === '$ref' && String(value).startsWith('#/') ? `contract.json${value}` : value,
      ),
    );
  }

  function post(path: string, body: unknown, token = designerToken) {
    return request(app)
      .post(`/api/v1${path}`)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);
  }

  function get(path: string, token = designerToken) {
    return request(app).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`);
  }

  describe('the calculation contract', () => {
    it('accepts exactly the units, fittings and materials the engine knows', () => {
      const schemas = openApiDocument.components?.schemas as Record<
        string,
        { enum?: string[]; properties?: Record<string, { enum?: string[] }> }
      >;
      expect(schemas.FlowUnit.enum).to.deep.equal([...FLOW_UNITS]);
      expect(schemas.HeadUnit.enum).to.deep.equal([...HEAD_UNITS]);
      expect(schemas.LengthUnit.enum).to.deep.equal([...LENGTH_UNITS]);
      expect(schemas.DiameterUnit.enum).to.deep.equal([...DIAMETER_UNITS]);
      expect(schemas.FittingCount.properties?.kind.enum).to.deep.equal([...FITTING_KINDS]);
      expect(schemas.PipeSegment.properties?.material.enum).to.deep.equal([...PIPE_MATERIALS]);
    });
  });

  describe('POST /api/v1/calculations/system-curve', () => {
    it('answers the worked example with the practitioner figure of about 20.15 ft TDH at 100 gpm', async () => {
      const response = await post('/calculations/system-curve', requestExample('/calculations/system-curve')).expect(
        200,
      );
      const validate = responseValidator('/calculations/system-curve', 'post');
      expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
      const at100 = response.body.points.find((point: { flow: number }) => point.flow === 100);
      // practitioner's figure (common practice): about 20.15 ft
      expect(at100.head).to.be.closeTo(20.15, 20.15 * 0.005);
      // US form worked by hand; the forms part by up to ~0.6 %
      const usForm = 14.5 + hazenWilliamsUsFeet(240, 100, 3.0, 150);
      expect(at100.head).to.be.closeTo(usForm, usForm * 0.007);
      expect(at100.staticHead).to.equal(14.5);
      expect(at100.frictionHead + at100.staticHead + at100.minorHead).to.be.closeTo(at100.head, 1e-9);
      // 100 gpm = 100 * 231 in3/min; area pi/4 * 3^2 in2 -> ft/s
      const velocity = (100 * 231) / 60 / ((Math.PI / 4) * 9) / 12;
      expect(at100.velocities[0]).to.be.closeTo(velocity, 1e-9);
      expect(response.body.points[0].head).to.equal(14.5);
    });

    it('warns only at flows whose velocity passes 5 ft/s (common practice for plastic pipe)', async () => {
      const response = await post('/calculations/system-curve', {
        units: usUnits,
        system: practitionerSystem,
        flows: [100, 150],
      }).expect(200);
      expect(response.body.warnings).to.have.length(1);
      expect(response.body.warnings[0]).to.contain('at 150 gpm').and.contain('5 ft/s');
    });

    it('gives the same head in SI units for the same system', async () => {
      const si = {
        units: { flow: 'L/s', head: 'm', length: 'm', diameter: 'mm' },
        system: {
          staticHead: 14.5 * 0.3048,
          frictionMethod: 'hazen-williams',
          segments: [{ length: 240 * 0.3048, insideDiameter: 76.2, hazenWilliamsC: 150 }],
        },
        flows: [(100 * 3.785411784) / 60],
      };
      const us = await post('/calculations/system-curve', {
        units: usUnits,
        system: practitionerSystem,
        flows: [100],
      }).expect(200);
      const metric = await post('/calculations/system-curve', si).expect(200);
      expect(metric.body.points[0].head).to.be.closeTo(us.body.points[0].head * 0.3048, 1e-9);
      expect(metric.body.units).to.include({ flow: 'L/s', head: 'm' });
    });

    it('adds fitting losses K V^2 / 2g with Crane K = 30 f_T for two standard elbows', async () => {
      const bore = 3.068;
      const system = {
        staticHead: 0,
        frictionMethod: 'hazen-williams',
        segments: [{ length: 10, pipe: 'pvc-sch40-3', fittings: [{ kind: 'elbow-90-standard', count: 2 }] }],
      };
      const response = await post('/calculations/system-curve', { units: usUnits, system, flows: [100] }).expect(200);
      const frictionFactor = 0.25 / Math.pow(Math.log10(0.0018 / (3.7 * bore)), 2);
      const velocity = (100 * 231) / 60 / ((Math.PI / 4) * bore * bore) / 12;
      const expected = (2 * 30 * frictionFactor * velocity * velocity) / (2 * 32.174049);
      expect(response.body.points[0].minorHead).to.be.closeTo(expected, expected * 1e-6);
    });

    it('uses Darcy-Weisbach when asked and lands near Hazen-Williams C = 150 for smooth plastic', async () => {
      const system = {
        ...practitionerSystem,
        frictionMethod: 'darcy-weisbach',
        segments: [{ length: 240, insideDiameter: 3.0, roughness: 0.0000591 }],
      };
      const response = await post('/calculations/system-curve', { units: usUnits, system, flows: [100] }).expect(200);
      // Two different friction laws for the same smooth pipe: agreement within 15 % is what texts show at this Reynolds number.
      expect(response.body.points[0].frictionHead).to.be.closeTo(5.61, 5.61 * 0.15);
    });
  });

  describe('equipment, pressure units, L/h and the per-segment breakdown', () => {
    const metricUnits = { flow: 'L/h', head: 'm', length: 'm', diameter: 'mm' } as const;
    const pondSystem = (equipment: unknown[], extra: Record<string, unknown> = {}) => ({
      staticHead: 1.5,
      frictionMethod: 'darcy-weisbach',
      waterTemperatureC: 20,
      segments: [{ length: 12, pipe: 'pe100-sdr11-50', equipment }],
      ...extra,
    });

    it('scales each equipment loss as (Q / Q_rated)^2, in head or pressure units, and lists it per flow', async () => {
      const system = pondSystem([
        { name: 'pressure filter', headLoss: 0.2, headLossUnit: 'bar', atFlow: 10000 },
        { name: 'UV clarifier', headLoss: 0.4, atFlow: 8000 },
      ]);
      const response = await post('/calculations/system-curve', {
        units: metricUnits,
        system,
        flows: [0, 12000],
      }).expect(200);
      const validate = responseValidator('/calculations/system-curve', 'post');
      expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
      const point = response.body.points[1];
      // 0.2 bar of water at 20 C (density 998.206 kg/m3, python3-iapws): 2e4 / (998.206 x 9.80665) m
      const filterAtRating = 2e4 / (waterDensity(20) * 9.80665);
      const filter = filterAtRating * (12000 / 10000) ** 2;
      const uv = 0.4 * (12000 / 8000) ** 2;
      expect(point.equipment).to.have.length(2);
      expect(point.equipment[0]).to.deep.include({ segment: 0, name: 'pressure filter' });
      expect(point.equipment[0].headLoss).to.be.closeTo(filter, 1e-9);
      expect(point.equipment[1].headLoss).to.be.closeTo(uv, 1e-9);
      expect(point.equipmentHead).to.be.closeTo(filter + uv, 1e-9);
      expect(point.staticHead + point.frictionHead + point.minorHead + point.equipmentHead).to.be.closeTo(
        point.head,
        1e-9,
      );
      expect(response.body.points[0].equipmentHead).to.equal(0);
      // 12000 L/h in a 50 mm SDR 11 bore (50 - 2 x 4.6 = 40.8 mm), nu at 20 C
      const velocity = 12 / 3600 / ((Math.PI / 4) * 0.0408 ** 2);
      expect(point.reynoldsNumbers[0]).to.be.closeTo((velocity * 0.0408) / waterKinematicViscosity(20), 1e-6);
    });

    it('takes the outlet pressure in psi, kPa or bar as head of water', async () => {
      const answer = async (outletPressureHead: number, outletPressureUnit?: string) =>
        (
          await post('/calculations/system-curve', {
            units: metricUnits,
            system: pondSystem([], { outletPressureHead, ...(outletPressureUnit ? { outletPressureUnit } : {}) }),
            flows: [0],
          }).expect(200)
        ).body.points[0];
      const density = waterDensity(20);
      expect((await answer(10, 'psi')).outletPressureHead).to.be.closeTo(68947.57 / (density * 9.80665), 1e-6);
      expect((await answer(50, 'kPa')).outletPressureHead).to.be.closeTo(5e4 / (density * 9.80665), 1e-9);
      expect((await answer(0.5, 'bar')).head).to.be.closeTo(1.5 + 5e4 / (density * 9.80665), 1e-9);
      expect((await answer(3)).outletPressureHead).to.equal(3);
    });

    it('warns of transitional flow by segment', async () => {
      const response = await post('/calculations/system-curve', {
        units: metricUnits,
        system: { staticHead: 0, frictionMethod: 'darcy-weisbach', segments: [{ length: 5, pipe: 'pvc-sch40-1' }] },
        flows: [200],
      }).expect(200);
      expect(response.body.points[0].reynoldsNumbers[0]).to.be.within(2300, 4000);
      expect(response.body.warnings.join(' ')).to.contain('segment 0').and.contain('transition band 2300-4000');
    });

    it('lists the new fittings; a reducer takes its K from its diameter ratio', async () => {
      const fittings = (await get('/fittings').expect(200)).body.fittings as { kind: string; method: string }[];
      expect(fittings.find((fitting) => fitting.kind === 'reducer')).to.deep.include({ method: 'diameter-ratio' });
      expect(fittings.map((fitting) => fitting.kind)).to.include.members(['union', 'bulkhead', 'check-valve-spring']);
      const withReducer = await post('/calculations/system-curve', {
        units: metricUnits,
        system: pondSystem([], {
          segments: [
            { length: 12, pipe: 'pe100-sdr11-50', fittings: [{ kind: 'reducer', count: 1, diameterRatio: 0.5 }] },
          ],
        }),
        flows: [12000],
      }).expect(200);
      const velocity = 12 / 3600 / ((Math.PI / 4) * 0.0408 ** 2);
      // sudden contraction, Crane A-26: K = 0.5 (1 - 0.5^2) = 0.375
      expect(withReducer.body.points[0].minorHead).to.be.closeTo((0.375 * velocity ** 2) / (2 * 9.80665), 1e-9);
    });
  });

  describe('POST /api/v1/calculations/operating-point', () => {
    it('answers the worked example where the hand-solved curves cross', async () => {
      const response = await post(
        '/calculations/operating-point',
        requestExample('/calculations/operating-point'),
      ).expect(200);
      const validate = responseValidator('/calculations/operating-point', 'post');
      expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
      const expectedFlow = bisect(
        (flow) => examplePumpHead(flow) - 14.5 - hazenWilliamsUsFeet(240, flow, 3.0, 150),
        0,
        160,
      );
      const point = response.body.operatingPoint;
      expect(point.flow).to.be.closeTo(expectedFlow, expectedFlow * 0.005);
      expect(point.head).to.be.closeTo(examplePumpHead(point.flow), 1e-6);
      expect(point.flowPerPump).to.equal(point.flow);
      expect(response.body.oneFailed).to.equal(null);
      expect(response.body.fit.shutOffHead).to.be.closeTo(40, 1e-6);
    });

    it('adds flows at equal head for two pumps in parallel, and with one failed falls back to one pump', async () => {
      const single = await post('/calculations/operating-point', {
        units: usUnits,
        system: practitionerSystem,
        pump: { curve: exampleCurve },
      }).expect(200);
      const pair = await post('/calculations/operating-point', {
        units: usUnits,
        system: practitionerSystem,
        pump: { curve: exampleCurve },
        arrangement: { installed: 2, running: 2 },
      }).expect(200);
      const point = pair.body.operatingPoint;
      expect(point.flowPerPump).to.be.closeTo(point.flow / 2, 1e-9);
      expect(point.head).to.be.closeTo(examplePumpHead(point.flowPerPump), 1e-6);
      const expectedFlow = bisect(
        (flow) => examplePumpHead(flow / 2) - 14.5 - hazenWilliamsUsFeet(240, flow, 3.0, 150),
        0,
        320,
      );
      expect(point.flow).to.be.closeTo(expectedFlow, expectedFlow * 0.005);
      expect(point.flow).to.be.greaterThan(single.body.operatingPoint.flow);
      expect(point.flow).to.be.lessThan(2 * single.body.operatingPoint.flow);
      expect(pair.body.oneFailed.flow).to.be.closeTo(single.body.operatingPoint.flow, 1e-6);
      expect(point.inputPower).to.be.greaterThan(single.body.operatingPoint.inputPower);
    });

    it('reports input power from efficiency: water power rho g Q H / eta', async () => {
      const response = await post('/calculations/operating-point', {
        units: { ...usUnits, power: 'W' },
        system: practitionerSystem,
        pump: { curve: exampleCurve },
      }).expect(200);
      const point = response.body.operatingPoint;
      // P = rho g Q H / eta with rho = 998.21 kg/m3 at 20 C (IAPWS-95), g = 9.80665 m/s2, 1 gal = 3.785411784 L
      const waterPower = 998.21 * 9.80665 * ((point.flow * 3.785411784e-3) / 60) * point.head * 0.3048;
      expect(point.inputPower).to.be.closeTo(waterPower / (point.efficiency / 100), waterPower * 1e-4);
    });

    it('answers 422 with the reason when the pump cannot reach the static head', async () => {
      const response = await post('/calculations/operating-point', {
        units: usUnits,
        system: { ...practitionerSystem, staticHead: 45 },
        pump: { curve: exampleCurve },
      }).expect(422);
      expect(response.type).to.equal('application/problem+json');
      expect(response.body).to.include({ reason: 'below-static-head', pointer: '/body/pump' });
      expect(response.body.detail).to.contain('shut-off head');
    });

    it('answers 422 with run-out when the system needs less head than the curve gives at its end', async () => {
      const response = await post('/calculations/operating-point', {
        units: usUnits,
        system: {
          ...practitionerSystem,
          staticHead: 0,
          segments: [{ length: 10, insideDiameter: 6, hazenWilliamsC: 150 }],
        },
        pump: { curve: exampleCurve },
      }).expect(422);
      expect(response.body.reason).to.equal('beyond-curve');
    });
  });

  describe('POST /api/v1/calculations/operating-point with curves as the trade publishes them', () => {
    /** An invented pond-pump sheet (gph, ft) whose last point is its open flow at 0 ft. */
    const pondSheet = [
      { flow: 0, head: 12 },
      { flow: 1000, head: 11.2 },
      { flow: 2000, head: 9.8 },
      { flow: 3000, head: 7.6 },
      { flow: 4000, head: 4.4 },
      { flow: 4800, head: 0 },
    ];
    const pondUnits = { flow: 'gph', head: 'ft', length: 'ft', diameter: 'in' } as const;
    const lowLift = {
      staticHead: 1.5,
      frictionMethod: 'hazen-williams',
      segments: [{ length: 10, insideDiameter: 2, hazenWilliamsC: 150 }],
    };
    /** System head by the US form of Hazen-Williams (ft, gpm, in), with flows in gph. */
    const lowLiftHead = (gph: number) => 1.5 + hazenWilliamsUsFeet(10, gph / 60, 2, 150);

    /** Brute force: the first sign change of pump minus system head on a 0.01 gph grid. */
    function bruteForceCrossing(pumpHead: (gph: number) => number, lastFlow: number): number {
      for (let gph = 0; gph <= lastFlow; gph += 0.01) {
        if (pumpHead(gph) - lowLiftHead(gph) <= 0) return gph;
      }
      return Number.NaN;
    }

    it('crosses a low-lift system on a curve ending at its open-flow point, where the fit says', async () => {
      const response = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: pondSheet },
      });
      expect(response.status, JSON.stringify(response.body)).to.equal(200);
      const validate = responseValidator('/calculations/operating-point', 'post');
      expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
      expect(response.body.fit.curveBasis).to.equal('published');
      expect(response.body.fit.flowMax).to.be.closeTo(4800, 1e-9);
      const fit = fitPumpCurve(
        pondSheet.map((point) => ({ flow: flowToSI(point.flow, 'gph'), head: headToSI(point.head, 'ft') })),
      );
      const fittedHead = (gph: number) => headFromSI(polynomialValue(fit.headCoefficients, flowToSI(gph, 'gph')), 'ft');
      const expected = bruteForceCrossing(fittedHead, 4800);
      const point = response.body.operatingPoint;
      expect(point.flow).to.be.within(0, 4800);
      // the engine's SI Hazen-Williams differs from the US form by up to ~0.6 % of the friction head
      expect(point.flow).to.be.closeTo(expected, 10);
      expect(point.flow).to.be.within(4200, 4600);
      // without the open-flow point the same system runs the pump out past its last point
      const truncated = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: pondSheet.slice(0, 5) },
      }).expect(422);
      expect(truncated.body.reason).to.equal('beyond-curve');
    });

    it('answers a two-point sheet on the stated shape, marked estimated, without BEP or efficiency', async () => {
      const response = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: [pondSheet[0], pondSheet[5]] },
      });
      expect(response.status, JSON.stringify(response.body)).to.equal(200);
      const validate = responseValidator('/calculations/operating-point', 'post');
      expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
      expect(response.body.fit.curveBasis).to.equal('estimated-from-two-points');
      expect(response.body.fit.bep).to.equal(null);
      expect(response.body.fit.warnings.join(' ')).to.contain('estimated curve');
      expect(response.body.operatingPoint.efficiency).to.equal(null);
      // H = H0 (1 - (Q/Qmax)^2), solved here by brute force against the hand system curve
      const expected = bruteForceCrossing((gph) => 12 * (1 - (gph / 4800) ** 2), 4800);
      expect(response.body.operatingPoint.flow).to.be.closeTo(expected, 10);
    });

    it('uses a drooping curve from its peak on and sorts points typed from the largest flow down, saying so', async () => {
      const drooping = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: [{ flow: 0, head: 11 }, ...pondSheet.slice(1)] },
      });
      expect(drooping.status, JSON.stringify(drooping.body)).to.equal(200);
      expect(drooping.body.fit.flowMin).to.be.closeTo(1000, 1e-9);
      expect(drooping.body.fit.warnings.join(' ')).to.contain('head rises to 11.2 ft at 1000 gph before it falls');
      const reversed = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: [...pondSheet].reverse() },
      });
      expect(reversed.status, JSON.stringify(reversed.body)).to.equal(200);
      expect(reversed.body.fit.warnings.join(' ')).to.contain('largest flow down');
      const forward = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: pondSheet },
      });
      expect(reversed.body.operatingPoint.flow).to.be.closeTo(forward.body.operatingPoint.flow, 1e-9);
    });

    it('refuses efficiencies typed as fractions under percent, naming the point, with a hint', async () => {
      const efficiencies = [0, 0.38, 0.52, 0.58, 0.45, 0];
      const response = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: pondSheet.map((point, index) => ({ ...point, efficiency: efficiencies[index] })) },
      }).expect(422);
      expect(response.type).to.equal('application/problem+json');
      expect(response.body.errors[0]).to.deep.equal({
        pointer: '/body/pump/curve/3/efficiency',
        detail: 'efficiency looks like a fraction: the highest is 0.58 %; did you mean 58 %?',
      });
    });

    it("speaks of a refused curve's flows in the request's units", async () => {
      const response = await post('/calculations/operating-point', {
        units: pondUnits,
        system: lowLift,
        pump: { curve: [pondSheet[0], pondSheet[2], pondSheet[1], pondSheet[3]] },
      }).expect(422);
      expect(response.body.errors[0]).to.deep.equal({
        pointer: '/body/pump/curve/2/flow',
        detail: 'flows must be strictly increasing: 1000 gph follows 2000 gph',
      });
    });
  });

  describe('GET /api/v1/pipe-sizes and /api/v1/fittings', () => {
    it('lists 3" Schedule 40 PVC with the ASTM D1785 bore, in inches or millimetres', async () => {
      const inches = await get('/pipe-sizes').expect(200);
      const validate = responseValidator('/pipe-sizes', 'get');
      expect(validate(inches.body), JSON.stringify(validate.errors)).to.equal(true);
      const sizeIn = (body: { series: Array<{ sizes: Array<{ id: string; insideDiameter: number }> }> }) =>
        body.series.flatMap((series) => series.sizes).find((size) => size.id === 'pvc-sch40-3');
      expect(sizeIn(inches.body)?.insideDiameter).to.be.closeTo(3.5 - 2 * 0.216, 1e-9);
      const millimetres = await get('/pipe-sizes?diameter=mm').expect(200);
      expect(sizeIn(millimetres.body)?.insideDiameter).to.be.closeTo((3.5 - 2 * 0.216) * 25.4, 1e-9);
    });

    it('refuses an unknown diameter unit naming the query field', async () => {
      const response = await get('/pipe-sizes?diameter=cubit').expect(400);
      expect(response.body.pointer).to.equal('/query/diameter');
    });

    it('gives each Crane fitting its K for a bore: 30 f_T for a standard elbow in 3.068 in', async () => {
      const response = await get('/fittings?insideDiameter=3.068&diameter=in').expect(200);
      const validate = responseValidator('/fittings', 'get');
      expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
      const elbow = response.body.fittings.find((fitting: { kind: string }) => fitting.kind === 'elbow-90-standard');
      expect(elbow.k).to.be.closeTo(30 * (0.25 / Math.pow(Math.log10(0.0018 / (3.7 * 3.068)), 2)), 1e-9);
      const exit = response.body.fittings.find((fitting: { kind: string }) => fitting.kind === 'exit');
      expect(exit).to.include({ method: 'fixed', k: 1 });
      const bare = await get('/fittings').expect(200);
      expect(
        bare.body.fittings.find((fitting: { kind: string }) => fitting.kind === 'elbow-90-standard'),
      ).to.not.have.property('k');
    });
  });

  describe('who may calculate', () => {
    const body = { units: usUnits, system: practitionerSystem, flows: [100] };

    it('asks for a token', async () => {
      const response = await request(app).post('/api/v1/calculations/system-curve').send(body).expect(401);
      expect(response.type).to.equal('application/problem+json');
      await request(app).get('/api/v1/pipe-sizes').expect(401);
    });

    it('lets a supplier-admin read the catalogues but not run calculations', async () => {
      const supplier = await Supplier.create({ code: 'CALC-TEST', name: 'Calculation Test Supplier (invented)' });
      const { token } = await createUserWithSession(scratch.sequelize, 'supplier-admin', { supplierId: supplier.id });
      await get('/pipe-sizes', token).expect(200);
      await get('/fittings', token).expect(200);
      await post('/calculations/system-curve', body, token).expect(403);
    });

    it('gives API tokens what their scopes allow', async () => {
      const { user } = await createUserWithSession(scratch.sequelize, 'integrator');
      const reader = await createApiToken(scratch.sequelize, user.id, ['catalog:read']);
      const runner = await createApiToken(scratch.sequelize, user.id, ['calculations:run']);
      await get('/pipe-sizes', reader).expect(200);
      await post('/calculations/system-curve', body, reader).expect(403);
      await post('/calculations/system-curve', body, runner).expect(200);
      await get('/fittings', runner).expect(200);
    });
  });

  describe('bad calculation input', () => {
    const curveRequest = (system: unknown, extra: Record<string, unknown> = {}) => ({
      units: usUnits,
      system,
      flows: [100],
      ...extra,
    });
    const segment = practitionerSystem.segments[0];
    const cases: Array<{ name: string; path: string; body: unknown; status: number; pointer: string }> = [
      {
        name: 'a negative length',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [{ ...segment, length: -5 }] }),
        status: 400,
        pointer: '/body/system/segments/0/length',
      },
      {
        name: 'a zero length',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [{ ...segment, length: 0 }] }),
        status: 400,
        pointer: '/body/system/segments/0/length',
      },
      {
        name: 'equipment with zero rated flow',
        path: '/calculations/system-curve',
        body: curveRequest({
          ...practitionerSystem,
          segments: [{ ...segment, equipment: [{ name: 'skimmer', headLoss: 1, atFlow: 0 }] }],
        }),
        status: 422,
        pointer: '/body/system/segments/0/equipment/0/atFlow',
      },
      {
        name: 'an equipment name with a control character',
        path: '/calculations/system-curve',
        body: curveRequest({
          ...practitionerSystem,
          segments: [{ ...segment, equipment: [{ name: 'filter\u0007', headLoss: 1, atFlow: 50 }] }],
        }),
        status: 422,
        pointer: '/body/system/segments/0/equipment/0/name',
      },
      {
        name: 'a reducer without its diameter ratio',
        path: '/calculations/system-curve',
        body: curveRequest({
          ...practitionerSystem,
          segments: [{ ...segment, fittings: [{ kind: 'reducer', count: 1 }] }],
        }),
        status: 422,
        pointer: '/body/system/segments/0/fittings/0/diameterRatio',
      },
      {
        name: 'an unknown outlet pressure unit',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, outletPressureHead: 1, outletPressureUnit: 'atm' }),
        status: 400,
        pointer: '/body/system/outletPressureUnit',
      },
      {
        name: 'an unknown flow unit',
        path: '/calculations/system-curve',
        body: { ...curveRequest(practitionerSystem), units: { ...usUnits, flow: 'barrels/day' } },
        status: 400,
        pointer: '/body/units/flow',
      },
      {
        name: 'an unknown fitting',
        path: '/calculations/system-curve',
        body: curveRequest({
          ...practitionerSystem,
          segments: [{ ...segment, fittings: [{ kind: 'elbow-89', count: 1 }] }],
        }),
        status: 400,
        pointer: '/body/system/segments/0/fittings/0/kind',
      },
      {
        name: 'empty segments',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [] }),
        status: 400,
        pointer: '/body/system/segments',
      },
      {
        name: 'an absurd bore',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [{ ...segment, insideDiameter: 300 }] }),
        status: 422,
        pointer: '/body/system/segments/0/insideDiameter',
      },
      {
        name: 'an absurd length',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [{ ...segment, length: 2e6 }] }),
        status: 422,
        pointer: '/body/system/segments/0/length',
      },
      {
        name: 'an absurd flow',
        path: '/calculations/system-curve',
        body: curveRequest(practitionerSystem, { flows: [1e7] }),
        status: 422,
        pointer: '/body/flows/0',
      },
      {
        name: 'an unknown pipe size',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [{ length: 10, pipe: 'pvc-sch40-7' }] }),
        status: 422,
        pointer: '/body/system/segments/0/pipe',
      },
      {
        name: 'both a pipe size and a bore',
        path: '/calculations/system-curve',
        body: curveRequest({
          ...practitionerSystem,
          segments: [{ length: 10, pipe: 'pvc-sch40-3', insideDiameter: 3 }],
        }),
        status: 422,
        pointer: '/body/system/segments/0/insideDiameter',
      },
      {
        name: 'no C for Hazen-Williams',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, segments: [{ length: 10, insideDiameter: 3 }] }),
        status: 422,
        pointer: '/body/system/segments/0/hazenWilliamsC',
      },
      {
        name: 'water too hot',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, waterTemperatureC: 80 }),
        status: 400,
        pointer: '/body/system/waterTemperatureC',
      },
      {
        name: 'a field the contract does not know',
        path: '/calculations/system-curve',
        body: curveRequest({ ...practitionerSystem, pumpColour: 'green' }),
        status: 400,
        pointer: '/body/system/pumpColour',
      },
      {
        name: 'a rising pump curve',
        path: '/calculations/operating-point',
        body: {
          units: usUnits,
          system: practitionerSystem,
          pump: {
            curve: [
              { flow: 0, head: 40 },
              { flow: 50, head: 30 },
              { flow: 100, head: 35 },
            ],
          },
        },
        status: 422,
        pointer: '/body/pump/curve/2/head',
      },
      {
        name: 'two points that are not shut-off and open flow',
        path: '/calculations/operating-point',
        body: {
          units: usUnits,
          system: practitionerSystem,
          pump: {
            curve: [
              { flow: 0, head: 40 },
              { flow: 50, head: 30 },
            ],
          },
        },
        status: 422,
        pointer: '/body/pump/curve',
      },
      {
        name: 'one point only',
        path: '/calculations/operating-point',
        body: { units: usUnits, system: practitionerSystem, pump: { curve: [{ flow: 0, head: 40 }] } },
        status: 400,
        pointer: '/body/pump/curve',
      },
      {
        name: 'zero head before the last point',
        path: '/calculations/operating-point',
        body: {
          units: usUnits,
          system: practitionerSystem,
          pump: {
            curve: [
              { flow: 0, head: 40 },
              { flow: 50, head: 0 },
              { flow: 100, head: 0 },
            ],
          },
        },
        status: 422,
        pointer: '/body/pump/curve/1/head',
      },
      {
        name: 'efficiency on some points only',
        path: '/calculations/operating-point',
        body: {
          units: usUnits,
          system: practitionerSystem,
          pump: {
            curve: [
              { flow: 0, head: 40, efficiency: 0 },
              { flow: 50, head: 30 },
              { flow: 100, head: 15, efficiency: 50 },
            ],
          },
        },
        status: 422,
        pointer: '/body/pump/curve/1/efficiency',
      },
      {
        name: 'more running than installed',
        path: '/calculations/operating-point',
        body: {
          units: usUnits,
          system: practitionerSystem,
          pump: { curve: exampleCurve },
          arrangement: { installed: 1, running: 2 },
        },
        status: 422,
        pointer: '/body/arrangement/running',
      },
      {
        name: 'an inverted preferred band',
        path: '/calculations/operating-point',
        body: {
          units: usUnits,
          system: practitionerSystem,
          pump: { curve: exampleCurve },
          preferredBand: { minPercent: 100, maxPercent: 100 },
        },
        status: 422,
        pointer: '/body/preferredBand/maxPercent',
      },
    ];
    it("gives an engine refusal's values in the request's units", async () => {
      const response = await post('/calculations/operating-point', {
        units: usUnits,
        system: practitionerSystem,
        pump: {
          curve: [
            { flow: 0, head: 40 },
            { flow: 50, head: 30 },
            { flow: 100, head: 35 },
          ],
        },
      });
      expect(response.status, JSON.stringify(response.body)).to.equal(422);
      expect(response.body.errors[0].detail).to.equal(
        `head rises from 30 ${usUnits.head} to 35 ${usUnits.head}; Riffle accepts only curves whose head does not rise with flow`,
      );
    });

    for (const { name, path, body, status, pointer } of cases) {
      it(`answers ${status} naming ${pointer} for ${name}`, async () => {
        const response = await post(path, body);
        expect(response.status, JSON.stringify(response.body)).to.equal(status);
        expect(response.type).to.equal('application/problem+json');
        expect(response.body.pointer ?? response.body.errors?.[0]?.pointer).to.equal(pointer);
      });
    }
  });
});
