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

/** One branch of a split system: the flow it takes (x) at each head the pump gives (y). */
export interface BranchCurve {
  name: string;
  points: CurvePoint[];
}

/** Dash patterns that tell the branches apart without colour (up to the 8 branches the contract allows). */
const branchDashes = ['7 4', '2 3', '10 3 2 3', '4 4', '12 4', '1 2', '6 2 2 2 2 2', '3 6'];
const branchColours = ['#a3472a', '#3a6ea5', '#6b4c9a', '#7a6a1f', '#1f7a6a', '#9a4c6b', '#4c6b9a', '#555555'];

const width = 520;
const height = 280;
const margin = { top: 16, right: 16, bottom: 42, left: 52 };

/** A small chart of the system curve with the duty band shaded; drawn from plain numbers in the charts' one frame. */
@Component({
  selector: 'rf-system-curve-preview',
  imports: [ChartNumbers],
  template: `<svg #chart role="img" [attr.aria-label]="summary()" class="rf-preview"></svg>
    @if (branchLegend().length > 0) {
      <ul class="rf-branch-legend" aria-label="Lines of the chart">
        <li>
          <svg width="28" height="10" aria-hidden="true">
            <line x1="0" y1="5" x2="28" y2="5" stroke="#12383d" stroke-width="3" />
          </svg>
          System curve: the pump's head at the total flow
        </li>
        @for (entry of branchLegend(); track entry.name) {
          <li>
            <svg width="28" height="10" aria-hidden="true">
              <line
                x1="0"
                y1="5"
                x2="28"
                y2="5"
                [attr.stroke]="entry.colour"
                stroke-width="2"
                [attr.stroke-dasharray]="entry.dash"
              />
            </svg>
            {{ entry.name }}: the flow it takes at that head
          </li>
        }
      </ul>
    }
    @if (branchShares().length === 2) {
      <table class="rf-branch-flows rf-figure-table">
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
    .rf-branch-legend {
      list-style: none;
      margin: 0.25rem 0;
      padding: 0;
      display: flex;
      flex-wrap: wrap;
      gap: 0.25rem 1.25rem;
      li {
        display: flex;
        align-items: center;
        gap: 0.4rem;
      }
    }
    .rf-branch-flows {
      margin: 0.5rem 0;
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
  /** Each branch's flow at each head the pump gives (none for a single route); the system curve is their sum. */
  readonly branchCurves = input<readonly BranchCurve[]>([]);

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

  /** The legend's words for the branch lines, read beside the chart and by screen readers. */
  protected readonly branchLegend = computed(() =>
    this.branchCurves().map((branch, index) => ({
      name: branch.name,
      dash: branchDashes[index % branchDashes.length],
      colour: branchColours[index % branchColours.length],
    })),
  );

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
      ...(this.branchCurves().length > 0 ? [this.branchTable()] : []),
    ];
  });

  /** Each branch's flow at the same total flows as the system curve's table. */
  private branchTable(): NumberTable {
    const branches = this.branchCurves();
    const steps = evenlyPicked(
      this.points().map((point, step) => ({ point, step })),
      13,
    );
    return {
      caption: "Each branch's flow at the pump's head",
      headers: [
        `Total flow (${this.flowUnit()})`,
        `Head (${this.headUnit()})`,
        ...branches.map((branch) => `${branch.name} (${this.flowUnit()})`),
      ],
      rows: steps.map(({ point, step }) => [
        figure(point.flow),
        figure(point.head),
        ...branches.map((branch) => figure(branch.points[step].flow)),
      ]),
    };
  }

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

    const legend = this.branchLegend();
    this.branchCurves().forEach((branch, index) =>
      marks
        .append('path')
        .attr('class', 'rf-branch-line')
        .attr('data-branch', branch.name)
        .attr(
          'd',
          line<CurvePoint>()
            .x((point) => x(point.flow))
            .y((point) => y(point.head))(branch.points) ?? '',
        )
        .attr('fill', 'none')
        .attr('stroke', legend[index].colour)
        .attr('stroke-width', 2)
        .attr('stroke-dasharray', legend[index].dash),
    );
  }
}
