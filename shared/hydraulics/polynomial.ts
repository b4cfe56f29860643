/*
 * Polynomials in ascending powers, c[0] + c[1] x + c[2] x^2 + ...
 * Pump curves are stored in this form (SI: x = flow in m3/s).
 */

/** Value by Horner's rule. */
export function polynomialValue(coefficients: readonly number[], x: number): number {
  let value = 0;
  for (let power = coefficients.length - 1; power >= 0; power -= 1) {
    value = value * x + coefficients[power];
  }
  return value;
}

/** Coefficients of the derivative. */
export function polynomialDerivative(coefficients: readonly number[]): number[] {
  return coefficients.slice(1).map((coefficient, index) => coefficient * (index + 1));
}

/**
 * Real roots of a polynomial of degree <= 2 lying strictly inside (lo, hi),
 * ascending. Used for the stationary points of quadratic and cubic curves.
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
 * that never rises.
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

/** Flow in [lo, hi] where a polynomial of degree <= 3 is largest, and that value. */
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
 * the stretch of a curve by `argumentFactor` along x and `valueFactor` in value.
 */
export function polynomialScaled(
  coefficients: readonly number[],
  valueFactor: number,
  argumentFactor: number,
): number[] {
  return coefficients.map((coefficient, power) => (coefficient * valueFactor) / Math.pow(argumentFactor, power));
}
