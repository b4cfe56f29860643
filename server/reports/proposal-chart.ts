import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';

export interface ChartCurve {
  label: string;
  points: ReadonlyArray<{ flow: number; head: number }>;
}

export interface ProposalChartInput {
  system: ReadonlyArray<{ flow: number; head: number }>;
  pumps: readonly ChartCurve[];
  band: { flowMin: number; flowMax: number };
  units: { flow: string; head: string };
}

/** One colour per pump curve, the first (the chosen pump) the darkest; the system curve is black. */
export const pumpColours = ['#0b5563', '#c0632b', '#5a7d2a', '#7b4f9d', '#9a7b12', '#8a3b3b'];

const escapeXml = (text: string) => text.replace(/[&<>"']/g, (character) => `&#${character.charCodeAt(0)};`);

/**
 * The comparison chart as SVG text: the system curve, each pump's combined head curve and the duty
 * band, on linear axes from zero. Drawn on the server with d3-scale and d3-shape (no browser) for
 * svg-to-pdfkit to put into the PDF.
 */
export function proposalChartSvg(input: ProposalChartInput, width = 480, height = 260): string {
  const margin = { top: 10, right: 12, bottom: 34, left: 46 };
  const flows = [...input.system, ...input.pumps.flatMap((pump) => pump.points)].map((point) => point.flow);
  const heads = [...input.system, ...input.pumps.flatMap((pump) => pump.points)].map((point) => point.head);
  const x = scaleLinear()
    .domain([0, Math.max(...flows, input.band.flowMax)])
    .nice()
    .range([margin.left, width - margin.right]);
  const y = scaleLinear()
    .domain([0, Math.max(...heads) * 1.05])
    .nice()
    .range([height - margin.bottom, margin.top]);
  const path = line<{ flow: number; head: number }>()
    .x((point) => x(point.flow))
    .y((point) => y(Math.max(point.head, 0)));
  const top = y.range()[1];
  const bottom = y.range()[0];
  const xTicks = x
    .ticks(6)
    .map(
      (tick) =>
        `<line x1="${x(tick)}" x2="${x(tick)}" y1="${bottom}" y2="${bottom + 4}" stroke="#444"/>` +
        `<text x="${x(tick)}" y="${bottom + 14}" font-size="8" text-anchor="middle" fill="#333">${tick}</text>`,
    );
  const yTicks = y
    .ticks(5)
    .map(
      (tick) =>
        `<line x1="${margin.left - 4}" x2="${width - margin.right}" y1="${y(tick)}" y2="${y(tick)}" stroke="#ddd"/>` +
        `<text x="${margin.left - 6}" y="${y(tick) + 3}" font-size="8" text-anchor="end" fill="#333">${tick}</text>`,
    );
  const pumps = input.pumps.map(
    (pump, index) =>
      `<path d="${path(pump.points as Array<{ flow: number; head: number }>)}" fill="none" stroke="${pumpColours[index % pumpColours.length]}" stroke-width="${index === 0 ? 2 : 1.2}"/>`,
  );
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">`,
    `<rect x="${x(input.band.flowMin)}" y="${top}" width="${x(input.band.flowMax) - x(input.band.flowMin)}" height="${bottom - top}" fill="#e3f1f3"/>`,
    ...yTicks,
    ...xTicks,
    `<line x1="${margin.left}" x2="${width - margin.right}" y1="${bottom}" y2="${bottom}" stroke="#444"/>`,
    `<line x1="${margin.left}" x2="${margin.left}" y1="${top}" y2="${bottom}" stroke="#444"/>`,
    ...pumps,
    `<path d="${path(input.system as Array<{ flow: number; head: number }>)}" fill="none" stroke="#111" stroke-width="1.6" stroke-dasharray="5 3"/>`,
    `<text x="${(margin.left + width - margin.right) / 2}" y="${height - 6}" font-size="9" text-anchor="middle">Flow (${escapeXml(input.units.flow)})</text>`,
    `<text x="12" y="${(top + bottom) / 2}" font-size="9" text-anchor="middle" transform="rotate(-90 12 ${(top + bottom) / 2})">Head (${escapeXml(input.units.head)})</text>`,
    '</svg>',
  ].join('');
}
