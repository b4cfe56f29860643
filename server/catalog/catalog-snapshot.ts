import { QueryTypes, type Sequelize } from 'sequelize';
import type { PumpCurveFit, PumpSpeeds } from '../../shared/hydraulics';
import { fixedSpeedsOf } from '../database/models/pump';
import type { PumpOnFile } from '../calculations/arrangement-duty';
import type { CurrentPumpCurves } from '../calculations/calculation-handlers';
import type { PumpRow } from './pump-catalog-queries';

/*
 * The catalog as the search needs it: every active pump with its current curve revision's
 * stored engine fit, held in memory. A search over 10,000 pumps cannot afford to read and parse
 * 10,000 fits per request, so the snapshot is reloaded only when a cheap stamp of the catalog
 * tables (counts, the highest revision id, the latest update) differs from the one it was built
 * from. The stamp costs a scan of the pumps table (a few ms at 10,000 pumps), so one stamp read
 * serves every request that starts within STAMP_REUSE_MS of it: a catalog change shows in searches
 * within a quarter of a second. Concurrent requests share one stamp query and one reload.
 */

/** How long one stamp read answers for, ms. */
export const STAMP_REUSE_MS = 250;

/** The clock stamp reuse is measured on, ms; settable so a test can move time on without waiting. */
export const snapshotClock = { now: (): number => performance.now() };

export interface CatalogPump extends PumpOnFile {
  pumpId: number;
  supplierId: number;
  supplier: string;
  model: string;
  modelCode: string;
  kind: string;
  /** Largest solid sphere the pump passes, mm; null when the catalog does not say. */
  solidsHandlingMm: number | null;
  revisionId: number;
  /** The motor's efficiency, 0-1, as the supplier gives it; null when the curve table has none. */
  motorEfficiency: number | null;
  listPrice: { amount: number; currency: string } | null;
  /** The motor's rating as the supplier gives it (A, V, phases); each null when the curve table has none. */
  electrical: { fullLoadCurrent: number | null; voltage: number | null; phases: number | null };
  /** The speed the curve is for and the others the catalog allows (range, fixed speeds). */
  speeds: PumpSpeeds;
  /** Set on a copy whose fit is scaled to a speed by the search: the ratio and its rpm. */
  atSpeed?: { ratio: number; rpm: number };
}

/** The pumps of one catalog state, and a place for derived structures that live as long as it does. */
export interface CatalogState {
  readonly stamp: string;
  readonly pumps: readonly CatalogPump[];
  readonly byId: ReadonlyMap<number, CatalogPump>;
  /** Memo for structures built from `pumps` (the search's packed arrays), dropped with the state. */
  readonly derived: Map<string, unknown>;
}

/** An active pump's current curve: the catalog's pump row with the revision's stored fit and preferred range. */
type CurrentCurveRow = Pick<PumpRow, 'supplier_id' | 'supplier_name' | 'model_code' | 'display_name' | 'kind'> & {
  pump_id: PumpRow['id'];
  revision_id: number;
  fit: string | PumpCurveFit;
  preferred_min: number | null;
  preferred_max: number | null;
  motor_efficiency: number | null;
  solids_handling_mm: number | null;
  list_price: string | null;
  price_currency: string | null;
  full_load_current_a: number | null;
  voltage_v: number | null;
  phase_count: number | null;
  nominal_speed_rpm: number | null;
  speed_min_rpm: number | null;
  speed_max_rpm: number | null;
  fixed_speeds_rpm: string | null;
};

const stampQuery = `
  SELECT CONCAT_WS('/',
    (SELECT COUNT(*) FROM pumps), (SELECT COALESCE(SUM(current_revision_id), 0) FROM pumps),
    (SELECT COALESCE(SUM(status = 'active'), 0) FROM pumps), (SELECT MAX(updated_at) FROM pumps),
    (SELECT MAX(id) FROM curve_revisions), (SELECT COUNT(*) FROM curve_declared_ranges),
    (SELECT MAX(updated_at) FROM suppliers)) AS stamp`;

const pumpsQuery = `
  SELECT p.id AS pump_id, p.supplier_id, s.name AS supplier_name, p.model_code, p.display_name, p.kind,
         p.motor_efficiency, p.solids_handling_mm, p.list_price, p.price_currency, p.full_load_current_a, p.voltage_v,
         p.phase_count, p.nominal_speed_rpm, p.speed_min_rpm, p.speed_max_rpm, p.fixed_speeds_rpm,
         r.id AS revision_id, r.fit, d.flow_min_m3s AS preferred_min, d.flow_max_m3s AS preferred_max
  FROM pumps p
  JOIN suppliers s ON s.id = p.supplier_id
  JOIN curve_revisions r ON r.id = p.current_revision_id
  LEFT JOIN curve_declared_ranges d ON d.revision_id = r.id AND d.region = 'preferred'
  WHERE p.status = 'active'
  ORDER BY p.id`;

/** A pumps row's speeds (snake_case columns) as the engine's PumpSpeeds. */
export function pumpSpeedsOf(row: {
  nominal_speed_rpm: number | null;
  speed_min_rpm: number | null;
  speed_max_rpm: number | null;
  fixed_speeds_rpm: string | null;
}): PumpSpeeds {
  return {
    nominalRpm: row.nominal_speed_rpm,
    rangeRpm:
      row.speed_min_rpm === null || row.speed_max_rpm === null
        ? null
        : { min: row.speed_min_rpm, max: row.speed_max_rpm },
    fixedRpm: fixedSpeedsOf(row.fixed_speeds_rpm),
  };
}

function toCatalogPump(row: CurrentCurveRow): CatalogPump {
  const fit = (typeof row.fit === 'string' ? JSON.parse(row.fit) : row.fit) as PumpCurveFit;
  return {
    pumpId: row.pump_id,
    supplierId: row.supplier_id,
    supplier: row.supplier_name,
    model: row.display_name,
    modelCode: row.model_code,
    kind: row.kind,
    solidsHandlingMm: row.solids_handling_mm,
    revisionId: row.revision_id,
    motorEfficiency: row.motor_efficiency,
    listPrice:
      row.list_price === null || row.price_currency === null
        ? null
        : { amount: Number(row.list_price), currency: row.price_currency },
    electrical: { fullLoadCurrent: row.full_load_current_a, voltage: row.voltage_v, phases: row.phase_count },
    speeds: pumpSpeedsOf(row),
    fit,
    declaredPreferred:
      row.preferred_min !== null && row.preferred_max !== null
        ? { flowMin: row.preferred_min, flowMax: row.preferred_max }
        : null,
  };
}

export class CatalogSnapshot implements CurrentPumpCurves {
  private state: CatalogState | undefined;
  private pendingStamp: Promise<string> | undefined;
  private stampReadAt = Number.NEGATIVE_INFINITY;
  private lastStamp = '';
  private pendingLoad: Promise<CatalogState> | undefined;

  constructor(private readonly sequelize: Sequelize) {}

  /** The catalog as it is now: the held state when the stamp is unchanged, else a fresh load. */
  async current(): Promise<CatalogState> {
    const stamp = await this.readStamp();
    if (this.state?.stamp === stamp) return this.state;
    this.pendingLoad ??= this.load(stamp).finally(() => {
      this.pendingLoad = undefined;
    });
    return this.pendingLoad;
  }

  async findPump(pumpId: number): Promise<CatalogPump | undefined> {
    return (await this.current()).byId.get(pumpId);
  }

  private readStamp(): Promise<string> {
    if (this.pendingStamp) return this.pendingStamp;
    if (snapshotClock.now() - this.stampReadAt < STAMP_REUSE_MS) return Promise.resolve(this.lastStamp);
    const startedAt = snapshotClock.now();
    this.pendingStamp = this.sequelize
      .query<{ stamp: string }>(stampQuery, { type: QueryTypes.SELECT })
      .then((rows) => {
        this.lastStamp = String(rows[0]?.stamp ?? '');
        this.stampReadAt = startedAt;
        return this.lastStamp;
      })
      .finally(() => {
        this.pendingStamp = undefined;
      });
    return this.pendingStamp;
  }

  private async load(stamp: string): Promise<CatalogState> {
    const rows = await this.sequelize.query<CurrentCurveRow>(pumpsQuery, { type: QueryTypes.SELECT });
    const pumps = rows.map(toCatalogPump);
    const state: CatalogState = {
      stamp,
      pumps,
      byId: new Map(pumps.map((pump) => [pump.pumpId, pump])),
      derived: new Map(),
    };
    this.state = state;
    return state;
  }
}
