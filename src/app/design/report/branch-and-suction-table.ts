import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import type { SelectionCandidate } from '../../../../shared/api/api-schemas';
import { candidateLabel } from '../compare/comparison-model';
import { FigurePipe } from '../../shared/locale-numbers';
import { SelectionDraft } from '../selection-draft';

/**
 * The report's figures a branched system or a suction side adds at each reported pump's operating
 * point: what each branch takes (flow and its fastest segment's velocity) and the NPSH available
 * against the pump's NPSH3 with the margin asked. Shown only when the design has either.
 */
@Component({
  selector: 'rf-branch-and-suction-table',
  imports: [FigurePipe],
  template: `
    @if (branchNames().length > 0 || hasSuction()) {
      <section class="rf-card" aria-labelledby="rf-report-branches">
        <h2 id="rf-report-branches">{{ title() }}</h2>
        <div class="rf-table-scroll" tabindex="0" role="region" aria-labelledby="rf-report-branches">
          <table class="rf-report-table" data-testid="branch-and-suction">
            <thead>
              <tr>
                <th scope="col">Pump</th>
                @for (name of branchNames(); track name) {
                  <th scope="col">{{ name }}: flow ({{ units().flow }}) · velocity ({{ units().length }}/s)</th>
                }
                @if (hasSuction()) {
                  <th scope="col">NPSH available · required ({{ units().head }})</th>
                  <th scope="col">NPSH margin</th>
                }
              </tr>
            </thead>
            <tbody>
              @for (candidate of candidates(); track candidate.pumpId + '-' + candidate.arrangement.running) {
                <tr>
                  <th scope="row">{{ label(candidate) }}</th>
                  @for (name of branchNames(); track name) {
                    @let branch = branchOf(candidate, name);
                    <td>
                      @if (branch) {
                        {{ branch.flow | figure: '1.0-1' }} · {{ branch.velocity | figure: '1.1-1' }}
                        @if (branch.warnings.length) {
                          <br /><span class="rf-warning">{{ branch.warnings.join('; ') }}</span>
                        }
                      } @else {
                        –
                      }
                    </td>
                  }
                  @if (hasSuction()) {
                    @let npsh = candidate.npsh;
                    @if (npsh) {
                      <td>
                        {{ npsh.available | figure: '1.1-1' }} ·
                        {{ npsh.required === null ? 'not published' : (npsh.required | figure: '1.1-1') }}
                      </td>
                      <td>
                        @if (npsh.adequate === null) {
                          unknown: the curve gives no NPSH required here
                        } @else {
                          ratio {{ npsh.ratio | figure: '1.2-2' }}, {{ npsh.adequate ? 'enough' : 'short' }} (at least
                          {{ npsh.marginRatio | figure: '1.1-2' }} and {{ npsh.marginDifference | figure: '1.1-1' }}
                          {{ units().head }} above NPSH3)
                        }
                      </td>
                    } @else {
                      <td colspan="2">submersible: no suction lift</td>
                    }
                  }
                </tr>
              }
            </tbody>
          </table>
        </div>
      </section>
    }
  `,
  styleUrls: ['../design-page.scss', './selection-report-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BranchAndSuctionTable {
  readonly candidates = input.required<SelectionCandidate[]>();
  private readonly draft = inject(SelectionDraft);
  protected readonly units = this.draft.units;
  protected readonly label = candidateLabel;

  protected readonly branchNames = computed(() => {
    const names = this.candidates().flatMap((candidate) =>
      (candidate.operatingPoint.branches ?? []).map((b) => b.name),
    );
    return [...new Set(names)];
  });
  protected readonly hasSuction = computed(() =>
    this.draft.system().segments.some((segment) => segment.side === 'suction'),
  );
  protected readonly title = computed(() => {
    const parts = [this.branchNames().length > 0 ? 'Flow per branch' : null, this.hasSuction() ? 'NPSH' : null];
    return `${parts.filter(Boolean).join(' and ')} at each pump's operating point`;
  });

  protected branchOf(candidate: SelectionCandidate, name: string) {
    return candidate.operatingPoint.branches?.find((branch) => branch.name === name);
  }
}
