import { expect } from 'chai';
import type { CatalogPump, CatalogState } from '../../../server/catalog/catalog-snapshot';
import { pumpTermsOf } from '../../../server/selection/pump-terms';
import type { SelectionQuery } from '../../../server/selection/selection-query';

/*
 * The pumps' terms are kept with the catalog snapshot per designer's motor efficiency and cost
 * currency: a search with other terms must not read the first search's (invented pumps).
 */
describe("the pumps' terms kept with the snapshot", () => {
  const pump = (id: number, motorEfficiency: number | null, price: CatalogPump['listPrice']) =>
    ({
      id,
      kind: 'external',
      fit: { powerBasis: 'shaft' },
      motorEfficiency,
      listPrice: price,
    }) as unknown as CatalogPump;
  const snapshot = (): CatalogState => {
    const pumps = [pump(1, 0.82, { amount: 400, currency: 'EUR' }), pump(2, null, { amount: 300, currency: 'USD' })];
    return { stamp: 'test', pumps, byId: new Map(pumps.map((p) => [p.pumpId, p])), derived: new Map() };
  };
  const query = (motorEfficiency: number | null, currency: string | null) =>
    ({ motorEfficiency, costs: currency === null ? null : { currency } }) as unknown as SelectionQuery;

  it('answers each motor efficiency and currency with its own terms, and the same ones again', () => {
    const state = snapshot();
    const designer = pumpTermsOf(state, query(0.9, 'USD'));
    expect([...designer.motor]).to.deep.equal([0.82, 0.9]);
    expect([...designer.price]).to.deep.equal([Number.NaN, 300]);
    const other = pumpTermsOf(state, query(0.6, 'EUR'));
    expect([...other.motor]).to.deep.equal([0.82, 0.6]);
    expect([...other.price]).to.deep.equal([400, Number.NaN]);
    const byKind = pumpTermsOf(state, query(null, null));
    expect(byKind.motor[1]).to.be.within(0.3, 1).and.not.equal(0.9);
    expect(pumpTermsOf(state, query(0.9, 'USD'))).to.equal(designer);
  });

  it('keeps at most eight pairs per snapshot and none across snapshots', () => {
    const state = snapshot();
    const first = pumpTermsOf(state, query(0.5, null));
    for (let step = 1; step <= 8; step += 1) pumpTermsOf(state, query(0.5 + step / 100, null));
    expect(pumpTermsOf(state, query(0.5, null))).to.not.equal(first);
    expect((state.derived.get('pump-terms') as Map<string, unknown>).size).to.equal(8);
    expect(pumpTermsOf(snapshot(), query(0.9, 'USD'))).to.not.equal(pumpTermsOf(state, query(0.9, 'USD')));
  });
});
