import type { CompiledBranchedSystem } from './branched-system';
import type { EngineIssue } from './engine-issues';
import { HydraulicsInputError, requireNonNegative, requirePositive } from './hydraulics-error';
import { solveOperatingPoint, type HeadCurve } from './operating-point';
import { STANDARD_GRAVITY } from './physical-constants';
import { findRootBracketed } from './root-finding';
import { systemBreakdown } from './system-breakdown';
import { SYSTEM_INPUT_LIMITS } from './system-input';

/*
 * What a branched system does at a total flow (the split, velocities, branches left dry), the
 * valve that balances it, and the total flows that keep one branch in its duty band. SI: m, m3/s.
 */

export interface BranchFlow {
  name: string;
  /** m3/s (>= 0) */
  flow: number;
  /** Velocity in each of the branch's segments, m/s. */
  velocities: number[];
  /** The highest of `velocities`, m/s. */
  maxVelocity: number;
  /** No flow, and every segment above the velocity limit. */
  issues: EngineIssue[];
}

export interface BranchSplit {
  totalFlow: number;
  /** Head at the split, m above the intake water surface. */
  junctionHead: number;
  /** TDH: losses of the common run plus the head at the split, m. */
  totalHead: number;
  /** Velocity in each segment of the common run, m/s. */
  commonVelocities: number[];
  /** The common run's velocity issues, and Hazen-Williams outside its temperatures. */
  issues: EngineIssue[];
  branches: BranchFlow[];
}

/** The index of the branch named `name`; throws HydraulicsInputError at `field` when none is. */
function branchIndex(system: CompiledBranchedSystem, name: string, field: string): number {
  const index = system.branches.findIndex((branch) => branch.name === name);
  if (index < 0) {
    throw new HydraulicsInputError({
      code: 'unknown-branch',
      params: { value: name, accepted: system.branches.map((branch) => branch.name) },
      pointer: field,
    });
  }
  return index;
}

function underBranch(issue: EngineIssue, branch: number): EngineIssue {
  return { ...issue, pointer: `/branches/${branch}${issue.pointer ?? ''}` };
}

/**
 * The split at a total flow Q: the head at the split H_j (sum_i q_i(H_j) = Q, see
 * compileBranchedSystem), each branch's flow and segment velocities V = q/A, a `branch-no-flow`
 * issue for each branch whose outlet head z_i + p_i is above H_j (it takes q_i = 0: no back-flow),
 * and the velocity issues of systemBreakdown per segment. TDH = h_common(Q) + H_j.
 * @param system a compiled branched system
 * @param totalFlow Q, m3/s (>= 0)
 * @returns the split head, TDH, each branch's flow, velocities and issues
 * @example
 * const pipe = (length) => [{ length, insideDiameter: 0.05, hazenWilliamsC: 140 }];
 * const pond = compileBranchedSystem({ frictionMethod: 'hazen-williams', segments: pipe(10), branches: [{ name: 'falls', staticHead: 4, segments: pipe(30) }, { name: 'stream', staticHead: 1, segments: pipe(60) }] });
 * branchFlowsAt(pond, 0.002).branches[0].flow // => 0.0000000
 * branchFlowsAt(pond, 0.005).branches[0].flow // => 0.00177074
 * branchFlowsAt(pond, 0.005).junctionHead // => 4.5899
 */
export function branchFlowsAt(system: CompiledBranchedSystem, totalFlow: number): BranchSplit {
  requireNonNegative(totalFlow, '/flow', 'total flow');
  const flows = new Float64Array(system.branches.length);
  const junctionHead = system.splitAt(totalFlow, flows);
  const common = system.commonRun === null ? null : systemBreakdown(system.commonRun, totalFlow);
  const breakdowns = system.branches.map((branch, index) => systemBreakdown(branch.curve, flows[index]));
  const isTemperature = (issue: EngineIssue) => issue.code === 'hazen-williams-temperature';
  const temperatureIssues = breakdowns[0].issues.filter(isTemperature);
  const commonIssues = common === null ? [] : common.issues.filter((issue) => !isTemperature(issue));
  return {
    totalFlow,
    junctionHead,
    totalHead: (common === null ? 0 : common.totalHead) + junctionHead,
    commonVelocities: common === null ? [] : common.segments.map((segment) => segment.velocity),
    issues: [...temperatureIssues, ...commonIssues],
    branches: system.branches.map((branch, index): BranchFlow => {
      const velocities = breakdowns[index].segments.map((segment) => segment.velocity);
      const issues: EngineIssue[] = breakdowns[index].issues
        .filter((issue) => !isTemperature(issue))
        .map((issue) => underBranch(issue, index));
      const outletHead = branch.curve.staticHead;
      if (outletHead > junctionHead) {
        issues.unshift({
          code: 'branch-no-flow',
          params: { branch: index, name: branch.name, outletHead, junctionHead },
          pointer: `/branches/${index}`,
        });
      }
      return { name: branch.name, flow: flows[index], velocities, maxVelocity: Math.max(...velocities), issues };
    }),
  };
}

/** What a balanced branch is to take at the operating point: a flow (m3/s) or a share of the total (0-1). */
export type BranchTarget = { flow: number } | { share: number };

/**
 * The loss coefficient K a valve on each of the other branches must add (the same K on each,
 * referred to the velocity in that branch's last segment: extra head K V^2 / 2g, V = q/A_last)
 * for the named branch to take `target` at the operating point with `pump`. Throttling the
 * others raises the head at the split, so the named branch's flow and share grow with K (for a
 * falling pump curve): K is the root of q_t(K) - target, bracketed by K = 0 and K = 1, 10, ...
 * up to 1e6 and refined by findRootBracketed (Illinois regula falsi; Dowell & Jarratt 1971).
 * The valve's own K is what a valve maker's chart or Crane TP-410 relates to its opening.
 * Throws HydraulicsInputError: `/branch` unknown; `/flow` or `/share` not reachable (the branch
 * takes more unthrottled: throttle it instead; or more than K = 1e6 gives); `/pump` no operating point.
 * @param system a compiled branched system (its present valves are kept; the new K adds to them)
 * @param pump the pump's head curve (HeadCurve)
 * @param branch the name of the branch to balance
 * @param target its wanted flow, m3/s, or share of the total flow
 * @returns K, dimensionless (>= 0)
 * @example
 * const pipe = (length) => [{ length, insideDiameter: 0.05, hazenWilliamsC: 140 }];
 * const pond = compileBranchedSystem({ frictionMethod: 'hazen-williams', segments: pipe(10), branches: [{ name: 'falls', staticHead: 4, segments: pipe(30) }, { name: 'stream', staticHead: 1, segments: pipe(60) }] });
 * const pump = { headCoefficients: [12, 0, -12 / 0.012 ** 2], flowMin: 0, flowMax: 0.012 };
 * balancingValveK(pond, pump, 'falls', { flow: 0.004 }) // => 55.27
 */
export function balancingValveK(
  system: CompiledBranchedSystem,
  pump: HeadCurve,
  branch: string,
  target: BranchTarget,
): number {
  const index = branchIndex(system, branch, '/branch');
  const field = 'flow' in target ? '/flow' : '/share';
  const wanted =
    'flow' in target
      ? requirePositive(target.flow, field, 'wanted branch flow')
      : requirePositive(target.share, field, 'wanted share');
  if ('share' in target && wanted >= 1) {
    throw new HydraulicsInputError({
      code: 'out-of-range',
      params: { what: 'wanted share', value: wanted, min: 0, max: 1 },
      pointer: field,
    });
  }
  const flows = new Float64Array(system.branches.length);
  const shortfall = (k: number): number => {
    const valves = system.branches.map(
      (other, at) =>
        system.valveCoefficients[at] +
        (at === index ? 0 : k / (2 * STANDARD_GRAVITY * other.lastSegmentArea * other.lastSegmentArea)),
    );
    const valved = system.withValves(valves);
    const point = solveOperatingPoint(pump, valved);
    if (!point.ok) {
      throw new HydraulicsInputError({
        code: 'no-operating-point-with-valve',
        params: { valveK: k },
        pointer: '/pump',
      });
    }
    valved.splitAt(point.flow, flows);
    return ('flow' in target ? flows[index] : flows[index] / point.flow) - wanted;
  };
  const unthrottled = shortfall(0);
  if (unthrottled >= 0) {
    if (unthrottled === 0) return 0;
    throw new HydraulicsInputError({
      code: 'branch-target-unreachable',
      params: { branch, valveK: 0 },
      pointer: field,
    });
  }
  let low = 0;
  let high = 1;
  while (shortfall(high) < 0) {
    if (high >= SYSTEM_INPUT_LIMITS.maxK) {
      throw new HydraulicsInputError({
        code: 'branch-target-unreachable',
        params: { branch, valveK: high },
        pointer: field,
      });
    }
    low = high;
    high *= 10;
  }
  return findRootBracketed(shortfall, low, high);
}

/** The total flows (m3/s) between which a branch's flow stays in its band. */
export interface TotalFlowBand {
  totalFlowMin: number;
  totalFlowMax: number;
}

/**
 * The range of total flow Q for which the named branch's flow lies in [flowMin, flowMax]. The
 * branch flow rises with Q (H_j rises with Q), so the range is found by inverting once: the split
 * head at which the branch takes q is H = z + p + h(q) (with any valve), and the total flow there
 * is sum_i q_i(H) (the continuity of compileBranchedSystem). flowMin = 0 gives totalFlowMin = 0 (a
 * dry branch is inside). Throws HydraulicsInputError at `/branch`, `/flowMin` or `/flowMax`.
 * @param system a compiled branched system (with any valves)
 * @param branch the name of the branch
 * @param flowMin m3/s (>= 0)
 * @param flowMax m3/s (> 0, >= flowMin)
 * @returns the total flows, m3/s, between which the branch's flow is in the band
 * @example
 * const pipe = (length) => [{ length, insideDiameter: 0.05, hazenWilliamsC: 140 }];
 * const pond = compileBranchedSystem({ frictionMethod: 'hazen-williams', segments: pipe(10), branches: [{ name: 'falls', staticHead: 4, segments: pipe(30) }, { name: 'stream', staticHead: 1, segments: pipe(60) }] });
 * branchDutyBand(pond, 'falls', 0.001, 0.002).totalFlowMin // => 0.0040373
 */
export function branchDutyBand(
  system: CompiledBranchedSystem,
  branch: string,
  flowMin: number,
  flowMax: number,
): TotalFlowBand {
  const index = branchIndex(system, branch, '/branch');
  requireNonNegative(flowMin, '/flowMin', 'lowest branch flow');
  requirePositive(flowMax, '/flowMax', 'highest branch flow');
  if (flowMin > flowMax) {
    throw new HydraulicsInputError({
      code: 'out-of-range',
      params: { what: 'lowest branch flow', value: flowMin, min: 0, max: flowMax },
      pointer: '/flowMin',
    });
  }
  const flows = new Float64Array(system.branches.length);
  const curve = system.branches[index].curve;
  const valve = system.valveCoefficients[index];
  const totalAt = (flow: number) => system.flowsAtJunctionHead(curve.evaluate(flow) + valve * flow * flow, flows);
  return { totalFlowMin: flowMin === 0 ? 0 : totalAt(flowMin), totalFlowMax: totalAt(flowMax) };
}
