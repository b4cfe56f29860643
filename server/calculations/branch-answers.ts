import type {
  BalanceTarget,
  Balancing,
  BranchFlowSummary,
  CalculationUnits,
  SystemCurvePoint,
} from '../../shared/api/api-schemas';
import {
  balancingValveK,
  branchDutyBand,
  branchFlowsAt,
  flowToSI,
  systemBreakdown,
  type BranchSplit,
  type CompiledBranchedSystem,
  type HeadCurve,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { unprocessable, withRequestPointers } from './engine-problem';
import { answerUnits, requestValueText } from './request-units';

/* What a branched system's answers add: each branch's flow, the balancing valve, a branch's duty band. */

/** Why a throttling valve is a last resort and how to set it. */
const BALANCING_CAUTION =
  'a throttling valve wastes energy: the pump makes head that the valve burns; set it on site with a flow meter on the branch, since the K of a part-open valve depends on its make and opening';

/** Each branch's flow, velocities and warnings in a split (branchFlowsAt), in the request's units. */
export function branchFlowSummaries(split: BranchSplit, units: CalculationUnits): BranchFlowSummary[] {
  const to = answerUnits(units);
  const valueText = requestValueText(units);
  return split.branches.map((branch) => ({
    name: branch.name,
    flow: to.flow(branch.flow),
    velocity: to.length(branch.maxVelocity),
    velocities: branch.velocities.map((velocity) => to.length(velocity)),
    warnings: branch.issues.map((issue) => engineIssueText(issue, valueText)),
  }));
}

/**
 * A point of a branched system's curve at `flow` (SI; `flowInUnits` as asked): TDH, the common
 * run's friction, fittings and velocities, the head at the split and each branch. Its staticHead
 * and outletPressureHead are the lowest outlet's (the head at zero flow). Warnings other than
 * velocities (which the caller words per flow) go into `warnings`.
 */
export function branchedCurvePoint(
  system: CompiledBranchedSystem,
  flowInUnits: number,
  flow: number,
  units: CalculationUnits,
  warnings: Set<string>,
): SystemCurvePoint {
  const to = answerUnits(units);
  const split = branchFlowsAt(system, flow);
  const common = system.commonRun === null ? null : systemBreakdown(system.commonRun, flow);
  for (const issue of split.issues) if (issue.code !== 'segment-velocity') warnings.add(engineIssueText(issue));
  return {
    flow: flowInUnits,
    head: to.head(split.totalHead),
    staticHead: to.head(system.staticLift),
    outletPressureHead: to.head(system.outletPressureHead),
    frictionHead: to.head(common?.frictionHead ?? 0),
    minorHead: to.head(common?.minorHead ?? 0),
    velocities: split.commonVelocities.map((velocity) => to.length(velocity)),
    junctionHead: to.head(split.junctionHead),
    branches: branchFlowSummaries(split, units),
  };
}

/** Refuses a branch-level request on a system without branches. */
function requireBranched(branched: CompiledBranchedSystem | null, pointer: string): CompiledBranchedSystem {
  if (branched !== null) return branched;
  throw unprocessable(pointer, 'names a branch, but this system has no branches');
}

/**
 * The valve that gives `target.branch` its wanted flow at the operating point of `pumps`, the
 * combined head curve of the running pumps (identical ones in parallel or in series; balancingValveK: the same K on every other branch). Refusals are 422s under
 * `/body/balance` (or `/body/pump` when the valved system meets the pump nowhere).
 */
export function balancingAnswer(
  branched: CompiledBranchedSystem | null,
  pumps: HeadCurve,
  target: BalanceTarget,
  units: CalculationUnits,
): Balancing {
  const system = requireBranched(branched, '/body/balance/branch');
  const flow = flowToSI(target.flow, units.flow);
  const valveK = withRequestPointers(
    () => balancingValveK(system, pumps, target.branch, { flow }),
    (field) => (field.startsWith('/pump') ? `/body${field}` : `/body/balance${field}`),
    requestValueText(units),
  );
  return {
    branch: target.branch,
    flow: target.flow,
    valveK,
    valvesOn: system.branches.map((branch) => branch.name).filter((name) => name !== target.branch),
    caution: BALANCING_CAUTION,
  };
}

/**
 * The total flows (SI) between which the named branch's flow stays in [flowMin, flowMax] (SI):
 * branchDutyBand. Refusals are 422s under `/body/duty`.
 */
export function branchTotalFlowBand(
  branched: CompiledBranchedSystem | null,
  branch: string,
  flowMin: number,
  flowMax: number,
  units: CalculationUnits,
): { flowMin: number; flowMax: number } {
  const system = requireBranched(branched, '/body/duty/branch');
  const band = withRequestPointers(
    () => branchDutyBand(system, branch, flowMin, flowMax),
    (field) => `/body/duty${field}`,
    requestValueText(units),
  );
  return { flowMin: band.totalFlowMin, flowMax: band.totalFlowMax };
}
