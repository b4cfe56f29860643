import { createHash } from 'node:crypto';
import type { PowerBasis } from '../shared/hydraulics';

export interface CurveContent {
  points: ReadonlyArray<{
    flow: number;
    head: number;
    power?: number | null;
    efficiency?: number | null;
    npshRequired?: number | null;
  }>;
  preferred: { flowMin: number; flowMax: number } | null;
  allowable: { flowMin: number; flowMax: number } | null;
  powerBasis: PowerBasis;
  notes: string | null;
}

/** 12 significant digits: the same curve read from gph or from m3/h hashes alike despite round-off. */
function canonical(value: number | null | undefined): string | null {
  return value === null || value === undefined ? null : Number(value.toPrecision(12)).toString();
}

/** sha-256 (hex) of a curve as Riffle stores it: equal hashes mean an unchanged curve. */
export function curveContentHash(content: CurveContent): string {
  const range = (value: CurveContent['preferred']) =>
    value ? [canonical(value.flowMin), canonical(value.flowMax)] : null;
  const text = JSON.stringify({
    points: content.points.map((point) =>
      [point.flow, point.head, point.power, point.efficiency, point.npshRequired].map(canonical),
    ),
    preferred: range(content.preferred),
    allowable: range(content.allowable),
    powerBasis: content.powerBasis,
    notes: content.notes,
  });
  return createHash('sha256').update(text).digest('hex');
}
