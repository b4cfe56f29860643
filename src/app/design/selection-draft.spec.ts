import { TestBed } from '@angular/core/testing';
import type { SelectionCandidate, SelectionResponse } from '../../../shared/api/api-schemas';
import { candidateKey, SelectionDraft } from './selection-draft';

/** A search answer with candidates of the given pump ids (one running pump each); only the keys matter here. */
function results(...pumpIds: number[]): SelectionResponse {
  return {
    units: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' },
    duty: { flowMin: 90, flowMax: 130 },
    rankBy: 'energy',
    energyBasis: {
      basis: 'wire-to-water',
      motorEfficiencyByKind: { submersible: 70, 'external-centrifugal': 75, 'mixed-flow': 80 },
    },
    unmet: null,
    considered: pumpIds.length,
    inBand: pumpIds.length,
    pipeSizeSuggestions: [],
    candidates: pumpIds.map((pumpId) => ({ pumpId, arrangement: { installed: 1, running: 1 } }) as SelectionCandidate),
    warnings: [],
  };
}

describe('SelectionDraft chosen candidates', () => {
  beforeEach(() => sessionStorage.clear());

  it('drops the choice when the results change, and keeps it while they do not', () => {
    const draft = TestBed.inject(SelectionDraft);
    draft.setResults(results(1, 2, 3));
    draft.toggleCompared(candidateKey({ pumpId: 2, arrangement: { installed: 1, running: 1 } }));
    draft.setSearch(draft.search());
    expect(draft.compared()).toEqual(['2x1']);
    expect(draft.comparedCandidates().map((candidate) => candidate.pumpId)).toEqual([2]);
    draft.setResults(results(2, 3));
    expect(draft.compared()).toEqual([]);
    draft.toggleCompared('3x1');
    draft.setBand({ flowMin: 80, flowMax: 120 });
    expect(draft.results()).toBeNull();
    expect(draft.compared()).toEqual([]);
  });

  it('comes back after a reload with the choice it had', () => {
    const first = TestBed.inject(SelectionDraft);
    first.setResults(results(1, 2));
    first.toggleCompared('1x1');
    TestBed.tick();
    TestBed.resetTestingModule();
    const reloaded = TestBed.inject(SelectionDraft);
    expect(reloaded.compared()).toEqual(['1x1']);
    expect(reloaded.results()?.candidates.length).toBe(2);
  });
});
