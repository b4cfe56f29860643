import type { CurveTableColumn } from '../../data-import/curve-table-format';
import { formatCurveTable } from '../../data-import/curve-table-writer';

/**
 * A large, valid curve table of invented pumps for the benchmark and the interruption tests:
 * quadratic heads H = H0 (1 - 0.8 x^2) and efficiencies peaking at 60 % of run-out, x = Q / Q_max.
 */
export function largeCurveTable(pumpCount: number, pointsPerPump: number, prefix = 'BULK'): string {
  const rows: Array<Partial<Record<CurveTableColumn, string | number | null>>> = [];
  for (let pump = 0; pump < pumpCount; pump += 1) {
    const shutOff = 4 + (pump % 40);
    const runOut = 5 + (pump % 97);
    for (let point = 0; point < pointsPerPump; point += 1) {
      const x = point / (pointsPerPump - 1);
      rows.push({
        model_code: `${prefix}-${pump}`,
        display_name: point === 0 ? `Invented bulk pump ${pump}` : null,
        kind: point === 0 ? 'external-centrifugal' : null,
        flow: x * runOut,
        head: shutOff * (1 - 0.8 * x * x),
        efficiency: 100 * 0.7 * (1 - ((x - 0.6) / 0.6) ** 2),
      });
    }
  }
  return formatCurveTable({
    comments: ['Invented pumps for the benchmark and the tests; no real product is meant.'],
    units: { 'flow-unit': 'm3/h', 'head-unit': 'm', 'efficiency-unit': '%' },
    columns: ['model_code', 'display_name', 'kind', 'flow', 'head', 'efficiency'],
    rows,
  });
}
