import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { fitInlinePump } from '../../../server/calculations/pump-request';
import { createLogger } from '../../../server/logging';
import type {
  BranchFlowSummary,
  OperatingPointResponse,
  PipeSystem,
  SystemCurveResponse,
} from '../../../shared/api/api-schemas';
import { branchedSystemInputOf } from '../../../shared/api/system-input';
import {
  branchFlowsAt,
  compileBranchedSystem,
  compileSystemCurve,
  flowFromSI,
  flowToSI,
  headFromSI,
  parallelHeadCurve,
  solveOperatingPoint,
  STANDARD_GRAVITY,
  type CompiledBranchedSystem,
} from '../../../shared/hydraulics';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

/*
 * A branched system through the HTTP stack: a falls and a filter return fed by one pump over a
 * common run. Figures are checked against the engine's own functions called directly and, for
 * the split, against a brute-force bisection written here from the node continuity alone
 * (sum of branch flows = total flow at one head at the split; three-reservoir problem, F. M.
 * White, Fluid Mechanics, section 6.9).
 */

const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
const pipe = (length: number, minorLossK = 0) => [{ length, insideDiameter: 1.61, hazenWilliamsC: 150, minorLossK }];
const pondSystem = {
  frictionMethod: 'hazen-williams',
  segments: [{ length: 20, insideDiameter: 2.067, hazenWilliamsC: 150 }],
  branches: [
    { name: 'falls', staticHead: 9, outletPressureHead: 0, segments: pipe(60, 2) },
    { name: 'filter-return', staticHead: 1, segments: pipe(30, 8) },
  ],
} satisfies PipeSystem;
/** Points on H = 40 - 0.0005 Q^2 (ft, gpm). */
const pumpCurve = [0, 50, 100, 150, 200].map((flow) => ({ flow, head: 40 - 0.0005 * flow * flow }));

function compiled(system: PipeSystem = pondSystem): CompiledBranchedSystem {
  return compileBranchedSystem(branchedSystemInputOf(system, units)!);
}

/** Bisection on [low, high] for an increasing f, to 1e-12 of the bracket. */
function bisect(f: (x: number) => number, low: number, high: number): number {
  for (let step = 0; step < 200 && high - low > 1e-12 * Math.max(1, Math.abs(high)); step += 1) {
    const middle = (low + high) / 2;
    if (f(middle) < 0) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}

/** The split at total flow Q (SI), solved by plain bisection on each branch's own system curve. */
function bruteForceSplit(system: PipeSystem, totalFlow: number): { head: number; flows: number[] } {
  const input = branchedSystemInputOf(system, units)!;
  const curves = input.branches.map((branch) =>
    compileSystemCurve({ ...branch, frictionMethod: input.frictionMethod, temperature: input.temperature }),
  );
  const common = compileSystemCurve({ staticHead: 0, segments: input.segments, frictionMethod: input.frictionMethod });
  const flowsAt = (junctionHead: number) =>
    curves.map((curve) =>
      curve.evaluate(0) >= junctionHead ? 0 : bisect((q) => curve.evaluate(q) - junctionHead, 0, 1),
    );
  const sum = (flows: number[]) => flows.reduce((total, flow) => total + flow, 0);
  const junctionHead = bisect((head) => sum(flowsAt(head)) - totalFlow, -100, 1000);
  return { head: common.evaluate(totalFlow) + junctionHead, flows: flowsAt(junctionHead) };
}

describe('branched systems through the calculations API', function () {
  this.timeout(60_000);
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let token: string;

  before(async () => {
    scratch = await createScratchDatabase('branched');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  const post = (path: string, body: unknown) =>
    request(app)
      .post(`/api/v1${path}`)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);

  const flowOf = (branches: BranchFlowSummary[] | undefined, name: string) =>
    branches!.find((branch) => branch.name === name)!.flow;

  it('gives each point of the system curve its branches, as the engine and a brute-force split do', async () => {
    const flows = [0, 20, 60, 120];
    const response = await post('/calculations/system-curve', { units, system: pondSystem, flows }).expect(200);
    const body = response.body as SystemCurveResponse;
    const engine = compiled();
    body.points.forEach((point, index) => {
      const split = branchFlowsAt(engine, flowToSI(flows[index], 'gpm'));
      expect(point.head).to.be.closeTo(headFromSI(split.totalHead, 'ft'), 1e-9);
      expect(point.junctionHead).to.be.closeTo(headFromSI(split.junctionHead, 'ft'), 1e-9);
      expect(point.branches!.map((branch) => branch.name)).to.deep.equal(['falls', 'filter-return']);
      point.branches!.forEach((branch, at) =>
        expect(branch.flow).to.be.closeTo(flowFromSI(split.branches[at].flow, 'gpm'), 1e-9),
      );
      expect(point.frictionHead + point.minorHead + point.junctionHead!).to.be.closeTo(point.head, 1e-9);
    });
    // At 120 gpm both outlets run; the brute force agrees to 1e-6 ft and 1e-6 gpm.
    const brute = bruteForceSplit(pondSystem, flowToSI(120, 'gpm'));
    expect(body.points[3].head).to.be.closeTo(headFromSI(brute.head, 'ft'), 1e-6);
    expect(flowOf(body.points[3].branches, 'falls')).to.be.closeTo(flowFromSI(brute.flows[0], 'gpm'), 1e-6);
    expect(flowOf(body.points[3].branches, 'falls')).to.be.greaterThan(0);
    expect(flowOf(body.points[3].branches, 'falls') + flowOf(body.points[3].branches, 'filter-return')).to.be.closeTo(
      120,
      1e-6,
    );
    // At 20 gpm the split's head is below the falls' outlet (9 ft): the falls gets nothing and says so.
    expect(body.points[1].junctionHead).to.be.below(9);
    expect(flowOf(body.points[1].branches, 'falls')).to.equal(0);
    expect(body.points[1].branches![0].warnings.join(' ')).to.match(/takes no flow/);
    expect(flowOf(body.points[1].branches, 'filter-return')).to.be.closeTo(20, 1e-6);
    // At zero flow the head is the lowest outlet's level.
    expect(body.points[0].head).to.be.closeTo(1, 1e-9);
  });

  it('answers the operating point with each branch, and the valve that balances the falls', async () => {
    const response = await post('/calculations/operating-point', {
      units,
      system: pondSystem,
      pump: { curve: pumpCurve },
      balance: { branch: 'falls', flow: 70 },
    }).expect(200);
    const body = response.body as OperatingPointResponse;
    const engine = compiled();
    const fit = fitInlinePump(units, { curve: pumpCurve });
    const point = solveOperatingPoint(fit, engine);
    expect(point.ok).to.equal(true);
    if (!point.ok) return;
    expect(body.operatingPoint.flow).to.be.closeTo(flowFromSI(point.flow, 'gpm'), 1e-6);
    const split = branchFlowsAt(engine, point.flow);
    expect(flowOf(body.operatingPoint.branches, 'falls')).to.be.closeTo(
      flowFromSI(split.branches[0].flow, 'gpm'),
      1e-6,
    );
    const total = body.operatingPoint.branches!.reduce((sum, branch) => sum + branch.flow, 0);
    expect(total).to.be.closeTo(body.operatingPoint.flow, 1e-6);
    // The falls takes less than 70 gpm unthrottled; the valve K on the filter return brings it to 70.
    expect(flowOf(body.operatingPoint.branches, 'falls')).to.be.below(70);
    const balancing = body.balancing!;
    expect(balancing).to.include({ branch: 'falls', flow: 70 });
    expect(balancing.valvesOn).to.deep.equal(['filter-return']);
    expect(balancing.valveK).to.be.greaterThan(0);
    expect(balancing.caution)
      .to.match(/wastes energy/)
      .and.match(/flow meter/);
    const area = engine.branches[1].lastSegmentArea;
    const valved = engine.withValves([0, balancing.valveK / (2 * STANDARD_GRAVITY * area * area)]);
    const balanced = solveOperatingPoint(parallelHeadCurve(fit, 1), valved);
    expect(balanced.ok).to.equal(true);
    if (!balanced.ok) return;
    expect(flowFromSI(branchFlowsAt(valved, balanced.flow).branches[0].flow, 'gpm')).to.be.closeTo(70, 1e-4);
  });

  it('refuses a balance the valve cannot reach, or on a system without branches, naming the field', async () => {
    const tooLittle = await post('/calculations/operating-point', {
      units,
      system: pondSystem,
      pump: { curve: pumpCurve },
      balance: { branch: 'falls', flow: 1 },
    }).expect(422);
    expect(tooLittle.body.errors[0].pointer).to.equal('/body/balance/flow');
    expect(tooLittle.body.errors[0].detail).to.match(/throttle it instead/);
    const unknown = await post('/calculations/operating-point', {
      units,
      system: pondSystem,
      pump: { curve: pumpCurve },
      balance: { branch: 'stream', flow: 50 },
    }).expect(422);
    expect(unknown.body.errors[0].pointer).to.equal('/body/balance/branch');
    expect(unknown.body.errors[0].detail).to.match(/no branch is named 'stream'/);
    const single = await post('/calculations/operating-point', {
      units,
      system: { staticHead: 5, frictionMethod: 'hazen-williams', segments: pipe(50) },
      pump: { curve: pumpCurve },
      balance: { branch: 'falls', flow: 50 },
    }).expect(422);
    expect(single.body.errors[0].pointer).to.equal('/body/balance/branch');
  });

  /** The contract's example named `branched` of an operation's request, or of its 200 answer. */
  function branchedExample(path: string, side: 'request' | 'response'): Record<string, unknown> {
    const definition = (openApiDocument.paths?.[path] as OpenAPIV3_1.PathItemObject).post!;
    const content =
      side === 'request'
        ? (definition.requestBody as OpenAPIV3_1.RequestBodyObject).content
        : (definition.responses?.['200'] as OpenAPIV3_1.ResponseObject).content!;
    return (content['application/json'].examples?.branched as OpenAPIV3_1.ExampleObject).value as Record<
      string,
      unknown
    >;
  }

  /** Every number of `actual` within 0.006 of the example's two-decimal figure, every text the same. */
  function expectLikeExample(actual: unknown, example: unknown, where = ''): void {
    if (typeof example === 'number') expect(actual, where).to.be.closeTo(example, 0.006);
    else if (Array.isArray(example)) {
      expect(actual, where).to.be.an('array').with.length(example.length);
      example.forEach((item, index) => expectLikeExample((actual as unknown[])[index], item, `${where}/${index}`));
    } else if (example !== null && typeof example === 'object') {
      expect(Object.keys(actual as object), where).to.have.members(Object.keys(example));
      for (const [key, value] of Object.entries(example))
        expectLikeExample((actual as Record<string, unknown>)[key], value, `${where}/${key}`);
    } else expect(actual, where).to.equal(example);
  }

  for (const path of ['/calculations/system-curve', '/calculations/operating-point']) {
    it(`answers the contract's branched example of ${path} as the example shows`, async () => {
      const response = await post(path, branchedExample(path, 'request')).expect(200);
      expectLikeExample(response.body, branchedExample(path, 'response'));
    });
  }

  const withBranches = (branches: unknown) => ({ ...pondSystem, branches });
  const badSystems: Array<[string, unknown, number, string]> = [
    [
      'a branch without segments',
      withBranches([pondSystem.branches[0], { name: 'b', staticHead: 1, segments: [] }]),
      400,
      '/body/system/branches/1/segments',
    ],
    [
      'a branch without a name',
      withBranches([pondSystem.branches[0], { staticHead: 1, segments: pipe(5) }]),
      400,
      '/body/system/branches/1/name',
    ],
    [
      'two branches of one name',
      withBranches([pondSystem.branches[0], { ...pondSystem.branches[1], name: 'falls' }]),
      422,
      '/body/system/branches/1/name',
    ],
    ['a system static head beside branches', { ...pondSystem, staticHead: 4 }, 400, '/body/system/staticHead'],
    ['one branch', withBranches([pondSystem.branches[0]]), 400, '/body/system/branches'],
    [
      'nine branches',
      withBranches(Array.from({ length: 9 }, (_, index) => ({ ...pondSystem.branches[1], name: `b${index}` }))),
      400,
      '/body/system/branches',
    ],
    [
      'a single route without a static head',
      { frictionMethod: 'hazen-williams', segments: pipe(5) },
      400,
      '/body/system/staticHead',
    ],
    [
      'a single route without segments',
      { staticHead: 3, frictionMethod: 'hazen-williams', segments: [] },
      400,
      '/body/system/segments',
    ],
    [
      'an implausible branch length',
      withBranches([pondSystem.branches[0], { name: 'b', staticHead: 1, segments: pipe(1e9) }]),
      422,
      '/body/system/branches/1/segments/0/length',
    ],
  ];
  for (const [name, system, status, pointer] of badSystems) {
    it(`answers ${status} naming ${pointer} for ${name}, on every route`, async () => {
      for (const [path, rest] of [
        ['/calculations/system-curve', { flows: [50] }],
        ['/calculations/operating-point', { pump: { curve: pumpCurve } }],
      ] as const) {
        const response = await post(path, { units, system, ...rest }).expect(status);
        expect(response.headers['content-type']).to.match(/application\/problem\+json/);
        expect(response.body.errors.map((error: { pointer: string }) => error.pointer)).to.include(pointer);
      }
    });
  }
});
