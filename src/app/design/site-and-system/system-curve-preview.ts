import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';

export interface CurvePoint {
  flow: number;
  head: number;
}

const width = 520;
const height = 280;
const margin = { top: 16, right: 16, bottom: 42, left: 52 };

/** A small chart of the system curve with the duty band shaded; drawn from plain numbers. */
@Component({
  selector: 'rf-system-curve-preview',
  template: `
    <svg [attr.viewBox]="'0 0 ' + width + ' ' + height" role="img" [attr.aria-label]="summary()" class="rf-preview">
      <defs>
        <pattern id="rf-preview-band" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="8" height="8" fill="#e3efe9" />
          <line x1="0" y1="0" x2="0" y2="8" stroke="#8fb8a8" stroke-width="2" />
        </pattern>
      </defs>
      @if (bandRect(); as rect) {
        <rect
          [attr.x]="rect.x"
          [attr.y]="margin.top"
          [attr.width]="rect.width"
          [attr.height]="plotHeight"
          fill="url(#rf-preview-band)"
        />
      }
      @for (tick of xTicks(); track tick.value) {
        <g [attr.transform]="'translate(' + tick.position + ',0)'">
          <line [attr.y1]="margin.top" [attr.y2]="height - margin.bottom" class="rf-grid" />
          <text [attr.y]="height - margin.bottom + 16" text-anchor="middle">{{ tick.value }}</text>
        </g>
      }
      @for (tick of yTicks(); track tick.value) {
        <g [attr.transform]="'translate(0,' + tick.position + ')'">
          <line [attr.x1]="margin.left" [attr.x2]="width - margin.right" class="rf-grid" />
          <text [attr.x]="margin.left - 6" dy="0.32em" text-anchor="end">{{ tick.value }}</text>
        </g>
      }
      <path [attr.d]="path()" class="rf-system-line" />
      <text [attr.x]="width / 2" [attr.y]="height - 6" text-anchor="middle" class="rf-axis-title">
        Flow ({{ flowUnit() }})
      </text>
      <text
        [attr.transform]="'translate(14,' + height / 2 + ') rotate(-90)'"
        text-anchor="middle"
        class="rf-axis-title"
      >
        Head ({{ headUnit() }})
      </text>
    </svg>
  `,
  styles: `
    .rf-preview {
      width: 100%;
      max-width: 40rem;
      background: #fff;
      border: 1px solid #d8d2c6;
      border-radius: 4px;
      font-size: 11px;
    }
    .rf-grid {
      stroke: #ece7dd;
    }
    .rf-system-line {
      fill: none;
      stroke: var(--rf-water-deep);
      stroke-width: 3;
    }
    .rf-axis-title {
      font-weight: 700;
      fill: var(--rf-ink);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SystemCurvePreview {
  readonly points = input.required<readonly CurvePoint[]>();
  readonly band = input<{ flowMin: number; flowMax: number } | null>(null);
  readonly flowUnit = input.required<string>();
  readonly headUnit = input.required<string>();

  protected readonly width = width;
  protected readonly height = height;
  protected readonly margin = margin;
  protected readonly plotHeight = height - margin.top - margin.bottom;

  private readonly x = computed(() => {
    const last = this.points().at(-1)?.flow ?? 1;
    return scaleLinear()
      .domain([0, last])
      .range([margin.left, width - margin.right])
      .nice();
  });
  private readonly y = computed(() => {
    const highest = Math.max(1, ...this.points().map((point) => point.head));
    const lowest = Math.min(0, ...this.points().map((point) => point.head));
    return scaleLinear()
      .domain([lowest, highest * 1.05])
      .range([height - margin.bottom, margin.top])
      .nice();
  });

  protected readonly path = computed(() => {
    const x = this.x();
    const y = this.y();
    return (
      line<CurvePoint>()
        .x((point) => x(point.flow))
        .y((point) => y(point.head))(this.points() as CurvePoint[]) ?? ''
    );
  });
  protected readonly xTicks = computed(() =>
    this.x()
      .ticks(6)
      .map((value) => ({ value, position: this.x()(value) })),
  );
  protected readonly yTicks = computed(() =>
    this.y()
      .ticks(5)
      .map((value) => ({ value, position: this.y()(value) })),
  );
  protected readonly bandRect = computed(() => {
    const band = this.band();
    if (!band) return null;
    const x = this.x();
    return { x: x(band.flowMin), width: Math.max(1, x(band.flowMax) - x(band.flowMin)) };
  });
  protected readonly summary = computed(() => {
    const points = this.points();
    const first = points[0];
    const last = points.at(-1);
    return first && last
      ? `System curve from ${first.head.toFixed(1)} ${this.headUnit()} at no flow to ${last.head.toFixed(1)} ${this.headUnit()} at ${last.flow.toFixed(0)} ${this.flowUnit()}`
      : 'System curve';
  });
}
