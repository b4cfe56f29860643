import { join } from 'node:path';
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import type { DesignDraft, ReportPaper, SelectionCandidate } from '../../shared/api/api-schemas';
import { FITTINGS } from '../../shared/hydraulics';
import { projectRoot } from '../config';
import type { DesignFigures } from './design-selection';
import { designStaticHead } from '../../shared/api/design-system';
import { designUnits } from './design-selection';
import { pipeLabels, type PartsLine } from './parts-list';
import { proposalChartSvg, pumpColours } from './proposal-chart';
import { candidateCosts, figure, LIFE_CYCLE_YEARS, type PumpPrice } from './proposal-costs';
import { DESIGN_CAUTIONS } from '../../shared/messages/design-cautions';

/*
 * The proposal's layout. pdfkit because it is a well-kept, pure-JavaScript PDF writer for Node: it
 * embeds the app's own font (Lato, from its WOFF files) so the PDF reads the same everywhere, and
 * with svg-to-pdfkit it draws the comparison chart from SVG text, all without a browser.
 */

const latoFolder = join(projectRoot, 'node_modules', '@fontsource', 'lato', 'files');
const fonts = { regular: 'Lato', bold: 'Lato-Bold' } as const;
/** Alternatives shown beside the chosen pump. */
const alternativesShown = 5;

export interface ProposalProfile {
  name: string;
  address: string;
  phone: string;
  email: string;
  licenceNumber: string;
  logo: Buffer | null;
}

export interface ProposalContent {
  paper: ReportPaper;
  profile: ProposalProfile;
  projectName: string;
  clientName: string;
  siteAddress: string;
  /** The client's e-mail and phone, when the project records them. */
  clientContact: string;
  design: DesignDraft;
  figures: DesignFigures;
  /** List prices by pump id, where the catalog has them. */
  prices: ReadonlyMap<number, PumpPrice>;
  parts: readonly PartsLine[];
  madeAt: Date;
  catalogRevision: number;
}

interface Column {
  label: string;
  width: number;
  align?: 'left' | 'right';
}

type Doc = PDFKit.PDFDocument;

function bottomOf(doc: Doc): number {
  return doc.page.height - doc.page.margins.bottom;
}

function heading(doc: Doc, text: string): void {
  if (doc.y + 60 > bottomOf(doc)) doc.addPage();
  doc.moveDown(0.8).font(fonts.bold).fontSize(12).fillColor('#0b5563').text(text, doc.page.margins.left);
  doc.moveDown(0.2).font(fonts.regular).fontSize(9).fillColor('#111');
}

/** Rows of cells under a header row, a new page (header again) whenever the next row would not fit. */
function table(doc: Doc, columns: readonly Column[], rows: ReadonlyArray<readonly string[]>): void {
  const left = doc.page.margins.left;
  const rowHeight = (cells: readonly string[]) =>
    Math.max(...cells.map((cell, index) => doc.heightOfString(cell, { width: columns[index].width - 4 }))) + 4;
  const drawRow = (cells: readonly string[], bold: boolean) => {
    doc.font(bold ? fonts.bold : fonts.regular).fontSize(8.5);
    const height = rowHeight(cells);
    if (doc.y + height > bottomOf(doc)) {
      doc.addPage();
      if (!bold)
        drawRow(
          columns.map((column) => column.label),
          true,
        );
      doc.font(bold ? fonts.bold : fonts.regular).fontSize(8.5);
    }
    const top = doc.y;
    let x = left;
    cells.forEach((cell, index) => {
      doc.text(cell, x + 2, top + 2, { width: columns[index].width - 4, align: columns[index].align ?? 'left' });
      x += columns[index].width;
    });
    const width = columns.reduce((sum, column) => sum + column.width, 0);
    doc
      .moveTo(left, top + height)
      .lineTo(left + width, top + height)
      .lineWidth(0.4)
      .strokeColor(bold ? '#555' : '#ccc')
      .stroke();
    doc.x = left;
    doc.y = top + height;
  };
  drawRow(
    columns.map((column) => column.label),
    true,
  );
  for (const row of rows) drawRow(row, false);
  doc.font(fonts.regular).fontSize(9);
}

function facts(doc: Doc, pairs: ReadonlyArray<readonly [string, string]>): void {
  for (const [label, value] of pairs) {
    doc.font(fonts.bold).text(`${label}: `, { continued: true }).font(fonts.regular).text(value);
  }
}

function header(doc: Doc, content: ProposalContent): void {
  const { profile } = content;
  const left = doc.page.margins.left;
  const right = doc.page.width - doc.page.margins.right;
  let textLeft = left;
  if (profile.logo) {
    doc.image(profile.logo, left, doc.page.margins.top, { fit: [120, 60] });
    textLeft = left + 132;
  }
  doc
    .font(fonts.bold)
    .fontSize(15)
    .fillColor('#111')
    .text(profile.name || 'Company profile not filled in', textLeft, doc.page.margins.top, { width: 250 });
  doc.font(fonts.regular).fontSize(8.5);
  const lines = [
    ...profile.address.split('\n'),
    [profile.phone, profile.email].filter(Boolean).join('  |  '),
    profile.licenceNumber ? `Licence ${profile.licenceNumber}` : '',
  ].filter((line) => line.trim() !== '');
  for (const line of lines) doc.text(line, textLeft, undefined, { width: 250 });
  const below = Math.max(doc.y, doc.page.margins.top + (profile.logo ? 64 : 0));
  doc
    .font(fonts.bold)
    .fontSize(13)
    .text('Pump proposal', right - 200, doc.page.margins.top, { width: 200, align: 'right' });
  doc
    .font(fonts.regular)
    .fontSize(8.5)
    .text(content.projectName, { width: 200, align: 'right' })
    .text(`Made ${content.madeAt.toISOString().slice(0, 10)}`, { width: 200, align: 'right' })
    .text(`Catalog revision ${content.catalogRevision}`, { width: 200, align: 'right' });
  doc.x = left;
  doc.y = Math.max(below, doc.y) + 8;
  doc.moveTo(left, doc.y).lineTo(right, doc.y).lineWidth(1).strokeColor('#0b5563').stroke();
  doc.moveDown(0.5);
}

function systemSection(doc: Doc, content: ProposalContent): void {
  const { design } = content;
  const units = designUnits(design);
  const { system } = design;
  heading(doc, 'Measured system');
  facts(doc, [
    ...(system.staticMode === 'levels'
      ? ([
          ['Intake water level', `${figure(system.intakeLevel, 2)} ${units.head}`],
          ['Discharge level', `${figure(system.dischargeLevel, 2)} ${units.head}`],
        ] as const)
      : []),
    ['Static head', `${figure(designStaticHead(design.system), 2)} ${units.head}`],
    ['Outlet pressure head', `${figure(system.outletPressureHead, 2)} ${units.head}`],
    ['Water', `${system.waterTemperatureC} C`],
    ['Friction', system.frictionMethod === 'hazen-williams' ? 'Hazen-Williams' : 'Darcy-Weisbach with Colebrook'],
  ]);
  doc.moveDown(0.4);
  table(
    doc,
    [
      { label: 'Segment', width: 50 },
      { label: 'Pipe', width: 150 },
      { label: `Length (${units.length})`, width: 70, align: 'right' },
      { label: 'Fittings', width: 180 },
      { label: 'Extra K', width: 45, align: 'right' },
    ],
    system.segments.map((segment, index) => {
      const labels = pipeLabels(segment.series, segment.size);
      const fittings = segment.fittings
        .filter((fitting) => fitting.count > 0)
        .map((fitting) => `${fitting.count} x ${FITTINGS.find((entry) => entry.kind === fitting.kind)?.label}`);
      return [
        String(index + 1),
        `${labels.series}, ${labels.size}`,
        figure(segment.length, 2),
        fittings.join(', ') || 'none',
        String(segment.extraK),
      ];
    }),
  );
}

function bandSection(doc: Doc, content: ProposalContent): void {
  const units = designUnits(content.design);
  const { band } = content.design;
  const { headAtBand } = content.figures;
  heading(doc, 'Duty band');
  doc.text(
    `The planned filtration needs ${figure(band.flowMin, 1)} to ${figure(band.flowMax, 1)} ${units.flow}; ` +
      `the system needs ${figure(headAtBand.min, 2)} to ${figure(headAtBand.max, 2)} ${units.head} of total dynamic head over that band.`,
  );
}

/** A variable- or multi-speed pump's running speed, as the search chose it. */
function speedWords(speed: NonNullable<SelectionCandidate['speed']>): string {
  return `at ${Math.round(speed.rpm)} rpm (${Math.round(100 * speed.ratio)} % speed)`;
}

function candidateRow(candidate: SelectionCandidate, content: ProposalContent): string[] {
  const point = candidate.operatingPoint;
  const costs = candidateCosts(candidate, content.prices);
  const money = (value: number | null) => (value === null ? '-' : `${figure(value, 0)} ${costs.currency ?? ''}`.trim());
  return [
    String(candidate.rank),
    `${candidate.supplier} ${candidate.model} (${candidate.modelCode})${candidate.speed ? `, ${speedWords(candidate.speed)}` : ''}`,
    `${candidate.arrangement.running} run / ${candidate.arrangement.installed} inst.`,
    figure(point.flow, 1),
    figure(point.head, 2),
    figure(point.efficiency, 1),
    figure(candidate.annualKWh, 0),
    candidate.annualCost === null ? '-' : figure(candidate.annualCost, 0),
    money(costs.firstCost),
    money(costs.lifeCycleCost),
  ];
}

function pumpsSection(doc: Doc, content: ProposalContent): SelectionCandidate[] {
  const units = designUnits(content.design);
  const shown = content.figures.selection.candidates.slice(0, 1 + alternativesShown);
  heading(doc, 'Chosen pump and alternatives');
  if (shown.length === 0) {
    doc.text('No catalog pump meets this system in the arrangements asked for.');
    return shown;
  }
  const chosen = shown[0];
  facts(doc, [
    ['Chosen', `${chosen.supplier} ${chosen.model} (${chosen.modelCode})`],
    ...(chosen.speed
      ? [['Speed', `Run ${speedWords(chosen.speed)} by its drive or controller`] as [string, string]]
      : []),
    [
      'Duty point',
      `${figure(chosen.operatingPoint.flow, 1)} ${units.flow} at ${figure(chosen.operatingPoint.head, 2)} ${units.head} TDH`,
    ],
    ['Energy', `${figure(chosen.annualKWh, 0)} kWh per year`],
    ['Why', chosen.reasons.join('; ') || '-'],
  ]);
  doc.moveDown(0.4);
  table(
    doc,
    [
      { label: 'Rank', width: 28 },
      { label: 'Pump', width: 118 },
      { label: 'Pumps', width: 58 },
      { label: `Flow (${units.flow})`, width: 44, align: 'right' },
      { label: `TDH (${units.head})`, width: 40, align: 'right' },
      { label: 'Eff. (%)', width: 34, align: 'right' },
      { label: 'kWh / year', width: 44, align: 'right' },
      { label: 'Energy / year', width: 44, align: 'right' },
      { label: 'First cost', width: 45, align: 'right' },
      { label: `${LIFE_CYCLE_YEARS}-year cost`, width: 50, align: 'right' },
    ],
    shown.map((candidate) => candidateRow(candidate, content)),
  );
  doc
    .moveDown(0.3)
    .fontSize(7.5)
    .text(
      `First cost is the catalog list price of the installed pumps; the ${LIFE_CYCLE_YEARS}-year cost adds ${LIFE_CYCLE_YEARS} years of energy at the design's tariff, undiscounted, without installation or upkeep.`,
    )
    .fontSize(9);
  return shown;
}

function chartSection(doc: Doc, content: ProposalContent, shown: readonly SelectionCandidate[]): void {
  if (shown.length === 0) return;
  const units = designUnits(content.design);
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const height = width * 0.5;
  // the heading goes with its chart onto the next page when they do not fit together
  if (doc.y + height + 80 > bottomOf(doc)) doc.addPage();
  heading(doc, 'Comparison chart');
  const svg = proposalChartSvg(
    {
      system: content.figures.systemCurve,
      pumps: shown.map((candidate) => ({ label: candidate.model, points: candidate.curve })),
      band: content.design.band,
      units,
    },
    width,
    height,
  );
  SVGtoPDF(doc, svg, doc.page.margins.left, doc.y, {
    width,
    height,
    assumePt: true,
    fontCallback: () => fonts.regular,
  });
  doc.y += height + 4;
  doc.fontSize(8);
  doc.text('Dashed: the system curve. Shaded: the duty band. ', doc.page.margins.left, doc.y, { continued: true });
  shown.forEach((candidate, index) => {
    doc
      .fillColor(pumpColours[index % pumpColours.length])
      .text(`${candidate.rank}. ${candidate.model}  `, { continued: index < shown.length - 1 });
  });
  doc.fillColor('#111').fontSize(9);
}

function cautionsSection(doc: Doc): void {
  heading(doc, 'Before anything is built or wired');
  for (const caution of DESIGN_CAUTIONS) {
    doc.font(fonts.bold).text(`${caution.title} `, { continued: true }).font(fonts.regular).text(caution.text);
    doc.moveDown(0.2);
  }
  doc.text('Local codes and licensed practice come first wherever they differ from this proposal.');
}

function partsSection(doc: Doc, parts: readonly PartsLine[]): void {
  doc.addPage();
  heading(doc, "Crew's parts list");
  table(
    doc,
    [
      { label: 'Section', width: 50 },
      { label: 'Item', width: 130 },
      { label: 'Size', width: 55 },
      { label: 'Quantity', width: 60, align: 'right' },
      { label: '10 ft', width: 32, align: 'right' },
      { label: '20 ft', width: 32, align: 'right' },
      { label: '6 m', width: 32, align: 'right' },
      { label: 'Notes', width: 104 },
    ],
    parts.map((line) => [
      line.section,
      line.item,
      line.size,
      `${line.quantity} ${line.unit}`,
      line.sticks10ft === null ? '' : String(line.sticks10ft),
      line.sticks20ft === null ? '' : String(line.sticks20ft),
      line.sticks6m === null ? '' : String(line.sticks6m),
      line.notes,
    ]),
  );
}

/** The whole proposal as PDF bytes. */
export function proposalPdf(content: ProposalContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: content.paper === 'a4' ? 'A4' : 'LETTER',
    margin: 48,
    info: { Title: `Pump proposal: ${content.projectName}`, Author: content.profile.name, Producer: 'Riffle' },
  });
  doc.registerFont(fonts.regular, join(latoFolder, 'lato-latin-400-normal.woff'));
  doc.registerFont(fonts.bold, join(latoFolder, 'lato-latin-700-normal.woff'));
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  header(doc, content);
  heading(doc, 'Client and site');
  facts(doc, [
    ['Client', content.clientName || '-'],
    ...(content.clientContact ? ([['Contact', content.clientContact]] as const) : []),
    ['Site', content.siteAddress || '-'],
  ]);
  systemSection(doc, content);
  bandSection(doc, content);
  const shown = pumpsSection(doc, content);
  chartSection(doc, content, shown);
  cautionsSection(doc);
  partsSection(doc, content.parts);
  doc.end();
  return done;
}
