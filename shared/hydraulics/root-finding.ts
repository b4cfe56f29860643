/**
 * Root of a continuous function on a bracket [lo, hi] where fn(lo) and
 * fn(hi) have opposite signs (or one is zero), by the Illinois variant of
 * regula falsi: superlinear (order ~1.44) and always convergent because the
 * root stays bracketed. Source: M. Dowell, P. Jarratt, "A modified regula
 * falsi method for computing the root of an equation", BIT 11, 168-174 (1971).
 * Stops when the bracket is narrower than `tolerance` (default 1e-13 of the
 * larger bracket end) or fn is exactly zero; a bracket without a sign change -> RangeError.
 * @param fn - the function, continuous on [lo, hi]
 * @param lo - left end of the bracket, in the unit of x
 * @param hi - right end of the bracket, in the unit of x
 * @param tolerance - the bracket width that ends the search, in the unit of x
 * @returns the root, in the unit of x
 * @example
 * // sqrt(2) = 1.41421356237...
 * findRootBracketed((x) => x * x - 2, 0, 2) // => 1.41421356237
 */
export function findRootBracketed(
  fn: (x: number) => number,
  lo: number,
  hi: number,
  tolerance = 1e-13 * Math.max(Math.abs(lo), Math.abs(hi), Number.MIN_VALUE),
): number {
  let a = lo;
  let b = hi;
  let fa = fn(a);
  let fb = fn(b);
  if (fa === 0) {
    return a;
  }
  if (fb === 0) {
    return b;
  }
  if (Math.sign(fa) === Math.sign(fb)) {
    throw new RangeError(`findRootBracketed: no sign change on [${lo}, ${hi}]`);
  }
  let retained = 0;
  for (let iteration = 0; iteration < 200 && Math.abs(b - a) > tolerance; iteration += 1) {
    const c = (a * fb - b * fa) / (fb - fa);
    const fc = fn(c);
    if (fc === 0) {
      return c;
    }
    if (Math.sign(fc) === Math.sign(fb)) {
      b = c;
      fb = fc;
      if (retained === -1) {
        fa /= 2;
      }
      retained = -1;
    } else {
      a = c;
      fa = fc;
      if (retained === 1) {
        fb /= 2;
      }
      retained = 1;
    }
  }
  return Math.abs(fa) < Math.abs(fb) ? a : b;
}
