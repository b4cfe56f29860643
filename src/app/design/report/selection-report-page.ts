import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterRenderEffect,
  computed,
  inject,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { SelectionCandidate } from '../../../../shared/api/api-schemas';
import { FITTINGS, PIPE_SERIES, flowToSI, headFromSI } from '../../../../shared/hydraulics';
import { SessionService } from '../../core/session-service';
import { drawComparisonChart } from '../compare/comparison-chart';
import { candidateLabel, comparisonModel } from '../compare/comparison-model';
import { comparisonNumbers } from '../compare/comparison-numbers';
import { ChartNumbers } from '../../shared/chart-numbers';
import { moneyLabel, motorLabel, speedLabel } from '../energy-and-costs';
import { SelectionDraft } from '../selection-draft';
import { SystemSchematic } from '../system-schematic';
import { compileDraft, staticHeadOf, type SystemDraft } from '../system-draft';
import { BranchAndSuctionTable } from './branch-and-suction-table';
import { CableSuggestions } from './cable-suggestions';
import { ReportDocuments } from './report-documents';
import { FigurePipe, formatFigure } from '../../shared/locale-numbers';

/** Candidates a report shows when none were ticked for comparison: the first few of the search. */
const reportedWithoutComparison = 3;

/**
 * Step 5: the design on paper for the client and the crew: the measured system, the band, the
 * chosen candidates with their points, the chart and the cautions. Printed from the browser.
 */
@Component({
  selector: 'rf-selection-report-page',
  imports: [
    BranchAndSuctionTable,
    CableSuggestions,
    ChartNumbers,
    DatePipe,
    FigurePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    ReportDocuments,
    SystemSchematic,
  ],
  templateUrl: './selection-report-page.html',
  styleUrls: ['../design-page.scss', '../../shared/chart-frame.scss', './selection-report-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SelectionReportPage {
  protected readonly draft = inject(SelectionDraft);
  protected readonly user = inject(SessionService).user;
  protected readonly units = this.draft.units;
  protected readonly preparedAt = new Date();
  private readonly chart = viewChild<ElementRef<SVGSVGElement>>('chart');

  protected readonly candidates = computed((): SelectionCandidate[] => {
    const compared = this.draft.comparedCandidates();
    return compared.length > 0
      ? compared
      : (this.draft.results()?.candidates ?? []).slice(0, reportedWithoutComparison);
  });
  protected readonly fromComparison = computed(() => this.draft.comparedCandidates().length > 0);
  protected readonly staticHead = computed(() => staticHeadOf(this.draft.system()));

  protected readonly isSuction = (segment: { side?: string }) => segment.side === 'suction';
  protected readonly branched = computed(() => (this.draft.system().branches?.length ?? 0) > 0);

  /** Each pipe segment in words: its run (route, common run or branch), series, size, length and fittings. */
  protected readonly segments = computed(() => {
    const system = this.draft.system();
    const describe = (segment: SystemDraft['segments'][number], run: string) => {
      const series = PIPE_SERIES.find((candidate) => candidate.id === segment.series);
      const size = series?.sizes.find((candidate) => candidate.id === segment.size);
      const fittings = segment.fittings
        .filter((fitting) => fitting.count > 0)
        .map(
          (fitting) =>
            `${fitting.count} × ${FITTINGS.find((entry) => entry.kind === fitting.kind)?.label ?? fitting.kind}`,
        );
      return {
        run: segment.side === 'suction' ? `${run}, suction side` : run,
        pipe: `${series?.label ?? segment.series}, ${size?.nominalLabel ?? segment.size}`,
        length: segment.length,
        fittings,
        extraK: segment.extraK,
      };
    };
    const common = system.branches?.length ? 'Common run' : 'Route';
    return [
      ...system.segments.map((segment) => describe(segment, common)),
      ...(system.branches ?? []).flatMap((branch) => branch.segments.map((segment) => describe(segment, branch.name))),
    ];
  });

  /** Total dynamic head the system needs at the band's ends, in the design's units. */
  protected readonly headAtBand = computed(() => {
    const units = this.units();
    const band = this.draft.band();
    try {
      const curve = compileDraft(this.draft.pipeSystem(), units);
      const at = (flow: number) => headFromSI(curve.evaluate(flowToSI(flow, units.flow)), units.head);
      return { min: at(band.flowMin), max: at(band.flowMax) };
    } catch {
      return null;
    }
  });

  /** The duty band's sentence goes on without a space before its semicolon, so it is one text. */
  protected readonly headAtBandNote = computed(() => {
    const heads = this.headAtBand();
    if (!heads) return '';
    const head = (value: number) => formatFigure(value, '1.1-1');
    return `; the system needs ${head(heads.min)} to ${head(heads.max)} ${this.units().head} of total dynamic head over it.`;
  });

  protected readonly label = candidateLabel;
  protected readonly motorLabel = motorLabel;
  protected readonly moneyLabel = moneyLabel;
  protected readonly speedLabel = speedLabel;

  private readonly chartModel = computed(() =>
    comparisonModel(
      { system: this.draft.pipeSystem(), band: this.draft.band(), units: this.units() },
      this.candidates(),
      this.units(),
    ),
  );

  /** The chart's figures as tables beside it. */
  protected readonly numbers = computed(() => {
    const model = this.chartModel();
    return model ? comparisonNumbers(model) : [];
  });

  constructor() {
    afterRenderEffect({
      write: () => {
        const element = this.chart()?.nativeElement;
        const model = this.chartModel();
        if (element && model) drawComparisonChart(element, model, { focus: () => undefined });
      },
    });
  }

  protected print(): void {
    window.print();
  }
}
