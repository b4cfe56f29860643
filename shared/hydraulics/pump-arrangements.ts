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

function requireCount(value: number, field: string, what: string, min: number): void {
  if (!Number.isInteger(value) || value < min) {
    throw new HydraulicsInputError({
      code: 'not-whole-number',
      params: { what, value, min },
      pointer: field,
    });
  }
}

/**
 * Combined curve of `running` identical pumps in parallel:
 * H(Q) = h(Q/m), i.e. coefficient k divided by m^k, range multiplied by m (flows add at equal
 * head; Karassik, Pump Handbook, 4th ed., ch. 10). Valid for identical pumps with check valves.
 * @param pump - head coefficients (m, ascending powers of m3/s) and published flow range, m3/s
 * @param running - number of pumps running, a whole number >= 1
 * @returns the combined head curve, same units
 * @example
 * // exact: the Q^2 coefficient divided by 2^2, the range doubled
 * const pump = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * parallelHeadCurve(pump, 2).headCoefficients[2] // => -31250
 * parallelHeadCurve(pump, 2).flowMax // => 0.016
 */
export function parallelHeadCurve(pump: HeadCurve, running: number): HeadCurve {
  requireCount(running, '/running', 'running pumps', 1);
  return {
    headCoefficients: polynomialScaled(pump.headCoefficients, 1, running),
    flowMin: pump.flowMin * running,
    flowMax: pump.flowMax * running,
  };
}

/**
 * Combined curve of `count` identical pumps in series: H(Q) = n h(Q), same flow range (heads add
 * at equal flow; Karassik, Pump Handbook, 4th ed., ch. 10).
 * @param pump - head coefficients (m, ascending powers of m3/s) and published flow range, m3/s
 * @param count - number of pumps in series, a whole number >= 1
 * @returns the combined head curve, same units
 * @example
 * // exact: every coefficient doubled
 * const pump = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * seriesHeadCurve(pump, 2).headCoefficients[0] // => 20
 * seriesHeadCurve(pump, 2).headCoefficients[2] // => -250000
 */
export function seriesHeadCurve(pump: HeadCurve, count: number): HeadCurve {
  requireCount(count, '/count', 'pump count', 1);
  return {
    headCoefficients: polynomialScaled(pump.headCoefficients, count, 1),
    flowMin: pump.flowMin,
    flowMax: pump.flowMax,
  };
}

/**
 * `installed` identical pumps in parallel with `running` of them on
 * (one failed: running = installed - 1). Each running pump delivers Q/m at
 * the common head: solveOperatingPoint on parallelHeadCurve (Karassik, Pump Handbook, 4th ed.,
 * ch. 10; the handbook's rule that the survivors run further right on the same system curve).
 * @param pump - head coefficients (m, ascending powers of m3/s) and published flow range, m3/s
 * @param system - a compiled system curve (compileSystemCurve)
 * @param installed - pumps installed, a whole number >= 1
 * @param running - pumps running, 1 to installed
 * @returns total flow (m3/s), common head (m) and each pump's flow, or why there is no point
 * @example
 * // the pump and 3 m system of solveOperatingPoint's example; python3 brentq on
 * // 10 - 125000 (Q/2)^2 = H_system(Q) gives Q = 6.32395 L/s; one failed: the single-pump 5.06946 L/s
 * const pump = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * const system = compileSystemCurve({ staticHead: 3, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 4 }, { kind: 'exit', count: 1 }] }], frictionMethod: 'hazen-williams' })
 * const both = solveParallelIdentical(pump, system, 2, 2)
 * both.totalFlow // => 0.00632395
 * both.pumpFlows[0] // => 0.00316197
 * solveParallelIdentical(pump, system, 2, 1).totalFlow // => 0.00506946
 */
export function solveParallelIdentical(
  pump: HeadCurve,
  system: CompiledSystemCurve,
  installed: number,
  running: number,
): ArrangementResult & { installed: number; running: number } {
  requireCount(installed, '/installed', 'installed pumps', 1);
  requireCount(running, '/running', 'running pumps', 1);
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

/**
 * `count` identical pumps in series: heads add at the common flow (solveOperatingPoint on
 * seriesHeadCurve; Karassik, Pump Handbook, 4th ed., ch. 10).
 * @param pump - head coefficients (m, ascending powers of m3/s) and published flow range, m3/s
 * @param system - a compiled system curve (compileSystemCurve)
 * @param count - pumps in series, a whole number >= 1
 * @returns the common flow (m3/s), total head (m) and each pump's flow, or why there is no point
 * @example
 * // python3 brentq on 2 (10 - 125000 Q^2) = H_system(Q) gives Q = 6.57566 L/s, H = 9.19018 m
 * const pump = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * const system = compileSystemCurve({ staticHead: 3, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 4 }, { kind: 'exit', count: 1 }] }], frictionMethod: 'hazen-williams' })
 * solveSeries(pump, system, 2).totalFlow // => 0.00657566
 * solveSeries(pump, system, 2).head // => 9.19018
 */
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
 * 'beyond-curve' if some pump would have to run past its last point. Method: the Illinois
 * root finder (root-finding.ts) on the head; flows add at equal head (Karassik, Pump Handbook,
 * 4th ed., ch. 10). Valid for non-increasing curves that start at zero flow.
 * @param pumps - the pumps' head curves (m, ascending powers of m3/s), each from zero flow
 * @param system - a compiled system curve (compileSystemCurve)
 * @returns total flow (m3/s), common head (m) and each pump's flow, or why there is no point
 * @example
 * // a 10 m and an 8 m shut-off pump on the 3 m system of solveOperatingPoint's example;
 * // python3 brentq on the same formulas gives H = 7.73662 m, flows 4.25524 and 1.45157 L/s
 * const big = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * const small = { headCoefficients: [8, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * const system = compileSystemCurve({ staticHead: 3, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 4 }, { kind: 'exit', count: 1 }] }], frictionMethod: 'hazen-williams' })
 * const pair = solveParallelUnequal([big, small], system)
 * pair.head // => 7.73662
 * pair.pumpFlows[0] // => 0.00425524
 * pair.pumpFlows[1] // => 0.00145157
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
