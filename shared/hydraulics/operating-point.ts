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
  | { ok: false; reason: NoOperatingPointReason; message: string };

const MAX_ITERATIONS = 60;
/** System head and slope of the current iterate (one solve runs at a time: JavaScript is single-threaded). */
const systemScratch = new Float64Array(2);

/**
 * Solves H_pump(Q) = H_system(Q) for Q in [flowMin, flowMax].
 *
 * Method: safeguarded Newton on d(Q) = H_pump(Q) - H_system(Q). The bracket
 * [flowMin, flowMax] is checked first (d >= 0 at the left end, d <= 0 at the
 * right end, else a reason is returned); the first iterate is the
 * regula-falsi point of that bracket in Q^2 (pump and system curves are both
 * close to parabolas); each Newton step that would leave the current bracket
 * (or meets a non-negative slope) is replaced by bisection, so convergence is
 * guaranteed; the bracket shrinks around the root at every step. Pump head
 * and slope come from one Horner pass, the system's from one call of its
 * compiled headAndSlope. A Newton step below 1e-7 of flowMax is taken as the
 * last: Newton converges quadratically, so it leaves an error of order 1e-14
 * of flowMax (typically 3-4 iterations in all). Source: W. H. Press et al.,
 * Numerical Recipes, 3rd ed. (2007), section 9.4 ("rtsafe").
 */
export function solveOperatingPoint(pump: HeadCurve, system: CompiledSystemCurve): OperatingPointResult {
  const coefficients = pump.headCoefficients;
  const top = coefficients.length - 1;
  let lo = pump.flowMin;
  let hi = pump.flowMax;
  const tolerance = 1e-12 * hi;
  const finalStep = 1e-7 * hi;

  let pumpLo = 0;
  for (let power = top; power >= 0; power -= 1) {
    pumpLo = pumpLo * lo + coefficients[power];
  }
  const differenceLo = pumpLo - system.evaluate(lo);
  if (differenceLo < 0) {
    return lo === 0
      ? {
          ok: false,
          reason: 'below-static-head',
          message: `shut-off head ${pumpLo.toFixed(2)} m is below the system's static head ${system.staticHead.toFixed(2)} m`,
        }
      : {
          ok: false,
          reason: 'before-curve',
          message: 'the curves would cross before the first published point of the pump curve',
        };
  }
  let pumpHi = 0;
  for (let power = top; power >= 0; power -= 1) {
    pumpHi = pumpHi * hi + coefficients[power];
  }
  const differenceHi = pumpHi - system.evaluate(hi);
  if (differenceHi > 0) {
    return {
      ok: false,
      reason: 'beyond-curve',
      message: 'the curves would cross past the last published point of the pump curve (run-out)',
    };
  }
  if (differenceLo === 0) {
    return { ok: true, flow: lo, head: pumpLo, iterations: 0 };
  }
  if (differenceHi === 0) {
    return { ok: true, flow: hi, head: pumpHi, iterations: 0 };
  }

  // regula falsi in Q^2: both curves are close to parabolas in Q, so this first guess is close
  let flow = Math.sqrt(lo * lo + ((hi * hi - lo * lo) * differenceLo) / (differenceLo - differenceHi));
  let head = Number.NaN;
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration += 1) {
    let pumpHead = 0;
    let pumpSlope = 0;
    for (let power = top; power >= 0; power -= 1) {
      pumpSlope = pumpSlope * flow + pumpHead;
      pumpHead = pumpHead * flow + coefficients[power];
    }
    head = pumpHead;
    system.headAndSlope(flow, systemScratch);
    const difference = pumpHead - systemScratch[0];
    if (difference === 0) {
      return { ok: true, flow, head, iterations: iteration };
    }
    if (difference > 0) {
      lo = flow;
    } else {
      hi = flow;
    }
    const slope = pumpSlope - systemScratch[1];
    const newtonStep = slope < 0 ? -difference / slope : Number.NaN;
    let next = flow + newtonStep;
    if (Math.abs(newtonStep) <= finalStep) {
      if (!(next >= lo && next <= hi)) {
        return { ok: true, flow, head, iterations: iteration };
      }
      let nextHead = 0;
      for (let power = top; power >= 0; power -= 1) {
        nextHead = nextHead * next + coefficients[power];
      }
      return { ok: true, flow: next, head: nextHead, iterations: iteration };
    }
    if (!(next > lo && next < hi)) {
      next = 0.5 * (lo + hi);
      if (hi - lo <= tolerance) {
        return { ok: true, flow, head, iterations: iteration };
      }
    }
    flow = next;
  }
  return { ok: true, flow, head, iterations: MAX_ITERATIONS };
}
