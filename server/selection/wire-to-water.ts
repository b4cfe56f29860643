import { DEFAULT_MOTOR_EFFICIENCY_BY_KIND } from '../../shared/hydraulics';
import type { CatalogPump, CatalogState } from '../catalog/catalog-snapshot';
import type { SelectionQuery } from './selection-query';

/*
 * Every energy figure of the search is wire-to-water: a curve that gives electrical power is taken
 * as it is; one that gives shaft power (or efficiency only) is divided by the motor's efficiency,
 * the catalog's own figure for the pump when it has one, else the designer's, else the pump
 * kind's assumed value (DEFAULT_MOTOR_EFFICIENCY_BY_KIND). So no two bases are ranked together.
 */

export type MotorEfficiencySource = 'curve-is-electrical' | 'catalog' | 'designer' | 'kind-default';

export interface MotorEfficiencyUsed {
  /** 0-1; 1 when the curve's power already is electrical. */
  value: number;
  source: MotorEfficiencySource;
}

/** The motor efficiency applied to a pump's curve (see the note at the top). */
export function motorEfficiencyFor(pump: CatalogPump, designer: number | null): MotorEfficiencyUsed {
  // an electrical curve's efficiency is wire-to-water too (PumpCurveFit.powerBasis)
  if (pump.fit.powerBasis === 'electrical') return { value: 1, source: 'curve-is-electrical' };
  if (pump.motorEfficiency !== null) return { value: pump.motorEfficiency, source: 'catalog' };
  if (designer !== null) return { value: designer, source: 'designer' };
  return { value: DEFAULT_MOTOR_EFFICIENCY_BY_KIND[pump.kind] ?? 1, source: 'kind-default' };
}

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
