import { CubicHermiteTable, type CompiledSystemCurve } from '../../shared/hydraulics';

/** Node intervals of the system-curve table over the duty band. */
const BAND_TABLE_INTERVALS = 64;

/**
 * The system curve over the duty band as a cubic Hermite table (CubicHermiteTable) built from
 * the engine's exact head and slope at 65 nodes: every sign test and every solve of a pair in
 * band reads the system there, and a table costs a few multiplications where Hazen-Williams
 * costs a power and Darcy-Weisbach a friction-factor lookup per segment. Interpolation error of
 * a cubic Hermite is bounded by h^4 max|H''''| / 384 (de Boor, A Practical Guide to Splines,
 * 2001, ch. IV), far below 1e-9 of the head for these smooth curves; outside the band the
 * engine is used.
 */
export class BandSystemTable {
  private readonly table: CubicHermiteTable;

  constructor(
    private readonly system: CompiledSystemCurve,
    private readonly low: number,
    private readonly high: number,
  ) {
    this.table = new CubicHermiteTable(low, high, BAND_TABLE_INTERVALS, (flow, out) => system.headAndSlope(flow, out));
  }

  private inTable(flow: number): boolean {
    return flow >= this.low && flow <= this.high && this.table.step !== 0;
  }

  /** System head at `flow` (m3/s), m. */
  head(flow: number): number {
    return this.inTable(flow) ? this.table.value(flow) : this.system.evaluate(flow);
  }

  /** System head (m) at `flow` into out[0] and dH/dQ (m per m3/s) into out[1]. */
  headAndSlope(flow: number, out: Float64Array): void {
    if (this.inTable(flow)) {
      this.table.valueAndSlope(flow, out);
      return;
    }
    out[0] = this.system.evaluate(flow);
    out[1] = this.system.slope(flow);
  }
}
