import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterRenderEffect,
  computed,
  input,
  viewChild,
} from '@angular/core';
import { axisRight } from 'd3-axis';
import { scaleLinear } from 'd3-scale';
import { select } from 'd3-selection';
import { line } from 'd3-shape';
import type { CurvePointSi, FlowRange, StoredPumpCurveFit } from '../../../shared/api/api-schemas';
import {
  DEFAULT_PREFERRED_BAND,
  flowFromSI,
  headFromSI,
  preferredFlowRegion,
  pumpEfficiencyAt,
  pumpHeadAt,
  type PumpCurveFit,
} from '../../../shared/hydraulics';
import { appendAxisTitle, drawChartFrame, inheritFont } from './chart-frame';
import { ChartNumbers, figure, type NumberTable } from './chart-numbers';
import { showFlow, showHead, type DisplayUnits } from './display-units';

/** Where the preferred band comes from: the supplier's declaration, or 70-120 % of BEP flow. */
export interface PreferredBandShown {
  range: FlowRange;
  source: 'supplier' | 'bep';
}

/**
 * The preferred band to draw: the supplier's declared range when given, else the default POR of
 * ANSI/HI 9.6.3 (70-120 % of BEP flow, DEFAULT_PREFERRED_BAND), kept inside the published flows
 * (preferredFlowRegion).
 */
export function preferredBandOf(fit: StoredPumpCurveFit | null, declared: FlowRange | null): PreferredBandShown | null {
  if (declared) return { range: declared, source: 'supplier' };
  const range = fit ? preferredFlowRegion(fit, DEFAULT_PREFERRED_BAND) : null;
  return range ? { range, source: 'bep' } : null;
}

/** A pump chart's numbers as tables: its published points, and the BEP and preferred band it marks. */
export function pumpCurveNumbers(
  points: readonly CurvePointSi[],
  fit: StoredPumpCurveFit | null,
  preferred: FlowRange | null,
  units: DisplayUnits,
): NumberTable[] {
  const withEfficiency = points.some((point) => point.efficiency !== undefined);
  const withPower = points.some((point) => point.power !== undefined);
  const band = preferredBandOf(fit, preferred);
  const marks: string[][] = [];
  if (fit?.bep) {
    marks.push([
      'Best efficiency point',
      `${showFlow(fit.bep.flow, units.flow)} ${units.flow}, ${showHead(fit.bep.head, units.head)} ${units.head}, ${figure(100 * fit.bep.efficiency, 0)} %`,
    ]);
  }
  if (band) {
    marks.push([
      band.source === 'supplier' ? "Preferred region (supplier's)" : 'Preferred region (70-120 % of BEP flow)',
      `${showFlow(band.range.flowMin, units.flow)} to ${showFlow(band.range.flowMax, units.flow)} ${units.flow}`,
    ]);
  }
  return [
    {
      caption: 'Published points',
      headers: [
        `Flow (${units.flow})`,
        `Head (${units.head})`,
        ...(withEfficiency ? ['Efficiency (%)'] : []),
        ...(withPower ? ['Power (W)'] : []),
      ],
      rows: points.map((point) => [
        showFlow(point.flow, units.flow),
        showHead(point.head, units.head),
        ...(withEfficiency ? [figure(point.efficiency === undefined ? null : 100 * point.efficiency, 0)] : []),
        ...(withPower ? [figure(point.power, 0)] : []),
      ]),
    },
    ...(marks.length > 0 ? [{ caption: 'Marks on the chart', headers: ['Mark', 'Where'], rows: marks }] : []),
  ];
}

const samples = 60;

/**
 * The full chart's look and the compact one's. The compact drawing is half as large again as the
 * table cell shows it, so the frame's one font size reads as small there as the cell wants.
 */
const looks = {
  full: {
    width: 720,
    height: 400,
    margin: { top: 16, right: 56, bottom: 46, left: 56 },
    ticks: { flow: 8, head: 6 },
    fitStroke: 2.5,
    pointRadius: 4,
    pointStroke: 1.5,
    bepSize: 8,
  },
  compact: {
    width: 330,
    height: 165,
    margin: { top: 9, right: 9, bottom: 22, left: 40 },
    ticks: { flow: 3, head: 3 },
    fitStroke: 2.25,
    pointRadius: 3,
    pointStroke: 2.25,
    bepSize: 7.5,
  },
} as const;

/** A pump's head curve (published points and fit), its efficiency, the BEP and the preferred band, drawn with D3. */
@Component({
  selector: 'rf-pump-curve-chart',
  template: `<svg
      #chart
      [attr.viewBox]="'0 0 ' + look().width + ' ' + look().height"
      role="img"
      [attr.aria-label]="description()"
    ></svg>
    @if (!compact()) {
      <rf-chart-numbers [tables]="numbers()" />
    }`,
  imports: [ChartNumbers],
  styleUrls: ['./chart-frame.scss'],
  styles: `
    :host {
      display: block;
    }
    svg {
      overflow: visible;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PumpCurveChart {
  readonly points = input.required<readonly CurvePointSi[]>();
  readonly fit = input<StoredPumpCurveFit | null>(null);
  readonly preferred = input<FlowRange | null>(null);
  readonly units = input.required<DisplayUnits>();
  /** A small chart without axes titles or legend, for tables. */
  readonly compact = input(false);

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('chart');
  protected readonly look = computed(() => (this.compact() ? looks.compact : looks.full));
  protected readonly description = computed(() => {
    const fit = this.fit();
    const units = this.units();
    const bep = fit?.bep
      ? `; BEP at ${Number(flowFromSI(fit.bep.flow, units.flow).toPrecision(3))} ${units.flow}, ${Number(headFromSI(fit.bep.head, units.head).toPrecision(3))} ${units.head}`
      : '';
    return `Pump curve: head against flow, ${this.points().length} published points${bep}`;
  });

  /** The published points, the BEP and the preferred band as tables, in the chosen units. */
  protected readonly numbers = computed(() =>
    pumpCurveNumbers(this.points(), this.fit(), this.preferred(), this.units()),
  );

  constructor() {
    afterRenderEffect({ write: () => this.draw() });
  }

  private draw(): void {
    const points = this.points();
    const fit = this.fit() as PumpCurveFit | null;
    const units = this.units();
    const compact = this.compact();
    const look = this.look();
    const element = this.svg().nativeElement;
    if (points.length === 0) {
      select(element).selectAll('*').remove();
      return;
    }

    const flow = (value: number) => flowFromSI(value, units.flow);
    const head = (value: number) => headFromSI(value, units.head);
    const flowMax = Math.max(...points.map((point) => point.flow), fit?.flowMax ?? 0);
    const headMax = Math.max(...points.map((point) => point.head), fit?.shutOffHead ?? 0);
    const titled = !compact;
    const { root, x, y, plot, under, marks } = drawChartFrame(element, {
      width: look.width,
      height: look.height,
      margin: look.margin,
      x: {
        domain: [0, flow(flowMax) * 1.05],
        ticks: look.ticks.flow,
        title: titled ? `Flow (${units.flow})` : undefined,
      },
      y: {
        domain: [0, head(headMax) * 1.1],
        ticks: look.ticks.head,
        title: titled ? `Head (${units.head})` : undefined,
      },
    });
    const efficiency = scaleLinear().domain([0, 100]).range([plot.bottom, plot.top]);

    const band = preferredBandOf(this.fit(), this.preferred());
    if (band) {
      under
        .append('rect')
        .attr('class', 'rf-band')
        .attr('x', x(flow(band.range.flowMin)))
        .attr('width', Math.max(0, x(flow(band.range.flowMax)) - x(flow(band.range.flowMin))))
        .attr('y', plot.top)
        .attr('height', plot.bottom - plot.top)
        .attr('fill', '#1d5c63')
        .attr('fill-opacity', 0.12);
    }

    if (fit) {
      const flows = Array.from(
        { length: samples + 1 },
        (_, index) => fit.flowMin + ((fit.flowMax - fit.flowMin) * index) / samples,
      );
      const headLine = line<number>()
        .x((q) => x(flow(q)))
        .y((q) => y(head(pumpHeadAt(fit, q))));
      marks
        .append('path')
        .attr('class', 'rf-fit')
        .attr('d', headLine(flows))
        .attr('fill', 'none')
        .attr('stroke', '#12383d')
        .attr('stroke-width', look.fitStroke);
      if (fit.efficiencyCoefficients && !compact) {
        const efficiencyLine = line<number>()
          .x((q) => x(flow(q)))
          .y((q) => efficiency(100 * (pumpEfficiencyAt(fit, q) ?? 0)));
        marks
          .append('path')
          .attr('class', 'rf-efficiency')
          .attr('d', efficiencyLine(flows))
          .attr('fill', 'none')
          .attr('stroke', '#b5643c')
          .attr('stroke-dasharray', '6 4')
          .attr('stroke-width', 2);
        inheritFont(
          root.append('g').attr('transform', `translate(${plot.right},0)`).call(axisRight(efficiency).ticks(5)),
        );
        appendAxisTitle(root, 'Efficiency (%)')
          .attr('transform', `translate(${look.width - 14},${(plot.top + plot.bottom) / 2}) rotate(90)`)
          .attr('fill', '#7a3d1f');
      }
    }

    marks
      .append('g')
      .attr('class', 'rf-points')
      .selectAll('circle')
      .data(points)
      .join('circle')
      .attr('cx', (point) => x(flow(point.flow)))
      .attr('cy', (point) => y(head(point.head)))
      .attr('r', look.pointRadius)
      .attr('fill', '#f4efe6')
      .attr('stroke', '#12383d')
      .attr('stroke-width', look.pointStroke);

    if (fit?.bep) {
      const bx = x(flow(fit.bep.flow));
      const by = y(head(fit.bep.head));
      const size = look.bepSize;
      marks
        .append('path')
        .attr('class', 'rf-bep')
        .attr('d', `M${bx},${by - size} L${bx + size},${by} L${bx},${by + size} L${bx - size},${by} Z`)
        .attr('fill', '#b5643c');
      if (!compact) {
        marks
          .append('text')
          .attr('x', bx + 12)
          .attr('y', by - 10)
          .attr('fill', '#7a3d1f')
          .text(`BEP ${(100 * fit.bep.efficiency).toFixed(0)} %`);
      }
    }
  }
}
