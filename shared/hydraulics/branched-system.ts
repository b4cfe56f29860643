import { HydraulicsInputError } from './hydraulics-error';
import { SplitSolver } from './junction-split';
import { compileSystemCurve, type CompiledSystemCurve } from './system-curve';
import { FRICTION_METHODS, type FrictionMethod, type PipeSegmentInput } from './system-input';
import { waterKinematicViscosity } from './water-properties';

/*
 * A branched system: one common run from the pump to a split, then 2 to 8 branches, each to an
 * outlet at its own level. At a total flow Q the head at the split H_j is the one at which the
 * branch flows sum to Q (node continuity), each branch i taking the q_i >= 0 with
 *   z_i + p_i + h_i(q_i) = H_j   (z outlet level, p outlet pressure head, h the branch's losses),
 * and the pump sees H(Q) = h_common(Q) + H_j(Q). This is the classic three-reservoir (branching
 * pipe) problem solved by continuity at the junction: F. M. White, Fluid Mechanics, McGraw-Hill
 * (section 6.9 "Multiple-pipe systems", three-reservoir junction; from memory); V. L. Streeter,
 * E. B. Wylie, Fluid Mechanics, McGraw-Hill (branching pipes; from memory). Its general form for
 * networks is the node method of Hardy Cross (Univ. of Illinois Eng. Exp. Station Bulletin 286,
 * 1936; from memory). A branch whose outlet head is above H_j takes no flow: back-flow from an outlet into the
 * split is not modelled (an open outlet does not feed the system).
 */

/** How many branches a branched system has. */
export const BRANCH_COUNT_LIMITS = Object.freeze({ min: 2, max: 8 });

export interface BranchInput {
  /** The branch's name, unique in its system (e.g. `falls`). */
  name: string;
  /** Outlet level above the intake water surface, m (negative: below it). */
  staticHead: number;
  /** Pressure head wanted at the outlet, m; default 0. */
  outletPressureHead?: number;
  /** The pipe from the split to the outlet, in flow order; at least one segment. */
  segments: readonly PipeSegmentInput[];
}

export interface BranchedSystemInput {
  frictionMethod: FrictionMethod;
  /** Water temperature, C (0-40); default 20. */
  temperature?: number;
  /** The common run from the pump to the split, in flow order; may be empty. */
  segments: readonly PipeSegmentInput[];
  branches: readonly BranchInput[];
  /** Not allowed with branches: each branch states its own outlet level. */
  staticHead?: never;
}

/** One branch prepared for the split. */
export interface CompiledBranch {
  readonly name: string;
  /** Head needed at the split to pass a branch flow: outlet level + outlet pressure head + the branch's losses. */
  readonly curve: CompiledSystemCurve;
  /** Flow area of the branch's last segment, m2: the velocity a balancing valve's K is referred to. */
  readonly lastSegmentArea: number;
}

/**
 * A branched system's curve as the pump sees it: a CompiledSystemCurve (so operating points,
 * pump arrangements and the selection search take it unchanged) whose head at total flow Q is
 * h_common(Q) + H_j(Q). Its `staticHead` is the lowest outlet head (the head at zero flow),
 * `staticLift` and `outletPressureHead` those of that branch; `segments`, `minorCoefficient` are
 * the common run's (they carry the total flow), so systemBreakdown of it covers the common run
 * only: branchFlowsAt gives the branches. `hazenWilliams` is null (no single a Q^1.852 + b Q^2).
 */
export interface CompiledBranchedSystem extends CompiledSystemCurve {
  /** The common run alone (its static head 0), or null when the branches start at the pump. */
  readonly commonRun: CompiledSystemCurve | null;
  readonly branches: readonly CompiledBranch[];
  /** Quadratic loss added per branch by valves, K / (2 g A^2), s2/m5 (zeros as compiled). */
  readonly valveCoefficients: readonly number[];
  /** The head at the split (m) at total flow Q (m3/s, >= 0); the branch flows (m3/s) into `flows`. */
  splitAt(totalFlow: number, flows: Float64Array): number;
  /** The total flow (m3/s) at a head at the split (m); the branch flows into `flows`. */
  flowsAtJunctionHead(junctionHead: number, flows: Float64Array): number;
  /** The same system with valve coefficients (s2/m5, one per branch) in place of the present ones. */
  withValves(valveCoefficients: readonly number[]): CompiledBranchedSystem;
}

/** Runs `compile`, re-pointing an input error under `prefix` (e.g. `/branches/1`). */
function under<T>(prefix: string, compile: () => T): T {
  try {
    return compile();
  } catch (error) {
    if (error instanceof HydraulicsInputError) {
      throw new HydraulicsInputError({ ...error.issue, pointer: `${prefix}${error.issue.pointer}` });
    }
    throw error;
  }
}

function checkBranches(input: BranchedSystemInput): void {
  const branches = input.branches;
  if (
    !Array.isArray(branches) ||
    branches.length < BRANCH_COUNT_LIMITS.min ||
    branches.length > BRANCH_COUNT_LIMITS.max
  ) {
    throw new HydraulicsInputError({
      code: 'out-of-range',
      params: {
        what: 'number of branches',
        value: Array.isArray(branches) ? branches.length : 0,
        min: BRANCH_COUNT_LIMITS.min,
        max: BRANCH_COUNT_LIMITS.max,
      },
      pointer: '/branches',
    });
  }
  const seen = new Set<string>();
  branches.forEach((branch, index) => {
    if (typeof branch.name !== 'string' || branch.name.trim() === '') {
      throw new HydraulicsInputError({ code: 'branch-without-name', params: {}, pointer: `/branches/${index}/name` });
    }
    if (seen.has(branch.name)) {
      throw new HydraulicsInputError({
        code: 'branch-name-repeated',
        params: { name: branch.name },
        pointer: `/branches/${index}/name`,
      });
    }
    seen.add(branch.name);
    if (!Array.isArray(branch.segments) || branch.segments.length === 0) {
      throw new HydraulicsInputError({ code: 'no-segments', params: {}, pointer: `/branches/${index}/segments` });
    }
  });
}

function assemble(
  commonRun: CompiledSystemCurve | null,
  branches: readonly CompiledBranch[],
  valveCoefficients: readonly number[],
  properties: Pick<CompiledSystemCurve, 'frictionMethod' | 'temperature' | 'kinematicViscosity'>,
): CompiledBranchedSystem {
  const solver = new SplitSolver(
    branches.map((branch) => branch.curve),
    valveCoefficients,
  );
  const lowest = branches.reduce((best, branch) => (branch.curve.staticHead < best.curve.staticHead ? branch : best));
  const common = new Float64Array(2);
  // dH_j/dQ = 1 / (d sum q_i / dH_j), from the solve's last evaluation.
  const headAndSlope = (flow: number, out: Float64Array): void => {
    const junctionHead = solver.junctionHead(flow, false);
    if (commonRun === null) common.fill(0);
    else commonRun.headAndSlope(Math.max(flow, 0), common);
    out[0] = common[0] + junctionHead;
    out[1] = common[1] + 1 / solver.lastFlowSlope;
  };
  const scratch = new Float64Array(2);
  return {
    ...properties,
    staticHead: lowest.curve.staticHead,
    staticLift: lowest.curve.staticLift,
    outletPressureHead: lowest.curve.outletPressureHead,
    hazenWilliams: null,
    minorCoefficient: commonRun?.minorCoefficient ?? 0,
    segments: commonRun?.segments ?? [],
    commonRun,
    branches,
    valveCoefficients,
    headAndSlope,
    evaluate: (flow) => solver.junctionHead(flow, false) + (commonRun?.evaluate(Math.max(flow, 0)) ?? 0),
    slope(flow) {
      headAndSlope(flow, scratch);
      return scratch[1];
    },
    splitAt(totalFlow, flows) {
      const junctionHead = solver.junctionHead(totalFlow, true);
      flows.set(solver.flows);
      return junctionHead;
    },
    flowsAtJunctionHead(junctionHead, flows) {
      const total = solver.flowsAtHead(junctionHead);
      flows.set(solver.flows);
      return total;
    },
    withValves: (coefficients) => assemble(commonRun, branches, coefficients, properties),
  };
}

/**
 * Prepares a branched system for fast evaluation (see CompiledBranchedSystem and the method
 * above): H(Q) = h_common(Q) + H_j(Q), where H_j solves sum_i q_i(H_j) = Q and each q_i >= 0
 * solves z_i + p_i + h_i(q_i) = H_j, with h the losses of compileSystemCurve (Hazen-Williams or
 * Darcy-Weisbach friction plus K V^2/2g). H is continuous and increasing in Q. One evaluation
 * costs a few inner solves per branch, each a few evaluations of the branch's own curve.
 * Heads in m, flows in m3/s. Throws HydraulicsInputError naming the field (e.g.
 * `/branches/2/name`, `/branches/0/segments/1/length`).
 * @param input common run (may be empty), 2 to 8 branches; no system staticHead
 * @returns the compiled curve, with the split, its branches and their valves
 * @example
 * const pipe = [{ length: 40, insideDiameter: 0.05, hazenWilliamsC: 140 }];
 * const twin = compileBranchedSystem({ frictionMethod: 'hazen-williams', segments: [], branches: [{ name: 'a', staticHead: 3, segments: pipe }, { name: 'b', staticHead: 3, segments: pipe }] });
 * twin.evaluate(0.004) // => 3.98546
 * twin.evaluate(0.004) - compileSystemCurve({ frictionMethod: 'hazen-williams', staticHead: 3, segments: pipe }).evaluate(0.002) // => 0.0000000
 */
export function compileBranchedSystem(input: BranchedSystemInput): CompiledBranchedSystem {
  if ((input as { staticHead?: unknown }).staticHead !== undefined) {
    throw new HydraulicsInputError({ code: 'static-head-with-branches', params: {}, pointer: '/staticHead' });
  }
  if (!FRICTION_METHODS.includes(input.frictionMethod)) {
    throw new HydraulicsInputError({
      code: 'unknown-friction-method',
      params: { value: String(input.frictionMethod), accepted: [...FRICTION_METHODS] },
      pointer: '/frictionMethod',
    });
  }
  const temperature = input.temperature ?? 20;
  const kinematicViscosity = waterKinematicViscosity(temperature, '/temperature');
  if (!Array.isArray(input.segments)) {
    throw new HydraulicsInputError({ code: 'no-segments', params: {}, pointer: '/segments' });
  }
  checkBranches(input);
  const frictionMethod = input.frictionMethod;
  const commonRun =
    input.segments.length === 0
      ? null
      : compileSystemCurve({ staticHead: 0, segments: input.segments, temperature, frictionMethod });
  const branches = input.branches.map((branch, index): CompiledBranch => {
    const curve = under(`/branches/${index}`, () =>
      compileSystemCurve({
        staticHead: branch.staticHead,
        outletPressureHead: branch.outletPressureHead,
        segments: branch.segments,
        temperature,
        frictionMethod,
      }),
    );
    return { name: branch.name, curve, lastSegmentArea: curve.segments[curve.segments.length - 1].area };
  });
  return assemble(
    commonRun,
    branches,
    branches.map(() => 0),
    { frictionMethod, temperature, kinematicViscosity },
  );
}
