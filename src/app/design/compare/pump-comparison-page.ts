import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterRenderEffect,
  computed,
  inject,
  linkedSignal,
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { missesLabel, moneyLabel, motorLabel, speedLabel } from '../energy-and-costs';
import { candidateKey, SelectionDraft } from '../selection-draft';
import { unitSystems, type UnitSystem } from '../unit-systems';
import { downloadPng, downloadSvg } from '../../shared/chart-export';
import { chartStyle, drawComparisonChart, type ChartModel } from './comparison-chart';
import { candidateLabel, comparisonModel, unitConverter } from './comparison-model';
import { comparisonNumbers } from './comparison-numbers';
import { ChartNumbers } from '../../shared/chart-numbers';
import { FigurePipe } from '../../shared/locale-numbers';

/** Step 4: up to eight candidates on one chart and side by side in a table. */
@Component({
  selector: 'rf-pump-comparison-page',
  imports: [FigurePipe, ChartNumbers, RouterLink, MatButtonModule, MatButtonToggleModule, MatIconModule],
  templateUrl: './pump-comparison-page.html',
  styleUrls: ['../design-page.scss', '../../shared/chart-frame.scss', './pump-comparison-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PumpComparisonPage {
  protected readonly draft = inject(SelectionDraft);
  private readonly chart = viewChild<ElementRef<SVGSVGElement>>('chart');

  /** The chart's and table's units; the design itself keeps its own. */
  protected readonly display = signal<UnitSystem>(this.draft.unitSystem());
  protected readonly displayUnits = computed(() => unitSystems[this.display()].units);
  protected readonly candidates = this.draft.comparedCandidates;
  protected readonly model = computed((): ChartModel | null =>
    comparisonModel(
      { system: this.draft.pipeSystem(), band: this.draft.band(), units: this.draft.units() },
      this.candidates(),
      this.displayUnits(),
    ),
  );

  /** The chart's figures as tables beside it. */
  protected readonly numbers = computed(() => {
    const model = this.model();
    return model ? comparisonNumbers(model) : [];
  });

  /** The hovered or focused point; none once the chart is redrawn, since its marks (and the hover) are gone. */
  protected readonly focused = linkedSignal<
    ChartModel | null,
    { key: string; which: 'operating' | 'one-failed' } | null
  >({ source: this.model, computation: () => null });
  protected readonly styles = computed(() => this.candidates().map((_, index) => chartStyle(index)));

  /** Converts a flow or head from the design's units to the display's. */
  private readonly convert = computed(() => unitConverter(this.draft.units(), this.displayUnits()));

  /** The hovered or focused point, told in words. */
  protected readonly details = computed(() => {
    const focused = this.focused();
    if (!focused) return null;
    const candidate = this.candidates().find((entry) => candidateKey(entry) === focused.key);
    if (!candidate) return null;
    const point = focused.which === 'operating' ? candidate.operatingPoint : candidate.oneFailed;
    if (!point) return null;
    const convert = this.convert();
    const units = this.displayUnits();
    return {
      title: `${this.label(candidate)}${focused.which === 'one-failed' ? ', one pump failed' : ''}`,
      text: `${convert.flow(point.flow).toFixed(1)} ${units.flow} at ${convert.head(point.head).toFixed(1)} ${units.head} TDH; ${
        point.percentOfBep === null ? 'BEP unknown' : `${point.percentOfBep.toFixed(0)} % of BEP`
      }, ${point.region}; ${point.inputPower === null ? 'input power unknown' : `${point.inputPower.toFixed(2)} ${this.draft.units().power} input`}.`,
    };
  });

  constructor() {
    afterRenderEffect({
      write: () => {
        const element = this.chart()?.nativeElement;
        const model = this.model();
        if (!element || !model) return;
        drawComparisonChart(element, model, {
          focus: (key, which) => this.focused.set(key === null ? null : { key, which }),
        });
      },
    });
  }

  protected readonly label = candidateLabel;
  protected readonly motorLabel = motorLabel;
  protected readonly moneyLabel = moneyLabel;
  protected readonly missesLabel = missesLabel;
  protected readonly speedLabel = speedLabel;

  protected flow(value: number): number {
    return this.convert().flow(value);
  }

  protected head(value: number): number {
    return this.convert().head(value);
  }

  protected exportSvg(): void {
    const element = this.chart()?.nativeElement;
    if (element) downloadSvg(element, 'riffle-pump-comparison.svg');
  }

  protected exportPng(): void {
    const element = this.chart()?.nativeElement;
    if (element) void downloadPng(element, 'riffle-pump-comparison.png');
  }
}
