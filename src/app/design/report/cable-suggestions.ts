import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { catchError, forkJoin, map, of, type Observable } from 'rxjs';
import type { CableRunResponse, SelectionCandidate } from '../../../../shared/api/api-schemas';
import { DEFAULT_MAX_DROP_PERCENT } from '../../../../shared/electrical';
import { CABLE_RUN_CAUTION } from '../../../../shared/messages/design-cautions';
import { describeHttpError } from '../../core/problem-details';
import { CalculationsApi } from '../calculations-api';
import { FigurePipe } from '../../shared/locale-numbers';
import { SelectionDraft } from '../selection-draft';

/** One pump's suggestion, or why there is none. */
interface CableSuggestion {
  pumpId: number;
  model: string;
  answer: CableRunResponse | null;
  problem: string | null;
}

/** What the designer reads when the API refuses one pump's run. */
function problemOf(error: unknown): string {
  if (!(error instanceof HttpErrorResponse)) return 'The suggestion could not be worked out.';
  const pointer = (error.error as { pointer?: string } | null)?.pointer;
  if (error.status === 422 && pointer === '/body/pumpId')
    return "The catalog gives no full-load current, voltage or phases for this pump: ask its maker's data.";
  if (error.status === 422 && pointer === '/body/length')
    return 'No listed conductor keeps the drop that low over this run: shorten it, raise the supply voltage or split the load.';
  return describeHttpError(error);
}

/**
 * The report's cable run: for each pump of the report, the smallest copper conductor (AWG and
 * mm2) that keeps the voltage drop over the site step's cable length under 3 %, from the
 * catalog's full-load current, voltage and phases (POST /calculations/cable-run, one per pump).
 */
@Component({
  selector: 'rf-cable-suggestions',
  imports: [FigurePipe],
  template: `
    <section class="rf-card" aria-labelledby="rf-report-cable">
      <h2 id="rf-report-cable">Cable run to each pump</h2>
      @if (draft.cableLength() === null) {
        <p class="rf-muted">
          Enter the cable run's length on step 1 (site and system) for a conductor suggestion per pump.
        </p>
      } @else {
        <p>
          {{ draft.cableLength() | figure: '1.0-1' }} {{ draft.units().length }} one way, each pump on its own circuit:
          the smallest copper conductor that keeps the voltage drop at or under {{ limit }} % of the supply voltage
          (conductors at 75 °C, resistance only).
        </p>
        @if (suggestions.isLoading()) {
          <p role="status">Working out the conductors…</p>
        } @else {
          <div class="rf-table-scroll" tabindex="0" role="region" aria-labelledby="rf-report-cable">
            <table class="rf-report-table" data-testid="cable-suggestions">
              <thead>
                <tr>
                  <th scope="col">Pump</th>
                  <th scope="col">Supply, full-load current</th>
                  <th scope="col">AWG (drop)</th>
                  <th scope="col">mm² (drop)</th>
                </tr>
              </thead>
              <tbody>
                @for (suggestion of rows(); track suggestion.pumpId) {
                  <tr>
                    <td>{{ suggestion.model }}</td>
                    @if (suggestion.answer; as answer) {
                      <td>
                        {{ answer.voltage }} V, {{ answer.phases === 3 ? 'three' : 'single' }} phase,
                        {{ answer.current | figure: '1.0-2' }} A
                      </td>
                      @for (column of seriesColumns; track column.series) {
                        <td>
                          @if (answer.smallest[column.series]; as drop) {
                            {{ drop.conductor.label }} ({{ drop.percent | figure: '1.1-1' }} %,
                            {{ drop.volts | figure: '1.1-1' }} V)
                          } @else {
                            {{ column.none }}
                          }
                        </td>
                      }
                    } @else {
                      <td colspan="3" class="rf-muted">{{ suggestion.problem }}</td>
                    }
                  </tr>
                }
              </tbody>
            </table>
          </div>
        }
        <p class="rf-cable-caution">
          <strong>{{ caution.title }}</strong> {{ caution.text }}
        </p>
      }
    </section>
  `,
  styleUrls: ['../design-page.scss', './selection-report-page.scss'],
  styles: `
    .rf-cable-caution {
      border-left: 4px solid var(--rf-copper);
      padding-left: 0.75rem;
      margin-top: 1rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CableSuggestions {
  readonly candidates = input.required<SelectionCandidate[]>();
  protected readonly draft = inject(SelectionDraft);
  private readonly api = inject(CalculationsApi);
  protected readonly caution = CABLE_RUN_CAUTION;
  protected readonly limit = DEFAULT_MAX_DROP_PERCENT;
  /** The answer's two series, in the table's column order, with what a series none of whose sizes is enough says. */
  protected readonly seriesColumns = [
    { series: 'awg', none: 'none up to 4/0 AWG' },
    { series: 'metric', none: 'none up to 300 mm²' },
  ] as const;

  /** Each pump once: the same pump in another arrangement has the same circuit per pump. */
  private readonly pumps = computed(() => {
    const seen = new Map<number, string>();
    for (const candidate of this.candidates())
      if (!seen.has(candidate.pumpId)) seen.set(candidate.pumpId, candidate.model);
    return [...seen.entries()].map(([pumpId, model]) => ({ pumpId, model }));
  });

  protected readonly suggestions = rxResource({
    params: () => {
      const length = this.draft.cableLength();
      const pumps = this.pumps();
      return length === null || pumps.length === 0 ? undefined : { length, unit: this.draft.units().length, pumps };
    },
    stream: ({ params }): Observable<CableSuggestion[]> =>
      forkJoin(
        params.pumps.map(({ pumpId, model }) =>
          this.api.calculateCableRun({ units: { length: params.unit }, pumpId, length: params.length }).pipe(
            map((answer): CableSuggestion => ({ pumpId, model, answer, problem: null })),
            catchError((error: unknown) =>
              of<CableSuggestion>({ pumpId, model, answer: null, problem: problemOf(error) }),
            ),
          ),
        ),
      ),
  });

  protected readonly rows = computed(() => (this.suggestions.hasValue() ? this.suggestions.value() : []));
}
