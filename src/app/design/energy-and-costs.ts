import type { SelectionCandidate, SelectionRequest } from '../../../shared/api/api-schemas';

/* The words the design pages use for the search's energy basis, costs and missed requirements. */

export type RankBy = NonNullable<SelectionRequest['rankBy']>;

export const rankByWords: Record<RankBy, string> = {
  energy: 'annual energy',
  'first-cost': 'first cost of the set',
  'life-cycle-cost': 'life-cycle cost',
};

const missWords: Record<SelectionCandidate['misses'][number], string> = {
  band: 'duty band',
  redundancy: 'redundancy',
  'preferred-region': 'preferred region',
  velocity: 'pipe velocity',
  'npsh-margin': 'NPSH margin',
};

/** Where a candidate's motor efficiency comes from, beside its input power. */
export function motorLabel(candidate: Pick<SelectionCandidate, 'motorEfficiency'>): string {
  const { percent, source } = candidate.motorEfficiency;
  if (source === 'curve-is-electrical' || percent === null) return 'curve gives electrical power';
  const from = { catalog: 'catalog', designer: 'yours', 'kind-default': 'assumed for the pump kind' }[source];
  return `motor ${Math.round(percent)} % (${from})`;
}

/** An amount with its currency, or a dash. */
export function moneyLabel(money: { amount: number; currency: string } | null): string {
  return money === null ? '–' : `${Math.round(money.amount).toLocaleString('en')} ${money.currency}`;
}

/** The speed the search runs a variable- or multi-speed pump at, in words; empty at the nominal speed of a fixed-speed pump. */
export function speedLabel(candidate: Pick<SelectionCandidate, 'speed'>): string {
  const speed = candidate.speed;
  return speed ? `at ${Math.round(speed.rpm)} rpm (${Math.round(100 * speed.ratio)} % speed)` : '';
}

/** What a candidate misses of the designer's requirements, in words, or "none". */
export function missesLabel(candidate: Pick<SelectionCandidate, 'misses'>): string {
  return candidate.misses.map((miss) => missWords[miss]).join(', ') || 'none';
}
