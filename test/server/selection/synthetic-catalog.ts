import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { fitPumpCurve, type PumpCurvePoint } from '../../../shared/hydraulics';

/*
 * Invented pumps for the search's tests and benchmark: no real maker or model is meant. Each
 * curve is a smooth, falling head curve with an efficiency hump, sized by a deterministic
 * pseudo-random sequence so every run seeds the same catalog.
 */

export interface SyntheticPumpShape {
  /** Shut-off head, m. */
  shutOffHead: number;
  /** Flow at the last published point, m3/s. */
  lastFlow: number;
  /** Peak efficiency, 0-1. */
  peakEfficiency: number;
  /** NPSH3 at the curve's end, m, for NPSH3 = this x (0.3 + 0.7 x^2) on every point; none when left out. */
  npshAtEnd?: number;
}

/** Six published points: H = H0 (1 - 0.2 x - 0.6 x^2), eta = eta_max (2 x/0.6 - (x/0.6)^2) clipped at 0, x = Q / Q_last; NPSH3 when the shape has it. */
export function syntheticCurve(shape: SyntheticPumpShape): PumpCurvePoint[] {
  return [0, 0.2, 0.4, 0.6, 0.8, 1].map((x) => ({
    flow: x * shape.lastFlow,
    head: shape.shutOffHead * (1 - 0.2 * x - 0.6 * x * x),
    efficiency: Math.max(0, shape.peakEfficiency * ((2 * x) / 0.6 - (x / 0.6) ** 2)),
    ...(shape.npshAtEnd === undefined ? {} : { npshRequired: shape.npshAtEnd * (0.3 + 0.7 * x * x) }),
  }));
}

/** A small linear congruential sequence (Numerical Recipes' constants), for repeatable shapes. */
function sequence(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

/** Shapes spread over water-feature sizes: 2-25 m shut-off, 0.5-20 L/s at the curve's end. */
export function syntheticShapes(count: number, seed = 7): SyntheticPumpShape[] {
  const next = sequence(seed);
  return Array.from({ length: count }, () => ({
    shutOffHead: 2 + 23 * next(),
    lastFlow: (0.5 + 19.5 * next() ** 1.5) / 1000,
    peakEfficiency: 0.3 + 0.4 * next(),
  }));
}

const sha = (text: string) => createHash('sha256').update(text).digest('hex');

async function insertRows(sequelize: Sequelize, table: string, columns: string[], rows: unknown[][]): Promise<void> {
  for (let start = 0; start < rows.length; start += 1000) {
    const chunk = rows.slice(start, start + 1000);
    await sequelize.query(
      `INSERT INTO ${table} (${columns.join(', ')}) VALUES ${chunk.map(() => `(${columns.map(() => '?').join(', ')})`).join(', ')}`,
      {
        replacements: chunk.flat(),
      },
    );
  }
}

/**
 * Writes `shapes` as pumps of one invented supplier, each with one current curve revision whose
 * fit the engine computes, the way an import stores it. Returns the pump ids in shape order.
 */
export async function seedSyntheticCatalog(
  sequelize: Sequelize,
  shapes: readonly SyntheticPumpShape[],
  supplierName = 'Synthetic Test Pumps',
  kind: 'submersible' | 'external-centrifugal' = 'submersible',
): Promise<number[]> {
  const now = new Date();
  const code = `SYN${Date.now().toString(36).toUpperCase()}${Math.floor(Math.random() * 1e4)}`.slice(0, 32);
  await sequelize.query('INSERT INTO suppliers (code, name, created_at, updated_at) VALUES (?, ?, ?, ?)', {
    replacements: [code, supplierName, now, now],
  });
  const [{ id: supplierId }] = await sequelize.query<{ id: number }>('SELECT id FROM suppliers WHERE code = ?', {
    replacements: [code],
    type: QueryTypes.SELECT,
  });
  const units = JSON.stringify({ flow: 'm3/s', head: 'm' });
  await insertRows(
    sequelize,
    'curve_imports',
    [
      'supplier_id',
      'imported_by',
      'channel',
      'file_name',
      'file_checksum',
      'file_units',
      'row_count',
      'pump_count',
      'new_count',
      'changed_count',
      'unchanged_count',
      'report',
      'created_at',
    ],
    [
      [
        supplierId,
        'synthetic catalog',
        'command',
        'synthetic.csv',
        sha(code),
        units,
        shapes.length * 6,
        shapes.length,
        shapes.length,
        0,
        0,
        '{}',
        now,
      ],
    ],
  );
  const [{ id: importId }] = await sequelize.query<{ id: number }>(
    'SELECT MAX(id) AS id FROM curve_imports WHERE supplier_id = ?',
    { replacements: [supplierId], type: QueryTypes.SELECT },
  );
  await insertRows(
    sequelize,
    'pumps',
    ['supplier_id', 'model_code', 'display_name', 'kind', 'status', 'created_at', 'updated_at'],
    shapes.map((_, index) => [supplierId, `SYN-${index + 1}`, `Synthetic pump ${index + 1}`, kind, 'active', now, now]),
  );
  const pumps = await sequelize.query<{ id: number }>('SELECT id FROM pumps WHERE supplier_id = ? ORDER BY id', {
    replacements: [supplierId],
    type: QueryTypes.SELECT,
  });
  const fits = shapes.map((shape) => fitPumpCurve(syntheticCurve(shape)));
  await insertRows(
    sequelize,
    'curve_revisions',
    [
      'pump_id',
      'number',
      'import_id',
      'source_file_name',
      'source_checksum',
      'content_hash',
      'file_units',
      'point_count',
      'flow_min_m3s',
      'flow_max_m3s',
      'head_min_m',
      'head_max_m',
      'bep_flow_m3s',
      'bep_head_m',
      'bep_efficiency',
      'fit',
      'created_at',
    ],
    fits.map((fit, index) => {
      const text = JSON.stringify(fit);
      return [
        pumps[index].id,
        1,
        importId,
        'synthetic.csv',
        sha(code),
        sha(text),
        units,
        6,
        fit.flowMin,
        fit.flowMax,
        0.2 * shapes[index].shutOffHead,
        shapes[index].shutOffHead,
        fit.bep?.flow ?? null,
        fit.bep?.head ?? null,
        fit.bep?.efficiency ?? null,
        text,
        now,
      ];
    }),
  );
  await sequelize.query(
    `UPDATE pumps p JOIN curve_revisions r ON r.pump_id = p.id AND r.number = 1 SET p.current_revision_id = r.id, p.updated_at = ? WHERE p.supplier_id = ?`,
    { replacements: [new Date(), supplierId] },
  );
  return pumps.map((pump) => pump.id);
}
