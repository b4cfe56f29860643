import { bracketedNewton, type FunctionWithSlope } from '../../shared/hydraulics';
import { cubicAt } from './packed-curves';
import type { BandSystemTable } from './system-table';

/** Head of `running` identical pumps (a packed cubic at Q/m) minus the tabulated system head, and its slope. */
class CombinedSurplus implements FunctionWithSlope {
  coefficients: Float64Array = new Float64Array(0);
  offset = 0;
  running = 1;
  table: BandSystemTable | null = null;
  private readonly systemOut = new Float64Array(2);

  valueAndSlope(flow: number, out: Float64Array): void {
    const { coefficients, offset, running } = this;
    const x = flow / running;
    (this.table as BandSystemTable).headAndSlope(flow, this.systemOut);
    out[0] = cubicAt(coefficients, offset, x) - this.systemOut[0];
    out[1] =
      (coefficients[offset + 1] + x * (2 * coefficients[offset + 2] + 3 * coefficients[offset + 3] * x)) / running -
      this.systemOut[1];
  }
}

const surplus = new CombinedSurplus();

/**
 * The crossing (total flow, m3/s) of h(Q/m) and the system inside a bracket with h above the
 * system at `low` and below it at `high`: regula falsi to start, then the engine's safeguarded
 * Newton (bracketedNewton) to 1e-8 of the bracket: enough to rank by, the ranked few are then
 * solved by the engine itself. A bracket end is returned when the curves already cross there.
 */
export function crossingInBracket(
  coefficients: Float64Array,
  offset: number,
  running: number,
  table: BandSystemTable,
  low: number,
  high: number,
): number {
  const surplusLow = cubicAt(coefficients, offset, low / running) - table.head(low);
  const surplusHigh = cubicAt(coefficients, offset, high / running) - table.head(high);
  if (surplusLow <= 0) return low;
  if (surplusHigh >= 0) return high;
  surplus.coefficients = coefficients;
  surplus.offset = offset;
  surplus.running = running;
  surplus.table = table;
  const tolerance = 1e-8 * high;
  const start = low + ((high - low) * surplusLow) / (surplusLow - surplusHigh);
  const { root } = bracketedNewton(surplus, low, high, start, {
    finalStep: tolerance,
    bracketWidth: tolerance,
    maxIterations: 50,
  });
  surplus.table = null;
  return root;
}
