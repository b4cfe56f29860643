import { axisBottom, axisLeft } from 'd3-axis';
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { select, type Selection } from 'd3-selection';

/*
 * The one frame of every flow-head chart: the drawing's size, the margins, the two linear scales,
 * the axes with their ticks, the grid and the axis titles. The look is set in attributes (not page
 * CSS), so an exported file looks as the page does; the SVG scales with its container through its
 * viewBox (chart-frame.scss), so a resized page needs no redraw.
 */

/** The one font size of tick labels and axis titles, in SVG units. */
export const CHART_FONT_SIZE = 12;
const fontFamily = 'Lato, Helvetica, Arial, sans-serif';
const ink = '#1f2624';
const gridColour = '#ece7dd';

export type ChartGroup = Selection<SVGGElement, unknown, null, undefined>;

export interface ChartMargin {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

export interface ChartAxis {
  /** From the least to the most value shown; widened to round ticks. */
  domain: [number, number];
  ticks: number;
  /** The title beside the axis; none for a chart too small for one. */
  title?: string;
}

export interface ChartFrameSpec {
  width: number;
  height: number;
  margin: ChartMargin;
  x: ChartAxis;
  y: ChartAxis;
}

export interface ChartFrame {
  root: Selection<SVGSVGElement, unknown, null, undefined>;
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  /** The plot's edges inside the drawing, in SVG units. */
  plot: { left: number; right: number; top: number; bottom: number };
  /** Under the grid and the axes: shaded bands. */
  under: ChartGroup;
  /** Over the frame: the chart's own lines and marks. */
  marks: ChartGroup;
}

/** Draws the frame into `element`, replacing what was there, and gives the scales and layers for the marks. */
export function drawChartFrame(
  element: SVGSVGElement,
  { width, height, margin, x: xAxis, y: yAxis }: ChartFrameSpec,
): ChartFrame {
  const root = select(element);
  root.selectAll('*').remove();
  root
    .attr('viewBox', `0 0 ${width} ${height}`)
    .attr('xmlns', 'http://www.w3.org/2000/svg')
    .attr('font-family', fontFamily)
    .attr('font-size', CHART_FONT_SIZE)
    .classed('rf-framed-chart', true);
  const plot = { left: margin.left, right: width - margin.right, top: margin.top, bottom: height - margin.bottom };
  const x = scaleLinear().domain(xAxis.domain).range([plot.left, plot.right]).nice();
  const y = scaleLinear().domain(yAxis.domain).range([plot.bottom, plot.top]).nice();

  root.append('rect').attr('width', width).attr('height', height).attr('fill', '#ffffff');
  const under = root.append('g').attr('class', 'rf-under');
  const grid = root.append('g').attr('class', 'rf-grid').attr('stroke', gridColour);
  for (const tick of x.ticks(xAxis.ticks))
    grid.append('line').attr('x1', x(tick)).attr('x2', x(tick)).attr('y1', plot.top).attr('y2', plot.bottom);
  for (const tick of y.ticks(yAxis.ticks))
    grid.append('line').attr('x1', plot.left).attr('x2', plot.right).attr('y1', y(tick)).attr('y2', y(tick));

  const axes = [
    root.append('g').attr('transform', `translate(0,${plot.bottom})`).call(axisBottom(x).ticks(xAxis.ticks)),
    root.append('g').attr('transform', `translate(${plot.left},0)`).call(axisLeft(y).ticks(yAxis.ticks)),
  ];
  for (const axis of axes) inheritFont(axis);

  if (xAxis.title)
    appendAxisTitle(root, xAxis.title)
      .attr('x', (plot.left + plot.right) / 2)
      .attr('y', height - 8);
  if (yAxis.title)
    appendAxisTitle(root, yAxis.title).attr('transform', `translate(16,${(plot.top + plot.bottom) / 2}) rotate(-90)`);

  return { root, x, y, plot, under, marks: root.append('g').attr('class', 'rf-marks') };
}

/** d3's axis sets its own small sans-serif font; the chart's font is meant. */
export function inheritFont(axis: ChartGroup): ChartGroup {
  return axis.attr('font-size', null).attr('font-family', null);
}

/** An axis title in the frame's one look; the caller places it. */
export function appendAxisTitle(
  root: Selection<SVGSVGElement, unknown, null, undefined>,
  title: string,
): Selection<SVGTextElement, unknown, null, undefined> {
  return root
    .append('text')
    .attr('class', 'rf-axis-title')
    .attr('text-anchor', 'middle')
    .attr('font-weight', 700)
    .attr('fill', ink)
    .text(title);
}

/** A diagonal hatch (lines at 45 degrees, 8 units apart) for a shaded band, to fill with `url(#id)`. */
export function appendHatchPattern(
  root: Selection<SVGSVGElement, unknown, null, undefined>,
  id: string,
  colours: { fill: string; line: string },
): void {
  const pattern = root
    .append('defs')
    .append('pattern')
    .attr('id', id)
    .attr('width', 8)
    .attr('height', 8)
    .attr('patternUnits', 'userSpaceOnUse')
    .attr('patternTransform', 'rotate(45)');
  pattern.append('rect').attr('width', 8).attr('height', 8).attr('fill', colours.fill);
  pattern.append('line').attr('y2', 8).attr('stroke', colours.line).attr('stroke-width', 2);
}
