/*
 * Polynomials in ascending powers, c[0] + c[1] x + c[2] x^2 + ...
 * Pump curves are stored in this form (SI: x = flow in m3/s).
 */

/**
 * Value by Horner's rule, c0 + x (c1 + x (c2 + ...)): n multiplications for degree n (Knuth, The
 * Art of Computer Programming, vol. 2, 3rd ed., section 4.6.4).
 * @param coefficients - ascending powers, c[0] + c[1] x + ...
 * @param x - the argument, in the unit the coefficients take (m3/s for pump curves)
 * @returns the polynomial's value
 * @example
 * // exact: 10 - 125000 x 0.004^2
 * polynomialValue([10, 0, -125000], 0.004) // => 8
 */
export function polynomialValue(coefficients: readonly number[], x: number): number {
  let value = 0;
  for (let power = coefficients.length - 1; power >= 0; power -= 1) {
    value = value * x + coefficients[power];
  }
  return value;
}

/**
 * Coefficients of the derivative: d/dx sum c_k x^k = sum k c_k x^(k-1).
 * @param coefficients - ascending powers
 * @returns the derivative's coefficients, ascending powers (one fewer)
 * @example
 * // exact: d/dx (1 + 2x + 3x^2) = 2 + 6x
 * polynomialDerivative([1, 2, 3])[1] // => 6
 */
export function polynomialDerivative(coefficients: readonly number[]): number[] {
  return coefficients.slice(1).map((coefficient, index) => coefficient * (index + 1));
}

/**
 * Real roots of a polynomial of degree <= 2 lying strictly inside (lo, hi),
 * ascending. Used for the stationary points of quadratic and cubic curves. The quadratic
 * formula in its cancellation-free form q = -(b + sign(b) sqrt(b^2 - 4ac)) / 2, roots q/a and
 * c/q (Press et al., Numerical Recipes, 3rd ed., section 5.6); a leading coefficient below 1e-14
 * of the others over [0, hi] counts as zero.
 * @param coefficients - c, b, a of c + b x + a x^2 (ascending powers; missing ones are 0)
 * @param lo - lower end of the open interval
 * @param hi - upper end of the open interval
 * @returns the roots inside (lo, hi), ascending
 * @example
 * // exact: x^2 - 3x + 2 = (x - 1)(x - 2); only 2 lies inside (1.5, 3)
 * rootsOfAtMostQuadraticIn([2, -3, 1], 0, 3)[1] // => 2
 * rootsOfAtMostQuadraticIn([2, -3, 1], 1.5, 3).length // => 1
 */
export function rootsOfAtMostQuadraticIn(coefficients: readonly number[], lo: number, hi: number): number[] {
  const [c = 0, b = 0, a = 0] = coefficients;
  const scale = Math.max(Math.abs(a) * hi * hi, Math.abs(b) * hi, Math.abs(c));
  let roots: number[];
  if (Math.abs(a) * hi * hi <= 1e-14 * scale) {
    roots = Math.abs(b) * hi <= 1e-14 * scale ? [] : [-c / b];
  } else {
    const discriminant = b * b - 4 * a * c;
    if (discriminant < 0) {
      roots = [];
    } else {
      // the numerically stable pair of quadratic-formula roots
      const q = -0.5 * (b + Math.sign(b || 1) * Math.sqrt(discriminant));
      roots = q === 0 ? [0] : [q / a, c / q];
    }
  }
  return roots.filter((root) => root > lo && root < hi).sort((x, y) => x - y);
}

/**
 * Total rise of a polynomial of degree <= 3 over [lo, hi]: the sum of its
 * increases over the sub-intervals where it is increasing. Zero for a curve
 * that never rises. Method: the stationary points split [lo, hi] into monotone pieces.
 * @param coefficients - ascending powers (degree <= 3)
 * @param lo - lower end of the interval
 * @param hi - upper end of the interval
 * @returns the total rise, in the unit of the polynomial's value
 * @example
 * // exact: x^2 on [-1, 2] falls by 1, then rises by 4
 * totalRiseOver([0, 0, 1], -1, 2) // => 4
 * totalRiseOver([10, 0, -125000], 0, 0.008) // => 0
 */
export function totalRiseOver(coefficients: readonly number[], lo: number, hi: number): number {
  const breaks = [lo, ...rootsOfAtMostQuadraticIn(polynomialDerivative(coefficients), lo, hi), hi];
  let rise = 0;
  for (let index = 1; index < breaks.length; index += 1) {
    rise += Math.max(
      0,
      polynomialValue(coefficients, breaks[index]) - polynomialValue(coefficients, breaks[index - 1]),
    );
  }
  return rise;
}

/**
 * Flow in [lo, hi] where a polynomial of degree <= 3 is largest, and that value: the best of the
 * ends and the stationary points inside.
 * @param coefficients - ascending powers (degree <= 3)
 * @param lo - lower end of the interval
 * @param hi - upper end of the interval
 * @returns x of the maximum (unit of x) and the value there
 * @example
 * // exact: eta = 192 Q - 12800 Q^2 peaks at Q = 192 / 25600 = 0.0075 with 0.72
 * maximumOver([0, 192, -12800], 0, 0.01).x // => 0.0075
 * maximumOver([0, 192, -12800], 0, 0.01).value // => 0.72
 */
export function maximumOver(coefficients: readonly number[], lo: number, hi: number): { x: number; value: number } {
  const candidates = [lo, ...rootsOfAtMostQuadraticIn(polynomialDerivative(coefficients), lo, hi), hi];
  let best = { x: lo, value: polynomialValue(coefficients, lo) };
  for (const x of candidates) {
    const value = polynomialValue(coefficients, x);
    if (value > best.value) {
      best = { x, value };
    }
  }
  return best;
}

/**
 * Coefficients in powers of x of p(x - shift), given p's coefficients:
 * sum_k d_k (x - shift)^k expanded by the binomial theorem.
 * @param coefficients - ascending powers of p
 * @param shift - the shift, in the unit of x
 * @returns ascending powers of x of p(x - shift)
 * @example
 * // exact: (x - 1)^2 = 1 - 2x + x^2
 * polynomialShifted([0, 0, 1], 1)[0] // => 1
 * polynomialShifted([0, 0, 1], 1)[1] // => -2
 */
export function polynomialShifted(coefficients: readonly number[], shift: number): number[] {
  const result = new Array<number>(coefficients.length).fill(0);
  coefficients.forEach((coefficient, power) => {
    let binomial = 1;
    for (let j = 0; j <= power; j += 1) {
      // term of (x - shift)^power in x^j: C(power, j) (-shift)^(power - j)
      result[j] += coefficient * binomial * Math.pow(-shift, power - j);
      binomial = (binomial * (power - j)) / (j + 1);
    }
  });
  return result;
}

/**
 * Coefficients of v p(x / a), i.e. coefficient k multiplied by v / a^k:
 * the stretch of a curve by `argumentFactor` along x and `valueFactor` in value (the form the
 * affinity laws and parallel pumps take).
 * @param coefficients - ascending powers of p
 * @param valueFactor - v, the factor on the value
 * @param argumentFactor - a, the factor on x (non-zero)
 * @returns ascending powers of v p(x / a)
 * @example
 * // exact: half speed of H = 10 - 125000 Q^2 is 0.25 H(Q / 0.5) = 2.5 - 125000 Q^2
 * polynomialScaled([10, 0, -125000], 0.25, 0.5)[0] // => 2.5
 * polynomialScaled([10, 0, -125000], 0.25, 0.5)[2] // => -125000
 */
export function polynomialScaled(
  coefficients: readonly number[],
  valueFactor: number,
  argumentFactor: number,
): number[] {
  return coefficients.map((coefficient, power) => (coefficient * valueFactor) / Math.pow(argumentFactor, power));
}
