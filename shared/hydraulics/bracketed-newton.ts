/** A function of one variable that reports its value and derivative together. */
export interface FunctionWithSlope {
  /** Writes f(x) into out[0] and df/dx into out[1]. */
  valueAndSlope(x: number, out: Float64Array): void;
}

/** When the safeguarded Newton iteration stops, in the unit of x. */
export interface NewtonStopping {
  /** A Newton step this small is taken as the last one. */
  readonly finalStep: number;
  /** A bracket this narrow ends the iteration at a bisection step. */
  readonly bracketWidth: number;
  readonly maxIterations: number;
}

export interface NewtonRoot {
  /** The root, in the unit of x. */
  root: number;
  /** Evaluations of the function made (1 or more). */
  iterations: number;
}

/** Value and slope of the current iterate (one solve runs at a time: JavaScript is single-threaded). */
const scratch = new Float64Array(2);

/**
 * The root of a falling function inside a bracket: f(low) > 0 > f(high), iterated from `start`
 * in (low, high). Each step is a Newton step x - f/f' while it stays inside the bracket, which
 * shrinks around the root at every evaluation; a step that would leave it, or a non-negative
 * slope, is replaced by bisection, so convergence is guaranteed. Newton converges quadratically,
 * so a step below `finalStep` leaves an error of about its square over the bracket. Source:
 * W. H. Press et al., Numerical Recipes, 3rd ed., Cambridge 2007, section 9.4 ("rtsafe").
 *
 * Valid for a function with a continuous derivative that falls across the bracket.
 *
 * @param fn - the function, falling across the bracket
 * @param low - left bracket end where f > 0, in the unit of x
 * @param high - right bracket end where f < 0, in the unit of x
 * @param start - first iterate, inside (low, high)
 * @param stopping - the stopping rules, in the unit of x
 * @returns the root (unit of x) and the number of evaluations
 * @example
 * // sqrt(2) = 1.41421356237...
 * const falling = { valueAndSlope: (x: number, out: Float64Array) => { out[0] = 2 - x * x; out[1] = -2 * x; } };
 * bracketedNewton(falling, 0, 2, 1, { finalStep: 1e-9, bracketWidth: 1e-12, maxIterations: 60 }).root // => 1.41421356237
 */
export function bracketedNewton(
  fn: FunctionWithSlope,
  low: number,
  high: number,
  start: number,
  stopping: NewtonStopping,
): NewtonRoot {
  let x = start;
  for (let iteration = 1; iteration <= stopping.maxIterations; iteration += 1) {
    fn.valueAndSlope(x, scratch);
    const value = scratch[0];
    if (value === 0) return { root: x, iterations: iteration };
    if (value > 0) low = x;
    else high = x;
    const slope = scratch[1];
    const newtonStep = slope < 0 ? -value / slope : Number.NaN;
    let next = x + newtonStep;
    if (Math.abs(newtonStep) <= stopping.finalStep) {
      return { root: next >= low && next <= high ? next : x, iterations: iteration };
    }
    if (!(next > low && next < high)) {
      next = 0.5 * (low + high);
      if (high - low <= stopping.bracketWidth) return { root: x, iterations: iteration };
    }
    x = next;
  }
  return { root: x, iterations: stopping.maxIterations };
}
