import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterRenderEffect,
  computed,
  input,
  viewChild,
} from '@angular/core';
import { select } from 'd3-selection';
import type { CalculationUnits } from '../../../shared/api/api-schemas';
import { designBranchStaticHead, designStaticHead } from '../../../shared/api/design-system';
import { figure } from '../shared/chart-numbers';
import type { SystemDraft } from './system-draft';

/** One run of the drawing: where it goes, its pipe length and its outlet above the intake. */
interface SchematicRun {
  name: string;
  length: number;
  outlet: number;
  outletPressure: number;
}

const width = 600;
const rowHeight = 56;
const pumpX = 90;
const teeX = 270;
const outletX = 410;

const sum = (segments: SystemDraft['segments']) => segments.reduce((total, segment) => total + segment.length, 0);

/**
 * The system drawn from its numbers: intake and suction side, pump, common run, the tee and each
 * branch to its named outlet with its level (a single route: pump to outlet). A picture with its
 * words beside it (aria-label and a table).
 */
@Component({
  selector: 'rf-system-schematic',
  template: `<figure class="rf-schematic">
    <svg #drawing role="img" [attr.aria-label]="summary()" [attr.viewBox]="viewBox()"></svg>
    <table class="rf-schematic-table rf-figure-table">
      <caption>
        Outlets of the system
      </caption>
      <thead>
        <tr>
          <th scope="col">Outlet</th>
          <th scope="col">Above the intake ({{ units().head }})</th>
          <th scope="col">Outlet pressure ({{ units().head }})</th>
          <th scope="col">Pipe after the {{ runs().length > 1 ? 'split' : 'pump' }} ({{ units().length }})</th>
        </tr>
      </thead>
      <tbody>
        @for (run of runs(); track run.name) {
          <tr>
            <th scope="row">{{ run.name }}</th>
            <td>{{ figureOf(run.outlet) }}</td>
            <td>{{ figureOf(run.outletPressure) }}</td>
            <td>{{ figureOf(run.length) }}</td>
          </tr>
        }
      </tbody>
    </table>
  </figure>`,
  styleUrls: ['../shared/chart-frame.scss'],
  styles: `
    .rf-schematic {
      margin: 0;
      display: grid;
      gap: 0.5rem;
    }
    svg {
      max-width: 40rem;
      border: 1px solid #d8d2c6;
      border-radius: 4px;
      background: #fbfaf7;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SystemSchematic {
  readonly system = input.required<SystemDraft>();
  readonly units = input.required<CalculationUnits>();

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('drawing');

  protected readonly figureOf = figure;

  /** The outlets: each branch, or the route's one. */
  protected readonly runs = computed((): SchematicRun[] => {
    const system = this.system();
    if (system.branches?.length)
      return system.branches.map((branch) => ({
        name: branch.name,
        length: sum(branch.segments),
        outlet: designBranchStaticHead(branch, system),
        outletPressure: branch.outletPressureHead,
      }));
    return [
      {
        name: 'Outlet',
        length: sum(system.segments.filter((segment) => segment.side !== 'suction')),
        outlet: designStaticHead(system),
        outletPressure: system.outletPressureHead,
      },
    ];
  });

  private readonly suctionLength = computed(() =>
    sum(this.system().segments.filter((segment) => segment.side === 'suction')),
  );
  private readonly commonLength = computed(() =>
    this.system().branches?.length ? sum(this.system().segments.filter((segment) => segment.side !== 'suction')) : 0,
  );
  private readonly height = computed(() => Math.max(120, this.runs().length * rowHeight + 40));
  protected readonly viewBox = computed(() => `0 0 ${width} ${this.height()}`);

  protected readonly summary = computed(() => {
    const { head, length } = this.units();
    const suction = this.suctionLength();
    const intake = suction > 0 ? `intake, ${figure(suction)} ${length} suction pipe, ` : 'intake, ';
    const outlet = (run: SchematicRun) => `${run.name} ${figure(run.outlet)} ${head} above the intake`;
    const runs = this.runs();
    if (runs.length === 1)
      return `Schematic: ${intake}pump, ${figure(runs[0].length)} ${length} of pipe to the outlet ${figure(runs[0].outlet)} ${head} above the intake`;
    return `Schematic: ${intake}pump, ${figure(this.commonLength())} ${length} common run to a tee splitting into ${runs.length} branches: ${runs.map(outlet).join('; ')}`;
  });

  constructor() {
    afterRenderEffect({ write: () => this.draw() });
  }

  private draw(): void {
    const { head } = this.units();
    const runs = this.runs();
    const height = this.height();
    const middle = height / 2;
    const root = select(this.svg().nativeElement);
    root.selectAll('*').remove();
    const ink = '#12383d';
    const pipe = (x1: number, y1: number, x2: number, y2: number, dashed = false) =>
      root
        .append('line')
        .attr('class', 'rf-pipe')
        .attr('x1', x1)
        .attr('y1', y1)
        .attr('x2', x2)
        .attr('y2', y2)
        .attr('stroke', ink)
        .attr('stroke-width', 4)
        .attr('stroke-dasharray', dashed ? '6 4' : null);
    const text = (x: number, y: number, words: string, anchor = 'middle') =>
      root
        .append('text')
        .attr('x', x)
        .attr('y', y)
        .attr('text-anchor', anchor)
        .attr('font-size', 13)
        .attr('fill', '#222')
        .text(words);

    // intake water and the suction side (dashed when there is one)
    root
      .append('rect')
      .attr('x', 8)
      .attr('y', middle + 10)
      .attr('width', 44)
      .attr('height', 18)
      .attr('fill', '#8fc1d4');
    text(30, middle + 46, 'Intake');
    pipe(30, middle + 10, 30, middle, this.suctionLength() > 0);
    pipe(30, middle, pumpX - 18, middle, this.suctionLength() > 0);
    root
      .append('circle')
      .attr('class', 'rf-pump')
      .attr('cx', pumpX)
      .attr('cy', middle)
      .attr('r', 18)
      .attr('fill', '#e3efe9')
      .attr('stroke', ink)
      .attr('stroke-width', 3);
    text(pumpX, middle + 4, 'P');
    text(pumpX, middle - 26, 'Pump');

    const endOf = (index: number) => 20 + rowHeight * index + rowHeight / 2;
    if (runs.length === 1) {
      pipe(pumpX + 18, middle, outletX, middle);
      this.outlet(root, outletX, middle, `${runs[0].name}: ${figure(runs[0].outlet)} ${head}`);
      return;
    }
    pipe(pumpX + 18, middle, teeX, middle);
    text((pumpX + teeX) / 2, middle - 10, 'Common run');
    root
      .append('rect')
      .attr('class', 'rf-tee')
      .attr('x', teeX - 6)
      .attr('y', middle - 6)
      .attr('width', 12)
      .attr('height', 12)
      .attr('fill', ink);
    text(teeX, middle + 24, 'Tee');
    runs.forEach((run, index) => {
      const y = endOf(index);
      pipe(teeX, middle, teeX + 40, y);
      pipe(teeX + 40, y, outletX, y);
      this.outlet(root, outletX, y, `${run.name}: ${figure(run.outlet)} ${head}`);
    });
  }

  private outlet(root: ReturnType<typeof select<SVGSVGElement, unknown>>, x: number, y: number, label: string): void {
    root
      .append('path')
      .attr('class', 'rf-outlet')
      .attr('d', `M${x},${y - 8} L${x + 12},${y} L${x},${y + 8} Z`)
      .attr('fill', '#2f7d6d');
    root
      .append('text')
      .attr('class', 'rf-outlet-label')
      .attr('x', x + 16)
      .attr('y', y + 4)
      .attr('font-size', 13)
      .attr('fill', '#222')
      .text(label);
  }
}
