import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterRenderEffect,
  computed,
  input,
  viewChild,
} from '@angular/core';
import { axisBottom, axisLeft, axisRight } from 'd3-axis';
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
import { appendAxisTitles } from './chart-frame';
import type { DisplayUnits } from './display-units';

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

const samples = 60;

/** A pump's head curve (published points and fit), its efficiency, the BEP and the preferred band, drawn with D3. */
@Component({
  selector: 'rf-pump-curve-chart',
  template: `<svg
    #chart
    [attr.viewBox]="'0 0 ' + width() + ' ' + height()"
    role="img"
    [attr.aria-label]="description()"
  ></svg>`,
  styles: `
    :host {
      display: block;
    }
    svg {
      width: 100%;
      height: auto;
      overflow: visible;
      font-family: Lato, sans-serif;
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
  protected readonly width = computed(() => (this.compact() ? 220 : 720));
  protected readonly height = computed(() => (this.compact() ? 110 : 400));
  protected readonly description = computed(() => {
    const fit = this.fit();
    const units = this.units();
    const bep = fit?.bep
      ? `; BEP at ${Number(flowFromSI(fit.bep.flow, units.flow).toPrecision(3))} ${units.flow}, ${Number(headFromSI(fit.bep.head, units.head).toPrecision(3))} ${units.head}`
      : '';
    return `Pump curve: head against flow, ${this.points().length} published points${bep}`;
  });

  constructor() {
    afterRenderEffect({ write: () => this.draw() });
  }

  private draw(): void {
    const points = this.points();
    const fit = this.fit() as PumpCurveFit | null;
    const units = this.units();
    const compact = this.compact();
    const [width, height] = [this.width(), this.height()];
    const margin = compact ? { top: 6, right: 6, bottom: 14, left: 26 } : { top: 16, right: 56, bottom: 46, left: 56 };
    const root = select(this.svg().nativeElement);
    root.selectAll('*').remove();
    if (points.length === 0) return;

    const flow = (value: number) => flowFromSI(value, units.flow);
    const head = (value: number) => headFromSI(value, units.head);
    const flowMax = Math.max(...points.map((point) => point.flow), fit?.flowMax ?? 0);
    const headMax = Math.max(...points.map((point) => point.head), fit?.shutOffHead ?? 0);
    const x = scaleLinear()
      .domain([0, flow(flowMax) * 1.05])
      .range([margin.left, width - margin.right])
      .nice();
    const y = scaleLinear()
      .domain([0, head(headMax) * 1.1])
      .range([height - margin.bottom, margin.top])
      .nice();
    const efficiency = scaleLinear()
      .domain([0, 100])
      .range([height - margin.bottom, margin.top]);

    const band = preferredBandOf(this.fit(), this.preferred());
    if (band) {
      root
        .append('rect')
        .attr('class', 'rf-band')
        .attr('x', x(flow(band.range.flowMin)))
        .attr('width', Math.max(0, x(flow(band.range.flowMax)) - x(flow(band.range.flowMin))))
        .attr('y', margin.top)
        .attr('height', height - margin.top - margin.bottom)
        .attr('fill', '#1d5c63')
        .attr('fill-opacity', 0.12);
    }

    const axisX = root
      .append('g')
      .attr('transform', `translate(0,${height - margin.bottom})`)
      .call(axisBottom(x).ticks(compact ? 3 : 8));
    const axisY = root
      .append('g')
      .attr('transform', `translate(${margin.left},0)`)
      .call(axisLeft(y).ticks(compact ? 3 : 6));
    for (const axis of [axisX, axisY]) axis.selectAll('text').attr('font-size', compact ? 8 : 12);

    if (fit) {
      const flows = Array.from(
        { length: samples + 1 },
        (_, index) => fit.flowMin + ((fit.flowMax - fit.flowMin) * index) / samples,
      );
      const headLine = line<number>()
        .x((q) => x(flow(q)))
        .y((q) => y(head(pumpHeadAt(fit, q))));
      root
        .append('path')
        .attr('class', 'rf-fit')
        .attr('d', headLine(flows))
        .attr('fill', 'none')
        .attr('stroke', '#12383d')
        .attr('stroke-width', compact ? 1.5 : 2.5);
      if (fit.efficiencyCoefficients && !compact) {
        const efficiencyLine = line<number>()
          .x((q) => x(flow(q)))
          .y((q) => efficiency(100 * (pumpEfficiencyAt(fit, q) ?? 0)));
        root
          .append('path')
          .attr('class', 'rf-efficiency')
          .attr('d', efficiencyLine(flows))
          .attr('fill', 'none')
          .attr('stroke', '#b5643c')
          .attr('stroke-dasharray', '6 4')
          .attr('stroke-width', 2);
        root
          .append('g')
          .attr('transform', `translate(${width - margin.right},0)`)
          .call(axisRight(efficiency).ticks(5))
          .selectAll('text')
          .attr('font-size', 12);
      }
    }

    root
      .append('g')
      .attr('class', 'rf-points')
      .selectAll('circle')
      .data(points)
      .join('circle')
      .attr('cx', (point) => x(flow(point.flow)))
      .attr('cy', (point) => y(head(point.head)))
      .attr('r', compact ? 2 : 4)
      .attr('fill', '#f4efe6')
      .attr('stroke', '#12383d')
      .attr('stroke-width', 1.5);

    if (fit?.bep) {
      const bx = x(flow(fit.bep.flow));
      const by = y(head(fit.bep.head));
      root
        .append('path')
        .attr('class', 'rf-bep')
        .attr(
          'd',
          `M${bx},${by - (compact ? 5 : 8)} L${bx + (compact ? 5 : 8)},${by} L${bx},${by + (compact ? 5 : 8)} L${bx - (compact ? 5 : 8)},${by} Z`,
        )
        .attr('fill', '#b5643c');
      if (!compact) {
        root
          .append('text')
          .attr('x', bx + 12)
          .attr('y', by - 10)
          .attr('font-size', 12)
          .attr('fill', '#7a3d1f')
          .text(`BEP ${(100 * fit.bep.efficiency).toFixed(0)} %`);
      }
    }

    if (!compact) {
      appendAxisTitles(
        root,
        { width, height, margin },
        { flow: `Flow (${units.flow})`, head: `Head (${units.head})` },
        { baselineFromBottom: 8, font: { 'font-size': 13 } },
      );
      if (fit?.efficiencyCoefficients) {
        root
          .append('text')
          .attr('transform', `translate(${width - 14},${(margin.top + height - margin.bottom) / 2}) rotate(90)`)
          .attr('text-anchor', 'middle')
          .attr('font-size', 13)
          .attr('fill', '#7a3d1f')
          .text('Efficiency (%)');
      }
    }
  }
}
