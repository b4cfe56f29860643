import type { KeptSetPoint } from '../../../../shared/api/api-schemas';
import { arrangementLabel, keptShareLabel, oneFailedFlow, stoppedLabel } from './candidate-results';

/** A kept set: the kept pump 62.4 gpm and the added 48.1 gpm at the common head. */
function keptSet(stopped: KeptSetPoint['stopped']): KeptSetPoint {
  const pump = { head: 25.3, region: 'preferred' as const, efficiency: 55, inputPower: 0.7 };
  return {
    flow: 110.5,
    head: 25.3,
    inputPower: 1.4,
    pumps: [
      { ...pump, role: 'kept', pumpId: 12, flow: 62.4, percentOfBep: 94.2 },
      { ...pump, role: 'added', pumpId: 14, flow: 48.1, percentOfBep: null },
    ],
    stopped,
  };
}

describe('the candidates beside a kept pump', () => {
  const stopped: KeptSetPoint['stopped'] = [
    { stopped: 'kept', flow: 92.1, head: 21.4, meetsMinimum: true },
    { stopped: 'added', flow: 81.5, head: 20.2, meetsMinimum: false },
  ];

  it("gives the kept pump's share of the set's flow", () => {
    expect(keptShareLabel(keptSet(stopped), 'gpm')).toBe(
      'kept pump 62.4 gpm, 94 % of BEP; added pump 48.1 gpm; set 110.5 gpm',
    );
  });

  it('says what each pump alone delivers and which falls below the band', () => {
    expect(stoppedLabel(keptSet(stopped), 'gpm')).toBe(
      'added pump alone: 92.1 gpm; kept pump alone: 81.5 gpm, below the band',
    );
  });

  it('takes the lesser single failure as the one-failed flow, none when one alone has no point', () => {
    const arrangement = { installed: 1, running: 1 };
    expect(oneFailedFlow({ oneFailed: null, set: keptSet(stopped) })).toBe(81.5);
    const noPoint = [stopped[0], { ...stopped[1], flow: null, head: null }];
    expect(oneFailedFlow({ oneFailed: null, set: keptSet(noPoint) })).toBeNull();
    expect(arrangementLabel({ arrangement, set: keptSet(stopped) })).toBe('added beside the kept pump');
    expect(arrangementLabel({ arrangement })).toBe('single');
  });
});
