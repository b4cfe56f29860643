import type { Selection } from 'd3-selection';

/** A chart's drawing size and the margins around its plot, in SVG units. */
export interface ChartFrame {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

/** How an axis title is set: its baseline's distance above the chart's bottom edge, and its font. */
export interface AxisTitleLook {
  baselineFromBottom: number;
  font: { 'font-size'?: number; 'font-weight'?: number };
}

/** The flow title centred under the plot and the head title beside it, turned a quarter, with the same look. */
export function appendAxisTitles(
  root: Selection<SVGSVGElement, unknown, null, undefined>,
  { width, height, margin }: ChartFrame,
  titles: { flow: string; head: string },
  look: AxisTitleLook,
): void {
  const flow = root
    .append('text')
    .attr('x', (margin.left + width - margin.right) / 2)
    .attr('y', height - look.baselineFromBottom)
    .attr('text-anchor', 'middle');
  const head = root
    .append('text')
    .attr('transform', `translate(16,${(margin.top + height - margin.bottom) / 2}) rotate(-90)`)
    .attr('text-anchor', 'middle');
  for (const [name, value] of Object.entries(look.font)) {
    flow.attr(name, value);
    head.attr(name, value);
  }
  flow.text(titles.flow);
  head.text(titles.head);
}
