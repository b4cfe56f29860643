import { expect } from 'chai';
import fc from 'fast-check';
import {
  HydraulicsInputError,
  compileSystemCurve,
  fittingK,
  flowToSI,
  frictionFactorColebrook,
  headFromSI,
  headLossDarcyWeisbach,
  headLossHazenWilliams,
  lengthToSI,
  pipeSizeById,
  systemBreakdown,
  waterKinematicViscosity,
  type SystemCurveInput,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { refusalOf } from '../support/engine-refusal';

const gpm = (value: number) => flowToSI(value, 'gpm');
const feet = (value: number) => lengthToSI(value, 'ft');

describe('system curve', () => {
  describe('a practitioner\'s figure (common practice): 100 gpm, 240 ft of 3" plastic pipe, 14.5 ft static lift, C 150, no fittings', () => {
    // The practitioner used the US Hazen-Williams form; Riffle uses the SI form, 0.6 % lower on
    // the 5.6 ft of friction here (see friction.ts), so the figures are held to 0.06 ft.
    const system = (segment: { insideDiameter: number } | { pipeSizeId: string }) =>
      compileSystemCurve({
        staticHead: feet(14.5),
        frictionMethod: 'hazen-williams',
        segments: [{ length: feet(240), hazenWilliamsC: 150, ...segment }],
      });

    it('gives about 20.15 ft TDH on the nominal 3.000 in bore', () => {
      const tdh = headFromSI(system({ insideDiameter: 3 * 0.0254 }).evaluate(gpm(100)), 'ft');
      expect(tdh).to.be.closeTo(20.15, 0.06);
    });

    it('gives about 19.56 ft TDH on the Schedule 40 bore (3.068 in)', () => {
      const tdh = headFromSI(system({ pipeSizeId: 'pvc-sch40-3' }).evaluate(gpm(100)), 'ft');
      expect(tdh).to.be.closeTo(19.56, 0.06);
    });
  });

  const darcyInput: SystemCurveInput = {
    staticHead: 2.5,
    outletPressureHead: 1.2,
    frictionMethod: 'darcy-weisbach',
    temperature: 15,
    segments: [
      {
        length: 3,
        pipeSizeId: 'steel-sch40-1.5',
        fittings: [
          { kind: 'foot-valve-hinged', count: 1 },
          { kind: 'elbow-90-standard', count: 2 },
        ],
      },
      { length: 40, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'check-valve-swing', count: 1 }], extraK: 1.5 },
      { length: 12, insideDiameter: 0.04, roughness: 0.15e-3, fittings: [{ kind: 'exit', count: 1 }] },
    ],
  };

  it('Darcy-Weisbach: precomputed curve within 1e-8 relative of the exact Colebrook friction head from laminar to Re ~1e8', () => {
    const system = compileSystemCurve(darcyInput);
    let worst = 0;
    for (let step = 0; step <= 3000; step += 1) {
      const flow = 1e-7 * Math.pow(10, step / 500); // 1e-7 to 1e-1 m3/s
      const exact = systemBreakdown(system, flow);
      const tabulated = system.evaluate(flow) - system.staticHead - exact.minorHead;
      worst = Math.max(worst, Math.abs(tabulated / exact.frictionHead - 1));
    }
    expect(worst).to.be.lessThan(1e-8);
  });

  it('Darcy-Weisbach: ramps up to the turbulent value over Re 2277-2300 and is continuous through 2277, 2300 and 4000', () => {
    const system = compileSystemCurve({
      staticHead: 0,
      frictionMethod: 'darcy-weisbach',
      segments: [{ length: 50, pipeSizeId: 'pvc-sch40-1' }],
    });
    const segment = system.segments[0];
    const flowAt = (reynolds: number) => (reynolds * system.kinematicViscosity * segment.area) / segment.insideDiameter;
    for (const limit of [2277, 2300, 4000]) {
      const below = system.evaluate(flowAt(limit * (1 - 1e-9)));
      const above = system.evaluate(flowAt(limit * (1 + 1e-9)));
      expect(Math.abs(above / below - 1), `at Re ${limit}`).to.be.lessThan(1e-7);
    }
    // from 64/Re at 2277 up to Colebrook's value at 2300: the transition band never runs low
    const relativeRoughness = segment.roughness / segment.insideDiameter;
    const ratio = system.evaluate(flowAt(2300)) / system.evaluate(flowAt(2277));
    expect(ratio).to.be.closeTo(
      (frictionFactorColebrook(2300, relativeRoughness) * 2300 ** 2) / ((64 / 2277) * 2277 ** 2),
      1e-6,
    );
  });

  it('breaks the head down into static, outlet pressure, friction and minor losses that add up', () => {
    const system = compileSystemCurve(darcyInput);
    const flow = 0.003;
    const breakdown = systemBreakdown(system, flow);
    expect(breakdown.staticHead).to.equal(2.5);
    expect(breakdown.outletPressureHead).to.equal(1.2);
    expect(breakdown.totalHead).to.be.closeTo(2.5 + 1.2 + breakdown.frictionHead + breakdown.minorHead, 1e-12);
    expect(system.evaluate(flow)).to.be.closeTo(breakdown.totalHead, 1e-8 * breakdown.totalHead);

    const nu = waterKinematicViscosity(15);
    const first = pipeSizeById('steel-sch40-1.5');
    expect(breakdown.segments[0].frictionHead).to.be.closeTo(
      headLossDarcyWeisbach(3, flow, first.insideDiameter, first.roughness, nu),
      1e-15,
    );
    const kFirst =
      fittingK({ kind: 'foot-valve-hinged' }, first.insideDiameter) +
      2 * fittingK({ kind: 'elbow-90-standard' }, first.insideDiameter);
    const velocity = flow / ((Math.PI * first.insideDiameter ** 2) / 4);
    expect(breakdown.segments[0].velocity).to.be.closeTo(velocity, 1e-12);
    expect(breakdown.segments[0].totalK).to.be.closeTo(kFirst, 1e-12);
    expect(breakdown.segments[0].minorHead).to.be.closeTo((kFirst * velocity ** 2) / (2 * 9.80665), 1e-12);
    expect(breakdown.segments[1].totalK).to.be.closeTo(
      fittingK({ kind: 'check-valve-swing' }, pipeSizeById('pvc-sch40-2').insideDiameter) + 1.5,
      1e-12,
    );
    expect(breakdown.segments[2].reynolds).to.be.closeTo(((flow / ((Math.PI * 0.04 ** 2) / 4)) * 0.04) / nu, 1e-6);
  });

  it('Hazen-Williams: H = Hs + a Q^1.852 + b Q^2 exactly, with b = sum K / (2 g A^2)', () => {
    const system = compileSystemCurve({
      staticHead: 3,
      frictionMethod: 'hazen-williams',
      segments: [
        { length: 25, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 4 }] },
        { length: 5, insideDiameter: 0.03, material: 'hdpe' },
      ],
    });
    const d2 = pipeSizeById('pvc-sch40-2').insideDiameter;
    const area = (Math.PI * d2 * d2) / 4;
    const flow = 0.004;
    const expected =
      3 +
      headLossHazenWilliams(25, flow, d2, 150) +
      headLossHazenWilliams(5, flow, 0.03, 150) +
      (4 * fittingK({ kind: 'elbow-90-standard' }, d2) * (flow / area) ** 2) / (2 * 9.80665);
    expect(system.evaluate(flow)).to.be.closeTo(expected, 1e-12);
    expect(system.hazenWilliams?.b).to.be.closeTo(
      (4 * fittingK({ kind: 'elbow-90-standard' }, d2)) / (2 * 9.80665 * area * area),
      1e-6,
    );
    expect(systemBreakdown(system, flow).totalHead).to.be.closeTo(expected, 1e-12);
  });

  it('gives slopes that match central differences for both methods', () => {
    for (const frictionMethod of ['hazen-williams', 'darcy-weisbach'] as const) {
      const system = compileSystemCurve({
        ...darcyInput,
        frictionMethod,
        segments: darcyInput.segments.map((s) => ({ ...s, hazenWilliamsC: 140 })),
      });
      for (const flow of [1e-5, 3e-4, 2e-3, 1e-2]) {
        const h = flow * 1e-6;
        const numeric = (system.evaluate(flow + h) - system.evaluate(flow - h)) / (2 * h);
        expect(system.slope(flow), `${frictionMethod} at ${flow}`).to.be.closeTo(numeric, 1e-5 * numeric);
      }
    }
  });

  it('warns per segment above 5 ft/s (1.524 m/s), the common-practice limit for plastic pipe', () => {
    const system = compileSystemCurve({
      staticHead: 1,
      frictionMethod: 'hazen-williams',
      segments: [
        { length: 10, pipeSizeId: 'pvc-sch40-1' },
        { length: 10, pipeSizeId: 'pvc-sch40-3' },
      ],
    });
    const area = (Math.PI * pipeSizeById('pvc-sch40-1').insideDiameter ** 2) / 4;
    const velocityIssues = (flow: number) =>
      systemBreakdown(system, flow).issues.filter((issue) => issue.code === 'segment-velocity');
    expect(velocityIssues(1.5 * area)).to.deep.equal([]);
    const issues = velocityIssues(1.55 * area);
    expect(issues).to.have.length(1);
    expect(issues[0]).to.deep.include({ code: 'segment-velocity', pointer: '/segments/0' });
    expect(engineIssueText(issues[0])).to.match(/segment 0: velocity 1\.55 m\/s exceeds 1\.52 m\/s/);
  });

  it('adds equipment as its rated loss times (Q / Q_rated)^2, beside K, and lists each one in the breakdown', () => {
    const plain: SystemCurveInput = {
      staticHead: 1,
      frictionMethod: 'darcy-weisbach',
      segments: [{ length: 20, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'exit', count: 1 }] }],
    };
    const withEquipment: SystemCurveInput = {
      ...plain,
      segments: [
        {
          ...plain.segments[0],
          equipment: [
            { name: 'bead filter', headLoss: 3, atFlow: 0.005 },
            { name: 'UV clarifier', headLoss: 0.5, atFlow: 0.004 },
          ],
        },
      ],
    };
    const flow = 0.006;
    const bead = 3 * (flow / 0.005) ** 2;
    const uv = 0.5 * (flow / 0.004) ** 2;
    const breakdown = systemBreakdown(compileSystemCurve(withEquipment), flow);
    expect(breakdown.segments[0].equipment).to.deep.equal([
      { name: 'bead filter', headLoss: bead },
      { name: 'UV clarifier', headLoss: uv },
    ]);
    expect(breakdown.equipmentHead).to.be.closeTo(bead + uv, 1e-12);
    const without = systemBreakdown(compileSystemCurve(plain), flow);
    expect(breakdown.totalHead - without.totalHead).to.be.closeTo(bead + uv, 1e-12);
    expect(breakdown.minorHead).to.equal(without.minorHead);
    expect(compileSystemCurve(withEquipment).evaluate(flow)).to.be.closeTo(breakdown.totalHead, 1e-8);
    // at its rated flow, equipment loses exactly its rated head
    expect(systemBreakdown(compileSystemCurve(withEquipment), 0.005).segments[0].equipment[0].headLoss).to.be.closeTo(
      3,
      1e-12,
    );
  });

  it('refuses equipment with zero rated flow or a negative loss, naming the field', () => {
    const system = (equipment: { name: string; headLoss: number; atFlow: number }) => () =>
      compileSystemCurve({
        staticHead: 1,
        frictionMethod: 'hazen-williams',
        segments: [
          { length: 5, pipeSizeId: 'pvc-sch40-2' },
          { length: 5, pipeSizeId: 'pvc-sch40-2', equipment: [equipment] },
        ],
      });
    expect(refusalOf(system({ name: 'skimmer', headLoss: 1, atFlow: 0 }))).to.deep.include({
      code: 'not-positive',
      pointer: '/segments/1/equipment/0/atFlow',
    });
    expect(refusalOf(system({ name: 'skimmer', headLoss: -1, atFlow: 0.002 }))).to.deep.include({
      pointer: '/segments/1/equipment/0/headLoss',
    });
  });

  it('gives the Reynolds number of every segment and warns of Darcy-Weisbach flow in the transition band', () => {
    const system = compileSystemCurve({
      staticHead: 0,
      frictionMethod: 'darcy-weisbach',
      segments: [
        { length: 10, pipeSizeId: 'pvc-sch40-1' },
        { length: 10, pipeSizeId: 'pvc-sch40-3' },
      ],
    });
    const [small, large] = system.segments;
    const flowAt = (reynolds: number) => (reynolds * system.kinematicViscosity * small.area) / small.insideDiameter;
    const breakdown = systemBreakdown(system, flowAt(3000));
    expect(breakdown.segments[0].reynolds).to.be.closeTo(3000, 1e-9);
    expect(breakdown.segments[1].reynolds).to.be.closeTo((3000 * small.insideDiameter) / large.insideDiameter, 1e-9);
    // the 3" segment is at Re ~1140 (laminar): only the 1" one is in the band
    expect(breakdown.issues).to.deep.equal([
      {
        code: 'transitional-flow',
        params: { segment: 0, flow: flowAt(3000), reynolds: breakdown.segments[0].reynolds },
        pointer: '/segments/0',
      },
    ]);
    expect(systemBreakdown(system, flowAt(4100)).issues).to.deep.equal([]);
    expect(systemBreakdown(system, flowAt(2200)).issues).to.deep.equal([]);
  });

  it('warns when Hazen-Williams is outside its range (bore under 50 mm, Re under 4000, 4-25 C) with the Darcy-Weisbach figure', () => {
    const input = (temperature: number): SystemCurveInput => ({
      staticHead: 0,
      temperature,
      frictionMethod: 'hazen-williams',
      segments: [
        { length: 10, pipeSizeId: 'pvc-sch40-1' },
        { length: 10, pipeSizeId: 'pvc-sch40-3' },
      ],
    });
    const system = compileSystemCurve(input(20));
    const flow = 0.002;
    const issues = systemBreakdown(system, flow).issues.filter((issue) => issue.code === 'hazen-williams-out-of-range');
    expect(issues.map((issue) => issue.pointer)).to.deep.equal(['/segments/0']);
    const small = pipeSizeById('pvc-sch40-1');
    const nu = waterKinematicViscosity(20);
    expect(issues[0].params).to.deep.include({ segment: 0, reasons: ['small-bore'], smoothPipe: false });
    const params = issues[0].params as { darcyWeisbachHead: number; hazenWilliamsHead: number };
    expect(params.darcyWeisbachHead).to.be.closeTo(
      headLossDarcyWeisbach(10, flow, small.insideDiameter, small.roughness, nu),
      1e-12,
    );
    expect(params.hazenWilliamsHead).to.be.closeTo(headLossHazenWilliams(10, flow, small.insideDiameter, 150), 1e-12);
    // at a trickle the 3" segment is laminar; warm water puts both outside the range
    const trickle = systemBreakdown(compileSystemCurve(input(30)), 3e-5).issues.filter(
      (issue) => issue.code === 'hazen-williams-out-of-range',
    );
    expect(trickle.map((issue) => (issue.params as { reasons: string[] }).reasons)).to.deep.equal([
      ['small-bore', 'low-reynolds', 'temperature'],
      ['low-reynolds', 'temperature'],
    ]);
    expect(systemBreakdown(system, 0).issues).to.deep.equal([]);
  });

  it('either throws HydraulicsInputError or evaluates to finite heads, whatever numbers it is given (property)', () => {
    const anyNumber = fc.oneof(fc.double(), fc.constantFrom(0, -1, Number.NaN, Number.POSITIVE_INFINITY));
    fc.assert(
      fc.property(
        anyNumber,
        anyNumber,
        anyNumber,
        anyNumber,
        fc.constantFrom('hazen-williams', 'darcy-weisbach'),
        (staticHead, length, diameter, extraK, method) => {
          let system;
          try {
            system = compileSystemCurve({
              staticHead,
              frictionMethod: method as 'hazen-williams' | 'darcy-weisbach',
              segments: [{ length, insideDiameter: diameter, hazenWilliamsC: 140, roughness: 1e-5, extraK }],
            });
          } catch (error) {
            return error instanceof HydraulicsInputError;
          }
          return [0, 1e-4, 1e-2, 1].every(
            (flow) =>
              Number.isFinite(system.evaluate(flow)) && Number.isFinite(systemBreakdown(system, flow).totalHead),
          );
        },
      ),
      { numRuns: 500 },
    );
  });

  describe('bad input', () => {
    const base: SystemCurveInput = {
      staticHead: 2,
      frictionMethod: 'hazen-williams',
      segments: [{ length: 10, pipeSizeId: 'pvc-sch40-2' }],
    };
    const cases: [string, SystemCurveInput, string][] = [
      [
        'negative length',
        { ...base, segments: [base.segments[0], { length: -3, pipeSizeId: 'pvc-sch40-2' }] },
        '/segments/1/length',
      ],
      ['zero length', { ...base, segments: [{ length: 0, pipeSizeId: 'pvc-sch40-2' }] }, '/segments/0/length'],
      [
        'zero diameter',
        { ...base, segments: [{ length: 1, insideDiameter: 0, hazenWilliamsC: 150 }] },
        '/segments/0/insideDiameter',
      ],
      [
        'infinite diameter',
        { ...base, segments: [{ length: 1, insideDiameter: Infinity, hazenWilliamsC: 150 }] },
        '/segments/0/insideDiameter',
      ],
      ['NaN static head', { ...base, staticHead: Number.NaN }, '/staticHead'],
      ['no segments', { ...base, segments: [] }, '/segments'],
      ['unknown size', { ...base, segments: [{ length: 1, pipeSizeId: 'pvc-sch40-9' }] }, '/segments/0/pipeSizeId'],
      [
        'unknown fitting',
        {
          ...base,
          segments: [
            {
              length: 1,
              pipeSizeId: 'pvc-sch40-2',
              fittings: [
                { kind: 'exit', count: 1 },
                { kind: 'valve-plug', count: 1 },
              ],
            },
          ],
        },
        '/segments/0/fittings/1/kind',
      ],
      [
        'fractional fitting count',
        { ...base, segments: [{ length: 1, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'exit', count: 1.5 }] }] },
        '/segments/0/fittings/0/count',
      ],
      [
        'C missing for a bare bore',
        { ...base, segments: [{ length: 1, insideDiameter: 0.05 }] },
        '/segments/0/hazenWilliamsC',
      ],
      [
        'roughness missing for a bare bore',
        {
          ...base,
          frictionMethod: 'darcy-weisbach',
          segments: [{ length: 1, insideDiameter: 0.05, hazenWilliamsC: 150 }],
        },
        '/segments/0/roughness',
      ],
      [
        'size and bore both given',
        { ...base, segments: [{ length: 1, pipeSizeId: 'pvc-sch40-2', insideDiameter: 0.05 }] },
        '/segments/0/insideDiameter',
      ],
      ['temperature out of range', { ...base, temperature: 60 }, '/temperature'],
      ['unknown method', { ...base, frictionMethod: 'manning' as never }, '/frictionMethod'],
    ];
    for (const [name, input, field] of cases) {
      it(`${name} -> HydraulicsInputError at ${field}`, () => {
        expect(() => compileSystemCurve(input))
          .to.throw(HydraulicsInputError)
          .with.property('field', field);
      });
    }

    it('a negative or NaN flow in a breakdown -> HydraulicsInputError', () => {
      const system = compileSystemCurve(base);
      expect(() => systemBreakdown(system, -1))
        .to.throw(HydraulicsInputError)
        .with.property('field', '/flow');
      expect(() => systemBreakdown(system, Number.NaN)).to.throw(HydraulicsInputError);
    });
  });
});
