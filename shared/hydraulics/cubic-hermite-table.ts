/**
 * A function tabulated on a uniform grid with its exact derivative at every node and read back
 * by cubic Hermite interpolation: on node interval [x_i, x_i+1] with t = (x - x_i)/h,
 *   p(t) = h00(t) y_i + h10(t) h y'_i + h01(t) y_i+1 + h11(t) h y'_i+1,
 * h00 = 2t^3 - 3t^2 + 1, h10 = t^3 - 2t^2 + t, h01 = -2t^3 + 3t^2, h11 = t^3 - t^2, and its
 * derivative p'(t)/h. Error bound h^4 max|y''''| / 384 (C. de Boor, A Practical Guide to Splines,
 * rev. ed., Springer 2001, ch. IV). Reading a table costs a floor and a dozen multiplications,
 * which is why the friction factor and the search's system curve are tabulated.
 *
 * The table does no range checks (it is read in solver loops): callers read only x in
 * [low, high]; the last interval serves x = high.
 *
 * @example
 * // exact: a cubic Hermite interpolant reproduces any cubic, so x^2 at 1.3 is 1.69
 * const square = new CubicHermiteTable(0, 2, 4, (x, out) => {
 *   out[0] = x * x;
 *   out[1] = 2 * x;
 * });
 * square.value(1.3) // => 1.69
 */
export class CubicHermiteTable {
  /** Node spacing h, in the unit of x. */
  readonly step: number;
  private readonly intervals: number;
  private readonly values: Float64Array;
  /** Derivatives at the nodes times the step, so an interval reads in t alone. */
  private readonly scaledSlopes: Float64Array;

  /**
   * @param low - first node, in the unit of x
   * @param high - last node (> low for a useful table; equal gives a table of one point)
   * @param intervals - number of node intervals (>= 1)
   * @param sample - writes y(x) into out[0] and dy/dx into out[1]
   */
  constructor(
    readonly low: number,
    readonly high: number,
    intervals: number,
    sample: (x: number, out: Float64Array) => void,
  ) {
    this.intervals = intervals;
    this.step = (high - low) / intervals;
    this.values = new Float64Array(intervals + 1);
    this.scaledSlopes = new Float64Array(intervals + 1);
    const out = new Float64Array(2);
    for (let node = 0; node <= intervals; node += 1) {
      sample(low + node * this.step, out);
      this.values[node] = out[0];
      this.scaledSlopes[node] = out[1] * this.step;
    }
  }

  /** The interpolated value at x in [low, high], in the unit of y. */
  value(x: number): number {
    const position = (x - this.low) / this.step;
    const node = Math.min(Math.floor(position), this.intervals - 1);
    const t = position - node;
    const t2 = t * t;
    const t3 = t2 * t;
    return (
      (2 * t3 - 3 * t2 + 1) * this.values[node] +
      (t3 - 2 * t2 + t) * this.scaledSlopes[node] +
      (-2 * t3 + 3 * t2) * this.values[node + 1] +
      (t3 - t2) * this.scaledSlopes[node + 1]
    );
  }

  /** The interpolated value at x in [low, high] into out[0] and its derivative dy/dx into out[1]. */
  valueAndSlope(x: number, out: Float64Array): void {
    const position = (x - this.low) / this.step;
    const node = Math.min(Math.floor(position), this.intervals - 1);
    const t = position - node;
    const t2 = t * t;
    const t3 = t2 * t;
    const y0 = this.values[node];
    const y1 = this.values[node + 1];
    const m0 = this.scaledSlopes[node];
    const m1 = this.scaledSlopes[node + 1];
    out[0] = (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * m0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * m1;
    out[1] =
      ((6 * t2 - 6 * t) * y0 + (3 * t2 - 4 * t + 1) * m0 + (-6 * t2 + 6 * t) * y1 + (3 * t2 - 2 * t) * m1) / this.step;
  }
}
