import type { EngineIssue } from './engine-issues';
import { HydraulicsInputError } from './hydraulics-error';
import { type HeadCurve, type NoOperatingPointReason, solveOperatingPoint } from './operating-point';
import { polynomialScaled, polynomialValue } from './polynomial';
import { findRootBracketed } from './root-finding';
import type { CompiledSystemCurve } from './system-curve';

/*
 * Several pumps on one system. Parallel: flows add at equal head. Series:
 * heads add at equal flow. Source: I. J. Karassik et al., Pump Handbook,
 * 4th ed. (2008), ch. 10 (pumps in systems); any fluid-mechanics text
 * (e.g. White, Fluid Mechanics, section 11.5). Check valves are assumed on
 * each parallel pump, so a pump that cannot reach the common head delivers
 * nothing instead of running backwards.
 */

export type ArrangementResult =
  | {
      ok: true;
      totalFlow: number;
      head: number;
      /** Flow of each running pump, m3/s (0 for a pump that cannot reach the common head). */
      pumpFlows: number[];
    }
  | { ok: false; reason: NoOperatingPointReason; issue: EngineIssue };

function requireCount(value: number, field: string, min: number): void {
  if (!Number.isInteger(value) || value < min) {
    throw new HydraulicsInputError({
      code: 'not-whole-number',
      params: { what: field.slice(1), value, min },
      pointer: field,
    });
  }
}

/**
 * Combined curve of `running` identical pumps in parallel:
 * H(Q) = h(Q/m), i.e. coefficient k divided by m^k, range multiplied by m.
 */
export function parallelHeadCurve(pump: HeadCurve, running: number): HeadCurve {
  requireCount(running, '/running', 1);
  return {
    headCoefficients: polynomialScaled(pump.headCoefficients, 1, running),
    flowMin: pump.flowMin * running,
    flowMax: pump.flowMax * running,
  };
}

/** Combined curve of `count` identical pumps in series: H(Q) = n h(Q), same flow range. */
export function seriesHeadCurve(pump: HeadCurve, count: number): HeadCurve {
  requireCount(count, '/count', 1);
  return {
    headCoefficients: polynomialScaled(pump.headCoefficients, count, 1),
    flowMin: pump.flowMin,
    flowMax: pump.flowMax,
  };
}

/**
 * `installed` identical pumps in parallel with `running` of them on
 * (one failed: running = installed - 1). Each running pump delivers Q/m at
 * the common head.
 */
export function solveParallelIdentical(
  pump: HeadCurve,
  system: CompiledSystemCurve,
  installed: number,
  running: number,
): ArrangementResult & { installed: number; running: number } {
  requireCount(installed, '/installed', 1);
  requireCount(running, '/running', 1);
  if (running > installed) {
    throw new HydraulicsInputError({
      code: 'running-exceeds-installed',
      params: { running, installed },
      pointer: '/running',
    });
  }
  const point = solveOperatingPoint(parallelHeadCurve(pump, running), system);
  if (!point.ok) {
    return { ...point, installed, running };
  }
  return {
    ok: true,
    totalFlow: point.flow,
    head: point.head,
    pumpFlows: new Array<number>(running).fill(point.flow / running),
    installed,
    running,
  };
}

/** `count` identical pumps in series: heads add at the common flow. */
export function solveSeries(pump: HeadCurve, system: CompiledSystemCurve, count: number): ArrangementResult {
  const point = solveOperatingPoint(seriesHeadCurve(pump, count), system);
  if (!point.ok) {
    return point;
  }
  return { ok: true, totalFlow: point.flow, head: point.head, pumpFlows: new Array<number>(count).fill(point.flow) };
}

/** Flow at which a non-increasing curve delivers `head`, inside [0, flowMax]; 0 at or above shut-off. */
function flowAtHead(pump: HeadCurve, head: number): number {
  if (head >= polynomialValue(pump.headCoefficients, 0)) {
    return 0;
  }
  return findRootBracketed((flow) => polynomialValue(pump.headCoefficients, flow) - head, 0, pump.flowMax);
}

/** Flow at which the system needs `head`; 0 at or below its static head. */
function systemFlowAtHead(system: CompiledSystemCurve, head: number, guess: number): number {
  if (head <= system.staticHead) {
    return 0;
  }
  let upper = guess;
  while (system.evaluate(upper) < head) {
    upper *= 2;
  }
  return findRootBracketed((flow) => system.evaluate(flow) - head, 0, upper);
}

/**
 * Unequal pumps in parallel (each curve must start at zero flow). Solves the
 * common head H at which sum_i Q_i(H) equals the system's flow at H; a pump
 * whose shut-off head is below H delivers 0 and is reported so.
 * No solution: 'below-static-head' if no pump reaches the static head,
 * 'beyond-curve' if some pump would have to run past its last point.
 */
export function solveParallelUnequal(pumps: readonly HeadCurve[], system: CompiledSystemCurve): ArrangementResult {
  if (pumps.length === 0) {
    throw new HydraulicsInputError({ code: 'no-pumps', params: {}, pointer: '/pumps' });
  }
  pumps.forEach((pump, index) => {
    if (pump.flowMin !== 0) {
      throw new HydraulicsInputError({ code: 'parallel-needs-shut-off', params: {}, pointer: `/pumps/${index}` });
    }
  });
  const shutOffs = pumps.map((pump) => polynomialValue(pump.headCoefficients, 0));
  const highest = Math.max(...shutOffs);
  if (highest <= system.staticHead) {
    return {
      ok: false,
      reason: 'below-static-head',
      issue: {
        code: 'highest-shut-off-below-static-head',
        params: { shutOffHead: highest, staticHead: system.staticHead },
      },
    };
  }
  const lowest = Math.max(...pumps.map((pump) => polynomialValue(pump.headCoefficients, pump.flowMax)));
  const flowGuess = pumps.reduce((sum, pump) => sum + pump.flowMax, 0);
  const surplus = (head: number) =>
    pumps.reduce((sum, pump) => sum + flowAtHead(pump, head), 0) - systemFlowAtHead(system, head, flowGuess);
  if (surplus(lowest) < 0) {
    return {
      ok: false,
      reason: 'beyond-curve',
      issue: { code: 'arrangement-run-out', params: {} },
    };
  }
  const head = findRootBracketed(surplus, lowest, highest);
  const pumpFlows = pumps.map((pump) => flowAtHead(pump, head));
  return { ok: true, totalFlow: pumpFlows.reduce((sum, flow) => sum + flow, 0), head, pumpFlows };
}
