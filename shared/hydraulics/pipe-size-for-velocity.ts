import { requirePositive } from './hydraulics-error';
import { PIPE_SERIES, type PipeSize } from './pipe-catalogue';
import { VELOCITY_WARNING_LIMIT } from './system-breakdown';

/*
 * The size a segment would need to keep its velocity under the warning limit at the band's top:
 * a suggestion beside the velocity warning, in the series the designer already uses.
 */

/**
 * The smallest size of a pipe series whose mean velocity at `flow` is at or under `limit`, from
 * continuity V = Q / (pi d^2 / 4) (any fluid mechanics text, e.g. White, Fluid Mechanics, 7th ed.,
 * eq. 3.7); null when even the largest size of the series is too small, or the series is unknown.
 * @param seriesId - a series of the pipe catalogue, e.g. `pvc-sch40`
 * @param flow - volume flow through the segment, m3/s (> 0)
 * @param limit - velocity limit, m/s; default VELOCITY_WARNING_LIMIT (5 ft/s, common practice for plastic pipe)
 * @returns the smallest size that keeps the velocity at or under the limit, or null
 * @example
 * // 100 gpm (0.00630902 m3/s) in Schedule 40 PVC: 2-1/2" (bore 2.469 in) runs 2.0 m/s, 3" (3.068 in) 1.3 m/s
 * smallestSizeForVelocity('pvc-sch40', 0.00630902)?.id // => 'pvc-sch40-3'
 * // 1 m3/s is beyond every size of the series
 * smallestSizeForVelocity('pvc-sch40', 1) // => null
 */
export function smallestSizeForVelocity(
  seriesId: string,
  flow: number,
  limit: number = VELOCITY_WARNING_LIMIT,
): PipeSize | null {
  requirePositive(flow, '/flow', 'flow');
  requirePositive(limit, '/limit', 'velocity limit');
  const series = PIPE_SERIES.find((candidate) => candidate.id === seriesId);
  if (!series) return null;
  const fitting = series.sizes
    .filter((size) => flow / ((Math.PI * size.insideDiameter ** 2) / 4) <= limit)
    .sort((a, b) => a.insideDiameter - b.insideDiameter);
  return fitting[0] ?? null;
}
