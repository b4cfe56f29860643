import type { Selection } from 'd3-selection';
import {
  line,
  symbol,
  symbolCircle,
  symbolCross,
  symbolDiamond,
  symbolSquare,
  symbolStar,
  symbolTimes,
  symbolTriangle,
  symbolWye,
} from 'd3-shape';
import { appendHatchPattern, drawChartFrame } from '../../shared/chart-frame';

/*
 * The comparison chart, drawn with d3 into the charts' one frame (chart-frame.ts), whose look lives
 * in attributes, so the exported file looks the same as the page. Each candidate has its own colour, dash and
 * mark, so the chart still reads printed in grey.
 */

export interface ChartPoint {
  flow: number;
  head: number;
}

export interface ChartCandidate {
  key: string;
  label: string;
  /** N / N_nominal of a pump the search runs at a speed (its curve is at that speed); null at nominal speed. */
  speedRatio: number | null;
  curve: ChartPoint[];
  preferredRange: { flowMin: number; flowMax: number } | null;
  operatingPoint: ChartPoint;
  oneFailed: ChartPoint | null;
}

export interface ChartModel {
  systemCurve: ChartPoint[];
  band: { flowMin: number; flowMax: number };
  candidates: ChartCandidate[];
  flowUnit: string;
  headUnit: string;
}

export interface ChartStyle {
  colour: string;
  dash: string;
  mark: string;
}

const colours = ['#12383d', '#b5643c', '#5b7f2a', '#7b3f6e', '#3d5a99', '#a07c12', '#9c3b2f', '#4f6d64'];
const dashes = ['', '9 4', '2 3', '10 3 2 3', '5 5', '14 4 4 4', '1 5', '7 2'];
const marks = [
  symbolCircle,
  symbolSquare,
  symbolTriangle,
  symbolDiamond,
  symbolCross,
  symbolStar,
  symbolWye,
  symbolTimes,
];
const markNames = ['circle', 'square', 'triangle', 'diamond', 'cross', 'star', 'wye', 'times'];

/** The style of the candidate at `index` (0-7), also used by the page's table headings. */
export function chartStyle(index: number): ChartStyle {
  return {
    colour: colours[index % colours.length],
    dash: dashes[index % dashes.length],
    mark: markNames[index % markNames.length],
  };
}

const chartSize = { width: 900, height: 520 };
/** The right margin holds the legend. */
const margin = { top: 20, right: 290, bottom: 50, left: 60 };

export interface ChartHandlers {
  /** A candidate's point (or curve) was hovered or focused; null when it is left. */
  focus: (key: string | null, which: 'operating' | 'one-failed') => void;
}

/** Draws the whole chart into `element`, replacing what was there. */
export function drawComparisonChart(element: SVGSVGElement, model: ChartModel, handlers: ChartHandlers): void {
  const { width, height } = chartSize;
  const maxFlow = Math.max(
    model.band.flowMax * 1.3,
    ...model.candidates.flatMap((candidate) => candidate.curve.map((point) => point.flow)),
  );
  const maxHead = Math.max(
    ...model.candidates.flatMap((candidate) => candidate.curve.map((point) => point.head)),
    ...model.systemCurve.map((point) => point.head),
  );
  const frame = drawChartFrame(element, {
    width,
    height,
    margin,
    x: { domain: [0, maxFlow], ticks: 8, title: `Flow (${model.flowUnit})` },
    y: { domain: [0, maxHead * 1.05], ticks: 8, title: `Head (${model.headUnit})` },
  });
  const { root: svg, x, y, plot: edges } = frame;
  svg
    .attr('role', 'group')
    .attr(
      'aria-label',
      `System curve, duty band and ${model.candidates.length} pump curves with their operating points`,
    );
  const path = line<ChartPoint>()
    .x((point) => x(point.flow))
    .y((point) => y(point.head));

  appendHatchPattern(svg, 'rf-band-hatch', { fill: '#edf3ef', line: '#9bb8aa' });
  svg
    .append('defs')
    .append('clipPath')
    .attr('id', 'rf-plot-clip')
    .append('rect')
    .attr('x', edges.left)
    .attr('y', edges.top)
    .attr('width', edges.right - edges.left)
    .attr('height', edges.bottom - edges.top);

  frame.under
    .append('rect')
    .attr('class', 'rf-duty-band')
    .attr('x', x(model.band.flowMin))
    .attr('y', edges.top)
    .attr('width', Math.max(1, x(model.band.flowMax) - x(model.band.flowMin)))
    .attr('height', edges.bottom - edges.top)
    .attr('fill', 'url(#rf-band-hatch)');
  frame.marks
    .append('text')
    .attr('x', (x(model.band.flowMin) + x(model.band.flowMax)) / 2)
    .attr('y', edges.top + 14)
    .attr('text-anchor', 'middle')
    .attr('fill', '#33584a')
    .attr('font-weight', 700)
    .text('duty band');

  const plot = frame.marks.append('g').attr('clip-path', 'url(#rf-plot-clip)');
  plot
    .append('path')
    .attr('class', 'rf-system-curve')
    .attr('d', path(model.systemCurve))
    .attr('fill', 'none')
    .attr('stroke', '#1f2624')
    .attr('stroke-width', 3.5);

  model.candidates.forEach((candidate, index) => {
    const style = chartStyle(index);
    // the curve's shut-off head and speed as data, for a reader (and a test) without the drawing
    const group = plot
      .append('g')
      .attr('data-candidate', candidate.key)
      .attr('data-speed-ratio', candidate.speedRatio)
      .attr('data-shut-off-head', candidate.curve[0]?.head ?? null);
    if (candidate.preferredRange) {
      const { flowMin, flowMax } = candidate.preferredRange;
      const inRange = candidate.curve.filter((point) => point.flow >= flowMin && point.flow <= flowMax);
      group
        .append('path')
        .attr('class', 'rf-preferred-band')
        .attr('d', path(inRange))
        .attr('fill', 'none')
        .attr('stroke', style.colour)
        .attr('stroke-width', 9)
        .attr('stroke-opacity', 0.28)
        .attr('stroke-linecap', 'round');
    }
    group
      .append('path')
      .attr('class', 'rf-pump-curve')
      .attr('d', path(candidate.curve))
      .attr('fill', 'none')
      .attr('stroke', style.colour)
      .attr('stroke-width', 2.2)
      .attr('stroke-dasharray', style.dash || null)
      .on('mouseenter', () => handlers.focus(candidate.key, 'operating'))
      .on('mouseleave', () => handlers.focus(null, 'operating'));
  });

  // Marks above every curve so no curve hides a point.
  model.candidates.forEach((candidate, index) => {
    const style = chartStyle(index);
    const shape = symbol(marks[index % marks.length], 110);
    const points: Array<[ChartPoint, 'operating' | 'one-failed']> = [[candidate.operatingPoint, 'operating']];
    if (candidate.oneFailed) points.push([candidate.oneFailed, 'one-failed']);
    for (const [point, which] of points) {
      frame.marks
        .append('path')
        .attr('class', which === 'operating' ? 'rf-operating-point' : 'rf-one-failed-point')
        .attr('d', shape())
        .attr('transform', `translate(${x(point.flow)},${y(point.head)})`)
        .attr('fill', which === 'operating' ? style.colour : '#ffffff')
        .attr('stroke', style.colour)
        .attr('stroke-width', 2)
        .attr('tabindex', 0)
        .attr('role', 'button')
        .attr(
          'aria-label',
          `${candidate.label}, ${which === 'operating' ? 'operating point' : 'with one pump failed'}: ${point.flow.toFixed(1)} ${model.flowUnit} at ${point.head.toFixed(1)} ${model.headUnit}`,
        )
        .on('mouseenter focus', () => handlers.focus(candidate.key, which))
        .on('mouseleave blur', () => handlers.focus(null, which));
    }
  });

  const legend = svg.append('g').attr('transform', `translate(${width - margin.right + 18},${margin.top})`);
  type LegendRow = Selection<SVGGElement, unknown, null, undefined>;
  const entries: Array<{ label: string; draw: (row: LegendRow) => void }> = [
    {
      label: 'System curve',
      draw: (row) => row.append('line').attr('x2', 28).attr('stroke', '#1f2624').attr('stroke-width', 3.5),
    },
    {
      label: 'Duty band',
      draw: (row) =>
        row
          .append('rect')
          .attr('y', -7)
          .attr('width', 28)
          .attr('height', 14)
          .attr('fill', 'url(#rf-band-hatch)')
          .attr('stroke', '#9bb8aa'),
    },
    ...model.candidates.map((candidate, index) => ({
      label: candidate.label,
      draw: (row: LegendRow) => {
        const style = chartStyle(index);
        row
          .append('line')
          .attr('x2', 28)
          .attr('stroke', style.colour)
          .attr('stroke-width', 2.2)
          .attr('stroke-dasharray', style.dash || null);
        row
          .append('path')
          .attr('d', symbol(marks[index % marks.length], 80)())
          .attr('transform', 'translate(14,0)')
          .attr('fill', style.colour)
          .attr('stroke', style.colour);
      },
    })),
    {
      label: 'Preferred region (wide band)',
      draw: (row) =>
        row
          .append('line')
          .attr('x2', 28)
          .attr('stroke', '#5f6b68')
          .attr('stroke-width', 9)
          .attr('stroke-opacity', 0.28),
    },
    {
      label: 'Hollow mark: one pump failed',
      draw: (row) =>
        row
          .append('circle')
          .attr('cx', 14)
          .attr('r', 5)
          .attr('fill', '#ffffff')
          .attr('stroke', '#1f2624')
          .attr('stroke-width', 2),
    },
  ];
  let top = 0;
  for (const entry of entries) {
    const lines = wrapLabel(entry.label);
    const row = legend.append('g').attr('class', 'rf-legend-entry').attr('transform', `translate(0,${top})`);
    entry.draw(row);
    const text = row.append('text');
    lines.forEach((line, lineIndex) =>
      text
        .append('tspan')
        .attr('x', 36)
        .attr('dy', lineIndex === 0 ? '0.32em' : '1.2em')
        .text(line),
    );
    top += 10 + 14 * lines.length;
  }
}

/** A legend label in lines of at most 30 characters, broken between words; two lines at most. */
function wrapLabel(label: string): string[] {
  const lines: string[] = [];
  for (const word of label.split(' ')) {
    const last = lines.at(-1);
    if (last !== undefined && `${last} ${word}`.length <= 30) lines[lines.length - 1] = `${last} ${word}`;
    else lines.push(word);
  }
  return lines.length <= 2 ? lines : [lines[0], `${lines.slice(1).join(' ').slice(0, 29)}…`];
}
