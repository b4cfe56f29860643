import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { KeptSetPoint, SelectionCandidate, SelectionResponse } from '../../../../shared/api/api-schemas';
import { VELOCITY_WARNING_LIMIT, velocityFromSI } from '../../../../shared/hydraulics';
import { kindLabels } from '../../shared/display-units';
import { missesLabel, moneyLabel, motorLabel, rankByWords, speedLabel } from '../energy-and-costs';
import { candidateKey, maxCompared, SelectionDraft } from '../selection-draft';
import { CandidateColumns, choosableColumns } from './candidate-columns';
import { FigurePipe, formatFigure } from '../../shared/locale-numbers';

const sortValues: Record<string, (candidate: SelectionCandidate) => number | string> = {
  rank: (candidate) => candidate.rank,
  pump: (candidate) => `${candidate.supplier} ${candidate.model}`,
  arrangement: (candidate) => candidate.arrangement.running,
  flow: (candidate) => candidate.operatingPoint.flow,
  head: (candidate) => candidate.operatingPoint.head,
  bep: (candidate) => candidate.operatingPoint.percentOfBep ?? -1,
  region: (candidate) => candidate.region,
  power: (candidate) => candidate.operatingPoint.inputPower ?? Number.POSITIVE_INFINITY,
  energy: (candidate) => candidate.annualKWh ?? Number.POSITIVE_INFINITY,
  cost: (candidate) => candidate.annualCost ?? Number.POSITIVE_INFINITY,
  price: (candidate) => candidate.listPrice?.amount ?? Number.POSITIVE_INFINITY,
  firstCost: (candidate) => candidate.firstCost?.amount ?? Number.POSITIVE_INFINITY,
  lifeCycleCost: (candidate) => candidate.lifeCycleCost?.amount ?? Number.POSITIVE_INFINITY,
  misses: (candidate) => candidate.misses.length,
  oneFailed: (candidate) => oneFailedFlow(candidate) ?? -1,
};

/**
 * The flow with one pump failed; beside a kept pump, the lesser of the two single failures (the
 * kept or the added pump stopped); null when there is none or the rest have no operating point.
 */
export function oneFailedFlow(candidate: Pick<SelectionCandidate, 'oneFailed' | 'set'>): number | null {
  if (!candidate.set) return candidate.oneFailed?.flow ?? null;
  const flows = candidate.set.stopped.map((stopped) => stopped.flow);
  return flows.includes(null) ? null : Math.min(...(flows as number[]));
}

/** How a candidate's pumps run, in words. */
export function arrangementLabel(candidate: Pick<SelectionCandidate, 'arrangement' | 'set'>): string {
  if (candidate.set) return 'added beside the kept pump';
  const { running, installed } = candidate.arrangement;
  return `${running === 1 ? 'single' : `${running} in parallel`}${installed > running ? ' + standby' : ''}`;
}

/**
 * Beside a kept pump: the kept pump's share of the set's flow, and what each pump alone
 * delivers when the other stops.
 */
export function keptShareLabel(set: KeptSetPoint, flowUnit: string): string {
  const [kept, added] = set.pumps;
  const flow = (value: number) => `${formatFigure(value, '1.0-1')} ${flowUnit}`;
  const percent = kept.percentOfBep === null ? '' : `, ${formatFigure(kept.percentOfBep, '1.0-0')} % of BEP`;
  return `kept pump ${flow(kept.flow)}${percent}; added pump ${flow(added.flow)}; set ${flow(set.flow)}`;
}

/** Beside a kept pump: each pump alone with the other stopped. */
export function stoppedLabel(set: KeptSetPoint, flowUnit: string): string {
  return set.stopped
    .map(({ stopped, flow, meetsMinimum }) => {
      const alone = stopped === 'kept' ? 'added pump alone' : 'kept pump alone';
      const figure = flow === null ? 'no operating point' : `${formatFigure(flow, '1.0-1')} ${flowUnit}`;
      return `${alone}: ${figure}${meetsMinimum ? '' : ', below the band'}`;
    })
    .join('; ');
}

/** A candidate's kind and the solids it passes, in words. */
export function pumpFacts(candidate: Pick<SelectionCandidate, 'kind' | 'solidsHandlingMm'>): string {
  const solids =
    candidate.solidsHandlingMm === null
      ? 'solids not given'
      : `passes ${formatFigure(candidate.solidsHandlingMm, '1.0-1')} mm solids`;
  return `${kindLabels[candidate.kind] ?? candidate.kind} · ${solids}`;
}

/** Each branch's flow at the candidate's operating point, in words; empty for a single route. */
export function branchFlowsLabel(candidate: Pick<SelectionCandidate, 'operatingPoint'>, flowUnit: string): string {
  const branches = candidate.operatingPoint.branches ?? [];
  return branches.map((branch) => `${branch.name} ${formatFigure(branch.flow, '1.0-1')} ${flowUnit}`).join(', ');
}

/** The words a filter matches a candidate by: its pump, maker, code, arrangement, region, misses, warnings and reasons. */
function filterText(candidate: SelectionCandidate): string {
  return [
    candidate.model,
    candidate.supplier,
    candidate.modelCode,
    pumpFacts(candidate),
    speedLabel(candidate),
    arrangementLabel(candidate),
    candidate.region,
    missesLabel(candidate),
    ...candidate.warnings,
    ...candidate.reasons,
  ]
    .join(' ')
    .toLocaleLowerCase();
}

/**
 * The search's answer: the ranked candidates as a table on a wide screen (columns of the designer's
 * choosing, pump kept in view, sortable) and as cards on a phone, both narrowed by one filter box.
 */
@Component({
  selector: 'rf-candidate-results',
  imports: [
    FigurePipe,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './candidate-results.html',
  styleUrls: ['../design-page.scss', './candidate-results.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CandidateResults {
  readonly results = input.required<SelectionResponse>();

  private readonly draft = inject(SelectionDraft);
  protected readonly columns = inject(CandidateColumns);
  protected readonly choosableColumns = choosableColumns;
  protected readonly units = this.draft.units;
  protected readonly maxCompared = maxCompared;
  protected readonly filter = signal('');
  private readonly sort = signal<Sort>({ active: 'rank', direction: 'asc' });

  protected readonly velocityLimit = computed(() => {
    const unit = this.units().length === 'ft' ? 'ft/s' : 'm/s';
    return `${Number(velocityFromSI(VELOCITY_WARNING_LIMIT, unit).toFixed(1))} ${unit}`;
  });

  protected readonly rows = computed(() => {
    const words = this.filter().trim().toLocaleLowerCase().split(/\s+/).filter(Boolean);
    const candidates = this.results().candidates.filter((candidate) => {
      const text = filterText(candidate);
      return words.every((word) => text.includes(word));
    });
    const { active, direction } = this.sort();
    const value = sortValues[active];
    if (!value || direction === '') return candidates;
    const sign = direction === 'asc' ? 1 : -1;
    return candidates.sort((a, b) => {
      const [left, right] = [value(a), value(b)];
      return sign * (typeof left === 'string' ? left.localeCompare(String(right)) : left - (right as number));
    });
  });

  protected readonly compared = computed(() => new Set(this.draft.compared()));

  protected readonly key = candidateKey;
  protected readonly arrangementLabel = arrangementLabel;
  protected readonly pumpFacts = pumpFacts;
  protected readonly speedLabel = speedLabel;
  protected readonly rankByWords = rankByWords;
  protected readonly motorLabel = motorLabel;
  protected readonly moneyLabel = moneyLabel;
  protected readonly missesLabel = missesLabel;
  protected readonly branchFlowsLabel = branchFlowsLabel;
  protected readonly keptShareLabel = keptShareLabel;
  protected readonly oneFailedFlow = oneFailedFlow;
  protected readonly stoppedLabel = stoppedLabel;

  protected sortBy(sort: Sort): void {
    this.sort.set(sort);
  }

  protected filterBy(event: Event): void {
    this.filter.set((event.target as HTMLInputElement).value);
  }

  protected toggle(candidate: SelectionCandidate): void {
    this.draft.toggleCompared(candidateKey(candidate));
  }
}
