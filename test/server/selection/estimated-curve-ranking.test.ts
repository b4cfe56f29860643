import { expect } from 'chai';
import type { CatalogState } from '../../../server/catalog/catalog-snapshot';
import { packedCurves } from '../../../server/selection/packed-curves';
import type { CatalogPump } from '../../../server/catalog/catalog-snapshot';
import { rankCandidate } from '../../../server/selection/selection-reasons';
import { screenPoint, TopPairs } from '../../../server/selection/selection-ranking';
import type { SelectionQuery } from '../../../server/selection/selection-query';
import type { BandSystemTable } from '../../../server/selection/system-table';
import { pumpTermsOf } from '../../../server/selection/pump-terms';
import { compileSystemCurve, DEFAULT_PREFERRED_BAND, fitPumpCurve, polynomialValue } from '../../../shared/hydraulics';

/*
 * A curve estimated from two points ranks below a measured one of equal merit: the same head and
 * power at the same duty, one marked estimated, the other published (invented pumps).
 */

describe('ranking of estimated curves', () => {
  const estimated = fitPumpCurve([
    { flow: 0, head: 4, power: 60 },
    { flow: 0.002, head: 0, power: 80 },
  ]);
  const measured = { ...estimated, curveBasis: 'published' as const };
  const state = {
    stamp: 'test',
    pumps: [estimated, measured].map((fit, index) => ({
      id: index + 1,
      kind: 'submersible',
      fit,
      declaredPreferred: null,
      motorEfficiency: null,
      listPrice: null,
    })),
    byId: new Map(),
    derived: new Map(),
  } as unknown as CatalogState;
  const system = compileSystemCurve({
    staticHead: 1,
    frictionMethod: 'hazen-williams',
    segments: [{ length: 5, insideDiameter: 0.05, hazenWilliamsC: 150 }],
  });
  const query = {
    system,
    density: 998.2,
    flowMin: 0.0005,
    flowMax: 0.0015,
    requireOneFailed: false,
    standby: false,
    band: DEFAULT_PREFERRED_BAND,
    hoursPerDay: 24,
    tariffPerKWh: null,
    motorEfficiency: null,
    rankBy: 'energy',
    costs: null,
    maxInputPowerPerPump: null,
    onlyPreferredRegion: false,
    suction: null,
  } as unknown as SelectionQuery;
  const table = {} as BandSystemTable;

  it('puts the measured pump first although the estimated one was offered first', () => {
    const packed = packedCurves(state);
    const flow = 0.001;
    const head = polynomialValue(estimated.headCoefficients, flow);
    const terms = pumpTermsOf(state, query);
    const keys = [0, 1].map((index) => screenPoint(packed, index, 1, flow, head, query, table, terms) as number);
    expect(keys[0]).to.be.greaterThan(keys[1]);
    // the same tier and, to 0.1 kWh a year, the same energy: equal merit but for the curve's basis
    expect(keys[0] - keys[1]).to.be.lessThan(0.1);
    const ranking = new TopPairs(2);
    ranking.offer(0, 1, keys[0]);
    ranking.offer(1, 1, keys[1]);
    expect(ranking.best().map(([index]) => index)).to.deep.equal([1, 0]);
  });

  it('says so in the candidate: a warning and a reason', () => {
    const point = {
      running: 1,
      flow: 0.001,
      head: 3,
      flowPerPump: 0.001,
      percentOfBep: null,
      region: 'unknown-bep' as const,
      efficiency: null,
      inputPower: 70,
      warnings: [],
    };
    const [forEstimated, forMeasured] = state.pumps.map((pump) => rankCandidate(pump as CatalogPump, 1, point, query));
    expect(forEstimated?.warnings).to.include('estimated-curve');
    expect(forEstimated?.reasons).to.include('estimated curve: only shut-off and open flow are published');
    expect(forMeasured?.warnings).not.to.include('estimated-curve');
  });
});
