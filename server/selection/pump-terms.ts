import { motorEfficiencyFor } from '../../shared/hydraulics';
import type { CatalogState } from '../catalog/catalog-snapshot';
import type { SelectionQuery } from './selection-query';

/**
 * What the hot loops read of each pump for one query, in flat arrays: the motor efficiency to
 * divide by (1 for an electrical curve) and the list price in the query's cost currency (NaN when
 * the pump has none or is priced in another currency).
 */
export interface PumpTerms {
  motor: Float64Array;
  price: Float64Array;
}

/** Distinct (motor efficiency, currency) pairs kept per snapshot; the oldest goes first. */
const KEPT_PER_SNAPSHOT = 8;

/** The pumps' terms for `query`, worked out once per snapshot and designer's motor efficiency and currency. */
export function pumpTermsOf(state: CatalogState, query: SelectionQuery): PumpTerms {
  const currency = query.costs?.currency ?? null;
  const key = `${query.motorEfficiency}|${currency}`;
  // kept with the snapshot, which never changes: most searches share a motor efficiency and currency
  let kept = state.derived.get('pump-terms') as Map<string, PumpTerms> | undefined;
  if (!kept) state.derived.set('pump-terms', (kept = new Map()));
  const known = kept.get(key);
  if (known) return known;
  const terms = termsOf(state, query.motorEfficiency, currency);
  if (kept.size >= KEPT_PER_SNAPSHOT) kept.delete(kept.keys().next().value!);
  kept.set(key, terms);
  return terms;
}

function termsOf(state: CatalogState, designerMotorEfficiency: number | null, currency: string | null): PumpTerms {
  const count = state.pumps.length;
  const terms: PumpTerms = { motor: new Float64Array(count), price: new Float64Array(count).fill(Number.NaN) };
  state.pumps.forEach((pump, index) => {
    terms.motor[index] = motorEfficiencyFor(pump, designerMotorEfficiency).value;
    if (pump.listPrice && pump.listPrice.currency === currency) terms.price[index] = pump.listPrice.amount;
  });
  return terms;
}
