import { bracketedNewton, type FunctionWithSlope } from './bracketed-newton';
import type { CompiledSystemCurve } from './system-curve';

/*
 * The flow split of a branched system (see branched-system.ts) by a nested safeguarded Newton
 * solve: the branch flows at a head at the split, and the head at the split for a total flow.
 */

/** Head needed at the split minus the split's head, for one branch of the current inner solve. */
class BranchShortfall implements FunctionWithSlope {
  curve: CompiledSystemCurve | null = null;
  valve = 0;
  junctionHead = 0;
  /** dH_needed/dq at the last evaluation, m per m3/s. */
  lastSlope = 0;
  private readonly needed = new Float64Array(2);

  valueAndSlope(flow: number, out: Float64Array): void {
    (this.curve as CompiledSystemCurve).headAndSlope(flow, this.needed);
    this.lastSlope = this.needed[1] + 2 * this.valve * flow;
    out[0] = this.junctionHead - this.needed[0] - this.valve * flow * flow;
    out[1] = -this.lastSlope;
  }
}

const shortfall = new BranchShortfall();

const inner = { finalStep: 0, bracketWidth: 0, maxIterations: 60 };

/** Stopping for a branch flow near `scale` (m3/s): a last Newton step of 1e-7 of it leaves ~1e-14 of it. */
function innerStopping(scale: number): typeof inner {
  inner.finalStep = 1e-7 * scale;
  inner.bracketWidth = 1e-13 * scale;
  return inner;
}

/**
 * The nested solve. Inner: branch i's flow at a split head H is the root of
 * H - z_i - p_i - h_i(q) - e_i q^2, falling in q, by bracketedNewton on [0, upper] from
 * the parabola through 0 and the upper end; dq_i/dH = 1 / (dh_i/dq + 2 e_i q). Outer: H_j at total
 * flow Q is the root of Q - sum_i q_i(H), falling in H, by bracketedNewton with slope
 * -sum_i dq_i/dH, bracketed by the lowest outlet head (no flow) and min_i of the head branch i
 * needs to pass all of Q (there that branch alone takes Q). Inner solves stop at a Newton step of
 * 1e-7 of the flow (error ~1e-14 of it), the outer at 1e-12 of its bracket or the heads' rounding.
 * Source of the method: Press et al., Numerical Recipes, 3rd ed. (2007), section 9.4 ("rtsafe"),
 * applied to the continuity equation of branched-system.ts.
 */
export class SplitSolver implements FunctionWithSlope {
  readonly flows: Float64Array;
  /** dq_i/dH at the last evaluation, m3/s per m. */
  private readonly flowSlopes: Float64Array;
  /** Head branch i needs to pass the whole of the current total flow, m. */
  private readonly wholeFlowHeads: Float64Array;
  private readonly outletHeads: Float64Array;
  private totalFlow = 0;
  /** d(sum q)/dH at the last outer evaluation, m3/s per m. */
  lastFlowSlope = 0;
  /** The split head of the last outer evaluation, and whether `flows` hold its flows for this solve. */
  private lastHead = 0;
  private warm = false;

  constructor(
    private readonly curves: readonly CompiledSystemCurve[],
    private readonly valves: readonly number[],
  ) {
    this.flows = new Float64Array(curves.length);
    this.flowSlopes = new Float64Array(curves.length);
    this.wholeFlowHeads = new Float64Array(curves.length);
    this.outletHeads = Float64Array.from(curves, (curve) => curve.staticHead);
  }

  get lowestOutletHead(): number {
    return Math.min(...this.outletHeads);
  }

  neededHead(branch: number, flow: number): number {
    return this.curves[branch].evaluate(flow) + this.valves[branch] * flow * flow;
  }

  /** Branch flow at `junctionHead` given a flow `upper` whose needed head `upperHead` is at least it. */
  private branchFlow(branch: number, junctionHead: number, upper: number, upperHead: number): number {
    const outlet = this.outletHeads[branch];
    if (junctionHead <= outlet) {
      this.flowSlopes[branch] = 0;
      return 0;
    }
    shortfall.curve = this.curves[branch];
    shortfall.valve = this.valves[branch];
    shortfall.junctionHead = junctionHead;
    // Within one outer solve, the last flow moved along its slope is a close first iterate.
    let start = this.flows[branch] + this.flowSlopes[branch] * (junctionHead - this.lastHead);
    if (!(this.warm && this.flows[branch] > 0 && start > 0 && start < upper)) {
      start = upper * Math.sqrt((junctionHead - outlet) / (upperHead - outlet));
    }
    // The bracket's end widened by a hair (still f <= 0 there), so a root at `upper` is not lost to rounding.
    const end = upper * (1 + 1e-9);
    let root = bracketedNewton(shortfall, 0, end, start, innerStopping(start)).root;
    // A small branch beside a large total: the tolerance follows the flow found, not the first guess.
    if (root < 0.5 * start) root = bracketedNewton(shortfall, 0, end, root, innerStopping(root)).root;
    this.flowSlopes[branch] = 1 / shortfall.lastSlope;
    return root;
  }

  /** The outer function: Q - sum q_i(H) and its slope; writes out last, as the inner solves share bracketedNewton's scratch. */
  valueAndSlope(junctionHead: number, out: Float64Array): void {
    let sum = 0;
    let slope = 0;
    for (let branch = 0; branch < this.curves.length; branch += 1) {
      const flow = this.branchFlow(branch, junctionHead, this.totalFlow, this.wholeFlowHeads[branch]);
      this.flows[branch] = flow;
      sum += flow;
      slope += this.flowSlopes[branch];
    }
    this.lastFlowSlope = slope;
    this.lastHead = junctionHead;
    this.warm = true;
    out[0] = this.totalFlow - sum;
    out[1] = -slope;
  }

  /** H_j at total flow Q; the branch flows stay in `flows` (at H_j itself when `exactFlows`). */
  junctionHead(totalFlow: number, exactFlows: boolean): number {
    const low = this.lowestOutletHead;
    if (!(totalFlow > 0)) {
      this.flows.fill(0);
      // Flow starts in the lowest branches; one with zero slope at zero flow makes dH_j/dQ zero.
      this.lastFlowSlope = this.curves.reduce(
        (sum, curve, branch) => (this.outletHeads[branch] === low ? sum + 1 / curve.slope(0) : sum),
        0,
      );
      return low;
    }
    this.totalFlow = totalFlow;
    this.warm = false;
    let high = Number.POSITIVE_INFINITY;
    let resistance = 0;
    for (let branch = 0; branch < this.curves.length; branch += 1) {
      this.wholeFlowHeads[branch] = this.neededHead(branch, totalFlow);
      high = Math.min(high, this.wholeFlowHeads[branch]);
      resistance += 1 / Math.sqrt(this.wholeFlowHeads[branch] - low);
    }
    // First iterate: every branch a parabola from the lowest outlet, sum_i Q sqrt((H - low)/r_i) = Q.
    const start = low + 1 / (resistance * resistance);
    // Widened as in branchFlow: when one branch takes the whole flow the root is `high` itself.
    // The last step is 1e-12 of the bracket (the split can sit just past a branch's onset, where
    // the sum of flows bends sharply), but no finer than the heads' own rounding.
    const rounding = 1e-15 * Math.max(Math.abs(low), Math.abs(high));
    const { root } = bracketedNewton(this, low, high + 1e-9 * (high - low), start, {
      finalStep: Math.max(1e-12 * (high - low), rounding),
      bracketWidth: Math.max(1e-13 * (high - low), rounding),
      maxIterations: 60,
    });
    if (exactFlows) this.flowsAtHead(root);
    return root;
  }

  /** Total flow at a split head, each branch bracketed by doubling from the current total flow. */
  flowsAtHead(junctionHead: number): number {
    this.warm = false;
    let sum = 0;
    for (let branch = 0; branch < this.curves.length; branch += 1) {
      let upper = this.totalFlow > 0 ? this.totalFlow : 1e-3;
      let upperHead = this.neededHead(branch, upper);
      while (upperHead < junctionHead) {
        upper *= 2;
        upperHead = this.neededHead(branch, upper);
      }
      this.flows[branch] = this.branchFlow(branch, junctionHead, upper, upperHead);
      sum += this.flows[branch];
    }
    return sum;
  }
}
