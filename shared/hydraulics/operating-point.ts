import { bracketedNewton, type FunctionWithSlope } from './bracketed-newton';
import type { EngineIssue } from './engine-issues';
import type { CompiledSystemCurve } from './system-curve';

/*
 * The operating point: the flow at which the pump's head equals the head the
 * system needs, H_pump(Q) = H_system(Q), on the pump curve's valid range.
 */

/** The part of a pump curve the solver needs (a PumpCurveFit is one). */
export interface HeadCurve {
  /** Head, m, ascending powers of flow (m3/s). */
  readonly headCoefficients: readonly number[];
  readonly flowMin: number;
  readonly flowMax: number;
}

/**
 * Why there is no operating point:
 * - 'below-static-head': the pump's shut-off head does not reach the system's static head;
 * - 'before-curve': the curves would cross left of the first published point (curve starts above zero flow);
 * - 'beyond-curve': the curves would cross right of the last published point (run-out).
 */
export type NoOperatingPointReason = 'below-static-head' | 'before-curve' | 'beyond-curve';

export type OperatingPointResult =
  | { ok: true; flow: number; head: number; iterations: number }
  | { ok: false; reason: NoOperatingPointReason; issue: EngineIssue };

/** Pump head minus system head and its slope at a flow, for the pump and system of the current solve. */
class PumpSurplus implements FunctionWithSlope {
  coefficients: readonly number[] = [];
  system: CompiledSystemCurve | null = null;
  private readonly systemOut = new Float64Array(2);

  valueAndSlope(flow: number, out: Float64Array): void {
    const coefficients = this.coefficients;
    let pumpHead = 0;
    let pumpSlope = 0;
    for (let power = coefficients.length - 1; power >= 0; power -= 1) {
      pumpSlope = pumpSlope * flow + pumpHead;
      pumpHead = pumpHead * flow + coefficients[power];
    }
    (this.system as CompiledSystemCurve).headAndSlope(flow, this.systemOut);
    out[0] = pumpHead - this.systemOut[0];
    out[1] = pumpSlope - this.systemOut[1];
  }
}

const surplus = new PumpSurplus();

function pumpHeadAt(coefficients: readonly number[], flow: number): number {
  let head = 0;
  for (let power = coefficients.length - 1; power >= 0; power -= 1) {
    head = head * flow + coefficients[power];
  }
  return head;
}

/**
 * Solves H_pump(Q) = H_system(Q) for Q in [flowMin, flowMax].
 *
 * Method: safeguarded Newton (bracketedNewton) on d(Q) = H_pump(Q) - H_system(Q). The bracket
 * [flowMin, flowMax] is checked first (d >= 0 at the left end, d <= 0 at the right end, else a
 * reason is returned); the first iterate is the regula-falsi point of that bracket in Q^2 (pump
 * and system curves are both close to parabolas). Pump head and slope come from one Horner pass,
 * the system's from one call of its compiled headAndSlope. A Newton step below 1e-7 of flowMax is
 * taken as the last: it leaves an error of order 1e-14 of flowMax (typically 3-4 iterations in
 * all). Source: W. H. Press et al., Numerical Recipes, 3rd ed. (2007), section 9.4 ("rtsafe").
 * Validity: any head curve on [flowMin, flowMax] and any compiled system curve; the point is
 * never extrapolated outside the published flows.
 * @param pump - head coefficients (m, ascending powers of m3/s) and the published flow range, m3/s
 * @param system - a compiled system curve (compileSystemCurve)
 * @returns the operating point (flow m3/s, head m, evaluations made) or the reason there is none
 * @example
 * // pump H = 10 - 125000 Q^2 (m, m3/s) published to 8 L/s, on the 3 m lift of compileSystemCurve's
 * // example; python3 brentq on the same two formulas gives Q = 5.06946 L/s, H = 6.78758 m
 * const pump = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * const system = compileSystemCurve({ staticHead: 3, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-2', fittings: [{ kind: 'elbow-90-standard', count: 4 }, { kind: 'exit', count: 1 }] }], frictionMethod: 'hazen-williams' })
 * solveOperatingPoint(pump, system).flow // => 0.00506946
 * solveOperatingPoint(pump, system).head // => 6.78758
 * const tooHigh = compileSystemCurve({ staticHead: 12, segments: [{ length: 30, pipeSizeId: 'pvc-sch40-2' }], frictionMethod: 'hazen-williams' })
 * solveOperatingPoint(pump, tooHigh).reason // => 'below-static-head'
 */
export function solveOperatingPoint(pump: HeadCurve, system: CompiledSystemCurve): OperatingPointResult {
  const coefficients = pump.headCoefficients;
  const lo = pump.flowMin;
  const hi = pump.flowMax;

  const pumpLo = pumpHeadAt(coefficients, lo);
  const differenceLo = pumpLo - system.evaluate(lo);
  if (differenceLo < 0) {
    return lo === 0
      ? {
          ok: false,
          reason: 'below-static-head',
          issue: { code: 'shut-off-below-static-head', params: { shutOffHead: pumpLo, staticHead: system.staticHead } },
        }
      : {
          ok: false,
          reason: 'before-curve',
          issue: { code: 'crosses-before-curve', params: {} },
        };
  }
  const pumpHi = pumpHeadAt(coefficients, hi);
  const differenceHi = pumpHi - system.evaluate(hi);
  if (differenceHi > 0) {
    return {
      ok: false,
      reason: 'beyond-curve',
      issue: { code: 'crosses-beyond-curve', params: {} },
    };
  }
  if (differenceLo === 0) {
    return { ok: true, flow: lo, head: pumpLo, iterations: 0 };
  }
  if (differenceHi === 0) {
    return { ok: true, flow: hi, head: pumpHi, iterations: 0 };
  }

  const start = Math.sqrt(lo * lo + ((hi * hi - lo * lo) * differenceLo) / (differenceLo - differenceHi));
  surplus.coefficients = coefficients;
  surplus.system = system;
  const { root, iterations } = bracketedNewton(surplus, lo, hi, start, {
    finalStep: 1e-7 * hi,
    bracketWidth: 1e-12 * hi,
    maxIterations: 60,
  });
  surplus.system = null;
  return { ok: true, flow: root, head: pumpHeadAt(coefficients, root), iterations };
}
