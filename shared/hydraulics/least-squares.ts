import { qr, usolve } from 'mathjs';

/**
 * Least-squares polynomial through points (x_i, y_i) using only the given
 * powers of x (e.g. [0, 1, 2] for a quadratic, [1, 2] for one through the
 * origin). Returns coefficients in ascending powers 0..max(powers), zero for
 * powers not used.
 *
 * Method: x is scaled by max|x| so the Vandermonde matrix is well conditioned,
 * the matrix is factored A = QR (mathjs `qr`, Householder), and R x = Q^T y is
 * solved by back substitution (mathjs `usolve`). Source: G. H. Golub,
 * C. F. Van Loan, Matrix Computations, 4th ed. (2013), section 5.3.
 * Needs at least as many points as powers, with distinct x.
 * @param xs - the points' x (for pump curves: flow, m3/s)
 * @param ys - the points' y, one per x (head m, efficiency 0-1, power W ...)
 * @param powers - the powers of x to fit, e.g. [0, 1, 2]
 * @returns coefficients in ascending powers 0..max(powers), in the units of y per x^k
 * @example
 * // exact: points on y = 1 + 2x; and on y = 192 x - 12800 x^2 through the origin (powers 1 and 2)
 * leastSquaresPolynomial([0, 1, 2, 3], [1, 3, 5, 7], [0, 1])[1] // => 2.00000000
 * leastSquaresPolynomial([0.0025, 0.005, 0.01], [0.4, 0.64, 0.64], [1, 2])[2] // => -12800.0000
 */
export function leastSquaresPolynomial(
  xs: readonly number[],
  ys: readonly number[],
  powers: readonly number[],
): number[] {
  const scale = Math.max(...xs.map(Math.abs)) || 1;
  const design = xs.map((x) => powers.map((power) => Math.pow(x / scale, power)));
  const { Q, R } = qr(design) as unknown as { Q: number[][]; R: number[][] };
  const columns = powers.length;
  const qty = Array.from({ length: columns }, (_, column) => ys.reduce((sum, y, row) => sum + Q[row][column] * y, 0));
  const upper = R.slice(0, columns).map((row) => row.slice(0, columns));
  const solution = usolve(upper, qty) as unknown as number[][];
  const coefficients = new Array<number>(Math.max(...powers) + 1).fill(0);
  powers.forEach((power, index) => {
    coefficients[power] = solution[index][0] / Math.pow(scale, power);
  });
  return coefficients;
}
