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

export function pumpTermsOf(state: CatalogState, query: SelectionQuery): PumpTerms {
  const count = state.pumps.length;
  const terms: PumpTerms = { motor: new Float64Array(count), price: new Float64Array(count).fill(Number.NaN) };
  const currency = query.costs?.currency ?? null;
  state.pumps.forEach((pump, index) => {
    terms.motor[index] = motorEfficiencyFor(pump, query.motorEfficiency).value;
    if (pump.listPrice && pump.listPrice.currency === currency) terms.price[index] = pump.listPrice.amount;
  });
  return terms;
}
