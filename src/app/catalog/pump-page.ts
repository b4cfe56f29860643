import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';
import type { PumpDetail } from '../../../shared/api/api-schemas';
import { CatalogApi } from './catalog-api';
import { displayUnitChoices, kindLabels, showFlow, showHead } from '../shared/display-units';
import { PumpCurveChart, preferredBandOf } from '../shared/pump-curve-chart';

type Loaded = { detail: PumpDetail } | { problem: string };

/** One pump: its details, the curve of a revision (the current one unless another is asked for) and all its revisions. */
@Component({
  selector: 'rf-pump-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatSelectModule, MatTableModule, PumpCurveChart],
  templateUrl: './pump-page.html',
  styleUrl: './pump-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PumpPage {
  private readonly api = inject(CatalogApi);
  /** From the route: /catalog/:pumpId?revision=N */
  readonly pumpId = input.required<string>();
  readonly revision = input<string | undefined>();

  protected readonly unitChoices = displayUnitChoices;
  protected readonly unitIndex = signal(0);
  protected readonly units = computed(() => displayUnitChoices[this.unitIndex()]);
  protected readonly kindLabels = kindLabels;
  protected readonly showFlow = showFlow;
  protected readonly showHead = showHead;
  protected readonly pointColumns = ['flow', 'head', 'efficiency', 'power', 'npsh'];

  protected readonly loaded = toSignal(
    combineLatest([toObservable(this.pumpId), toObservable(this.revision)]).pipe(
      switchMap(([pumpId, revision]) =>
        this.api.getPump(Number(pumpId), revision ? Number(revision) : undefined).pipe(
          map((detail): Loaded => ({ detail })),
          catchError((error: { status?: number }) =>
            of<Loaded>({
              problem: error.status === 404 ? 'There is no such pump or revision.' : 'The pump could not be loaded.',
            }),
          ),
        ),
      ),
    ),
  );
  protected readonly detail = computed(() => {
    const loaded = this.loaded();
    return loaded && 'detail' in loaded ? loaded.detail : null;
  });
  protected readonly problem = computed(() => {
    const loaded = this.loaded();
    return loaded && 'problem' in loaded ? loaded.problem : null;
  });
  protected readonly band = computed(() => {
    const revision = this.detail()?.revision;
    return revision ? preferredBandOf(revision.fit, revision.declaredRanges.preferred) : null;
  });
}
