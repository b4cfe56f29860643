import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterRenderEffect,
  computed,
  input,
  viewChild,
} from '@angular/core';
import { line } from 'd3-shape';
import { appendHatchPattern, drawChartFrame } from '../../shared/chart-frame';
import { ChartNumbers, evenlyPicked, figure, type NumberTable } from '../../shared/chart-numbers';
import type { BranchShare } from '../system-draft';

export interface CurvePoint {
  flow: number;
  head: number;
}

const width = 520;
const height = 280;
const margin = { top: 16, right: 16, bottom: 42, left: 52 };

/** A small chart of the system curve with the duty band shaded; drawn from plain numbers in the charts' one frame. */
@Component({
  selector: 'rf-system-curve-preview',
  imports: [ChartNumbers],
  template: `<svg #chart role="img" [attr.aria-label]="summary()" class="rf-preview"></svg>
    @if (branchShares().length === 2) {
      <table class="rf-branch-flows">
        <caption>
          Branch flows at the band's ends
        </caption>
        <thead>
          <tr>
            <th scope="col">Branch</th>
            <th scope="col">At {{ bandFlow(0) }} {{ flowUnit() }} ({{ flowUnit() }})</th>
            <th scope="col">At {{ bandFlow(1) }} {{ flowUnit() }} ({{ flowUnit() }})</th>
            <th scope="col">Fastest velocity at the top ({{ lengthUnit() }}/s)</th>
          </tr>
        </thead>
        <tbody>
          @for (share of branchShares()[1]; track share.name; let index = $index) {
            <tr>
              <th scope="row">{{ share.name }}</th>
              <td>{{ figureOf(branchShares()[0][index].flow) }}</td>
              <td>{{ figureOf(share.flow) }}</td>
              <td>{{ figureOf(share.velocity) }}</td>
            </tr>
          }
        </tbody>
      </table>
    }
    <rf-chart-numbers [tables]="numbers()" />`,
  styleUrls: ['../../shared/chart-frame.scss'],
  styles: `
    .rf-preview {
      max-width: 40rem;
      border: 1px solid #d8d2c6;
      border-radius: 4px;
    }
    .rf-branch-flows {
      margin: 0.5rem 0;
      border-collapse: collapse;
      caption {
        text-align: left;
        font-weight: 600;
      }
      th,
      td {
        padding: 0.15rem 0.6rem 0.15rem 0;
        text-align: left;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SystemCurvePreview {
  readonly points = input.required<readonly CurvePoint[]>();
  readonly band = input<{ flowMin: number; flowMax: number } | null>(null);
  readonly flowUnit = input.required<string>();
  readonly headUnit = input.required<string>();
  readonly lengthUnit = input('ft');
  /** Each branch's share at the band's low and high flow (none for a single route). */
  readonly branchShares = input<readonly (readonly BranchShare[])[]>([]);

  protected readonly figureOf = figure;

  protected bandFlow(end: 0 | 1): string {
    const band = this.band();
    return band ? figure(end === 0 ? band.flowMin : band.flowMax) : '';
  }

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('chart');

  protected readonly summary = computed(() => {
    const points = this.points();
    const first = points[0];
    const last = points.at(-1);
    return first && last
      ? `System curve from ${first.head.toFixed(1)} ${this.headUnit()} at no flow to ${last.head.toFixed(1)} ${this.headUnit()} at ${last.flow.toFixed(0)} ${this.flowUnit()}`
      : 'System curve';
  });

  /** The curve's points as a table (at most 13 rows, evenly spaced over the flows drawn). */
  protected readonly numbers = computed((): NumberTable[] => {
    const band = this.band();
    return [
      {
        caption: band
          ? `System curve (duty band ${figure(band.flowMin)} to ${figure(band.flowMax)} ${this.flowUnit()})`
          : 'System curve',
        headers: [`Flow (${this.flowUnit()})`, `Total dynamic head (${this.headUnit()})`],
        rows: evenlyPicked(this.points(), 13).map((point) => [figure(point.flow), figure(point.head)]),
      },
    ];
  });

  constructor() {
    afterRenderEffect({ write: () => this.draw() });
  }

  private draw(): void {
    const points = this.points();
    const heads = points.map((point) => point.head);
    const { root, x, y, plot, under, marks } = drawChartFrame(this.svg().nativeElement, {
      width,
      height,
      margin,
      x: { domain: [0, points.at(-1)?.flow ?? 1], ticks: 6, title: `Flow (${this.flowUnit()})` },
      y: {
        domain: [Math.min(0, ...heads), Math.max(1, ...heads) * 1.05],
        ticks: 5,
        title: `Head (${this.headUnit()})`,
      },
    });

    const band = this.band();
    if (band) {
      appendHatchPattern(root, 'rf-preview-band', { fill: '#e3efe9', line: '#8fb8a8' });
      under
        .append('rect')
        .attr('class', 'rf-band')
        .attr('x', x(band.flowMin))
        .attr('y', plot.top)
        .attr('width', Math.max(1, x(band.flowMax) - x(band.flowMin)))
        .attr('height', plot.bottom - plot.top)
        .attr('fill', 'url(#rf-preview-band)');
    }

    marks
      .append('path')
      .attr('class', 'rf-system-line')
      .attr(
        'd',
        line<CurvePoint>()
          .x((point) => x(point.flow))
          .y((point) => y(point.head))(points as CurvePoint[]) ?? '',
      )
      .attr('fill', 'none')
      .attr('stroke', '#12383d')
      .attr('stroke-width', 3);
  }
}
