import { stringify } from 'csv-stringify/sync';
import type { DesignDraft, SelectionCandidate } from '../../shared/api/api-schemas';
import { convertLength, FITTINGS, PIPE_SERIES } from '../../shared/hydraulics';
import { spreadsheetSafeText } from '../../data-import/curve-table-writer';
import { designUnits } from './design-selection';

/** Pipe bought beyond the measured length for cuts, joints and waste, percent (common practice). */
export const DEFAULT_WASTE_ALLOWANCE_PERCENT = 10;

/** The standard stick lengths pipe is sold in: 10 and 20 ft in the US trade, 6 m in metric. */
const STICKS = [
  { key: 'sticks10ft', length: 10, unit: 'ft' },
  { key: 'sticks20ft', length: 20, unit: 'ft' },
  { key: 'sticks6m', length: 6, unit: 'm' },
] as const;

export type PartsSection = 'pipe' | 'fitting' | 'valve' | 'equipment' | 'pump';

export interface PartsLine {
  section: PartsSection;
  item: string;
  size: string;
  quantity: number;
  unit: string;
  sticks10ft: number | null;
  sticks20ft: number | null;
  sticks6m: number | null;
  notes: string;
}

const valveKinds = /^(valve-|check-valve-|foot-valve-)/;
/** Entrances and the exit are losses at the pipe's ends, not parts to buy. */
const notParts = /^(entrance-|exit$)/;

/** A pipe's series and nominal size as the trade writes them, e.g. "PVC Schedule 40" and `3"`. */
export function pipeLabels(seriesId: string, sizeId: string): { series: string; size: string } {
  const series = PIPE_SERIES.find((candidate) => candidate.id === seriesId);
  const size = series?.sizes.find((candidate) => candidate.id === sizeId);
  return { series: series?.label ?? seriesId, size: size?.nominalLabel ?? sizeId };
}

/** Whole sticks covering `length`; a quotient within a billionth of a whole number is that number, not one more. */
export function sticksFor(length: number, stickLength: number): number {
  return Math.ceil(Number((length / stickLength).toFixed(9)));
}

function pipeLines(design: DesignDraft, allowancePercent: number): PartsLine[] {
  const unit = designUnits(design).length;
  const totals = new Map<string, { series: string; size: string; length: number }>();
  for (const segment of design.system.segments) {
    const key = `${segment.series}|${segment.size}`;
    const entry = totals.get(key) ?? { series: segment.series, size: segment.size, length: 0 };
    entry.length += segment.length;
    totals.set(key, entry);
  }
  return [...totals.values()].map(({ series, size, length }) => {
    const labels = pipeLabels(series, size);
    const bought = length * (1 + allowancePercent / 100);
    const sticks = Object.fromEntries(
      STICKS.map((stick) => [stick.key, sticksFor(convertLength(bought, unit, stick.unit), stick.length)]),
    ) as Record<(typeof STICKS)[number]['key'], number>;
    return {
      section: 'pipe',
      item: labels.series,
      size: labels.size,
      quantity: Number(bought.toFixed(1)),
      unit,
      ...sticks,
      notes: `${Number(length.toFixed(2))} ${unit} measured + ${allowancePercent} % allowance`,
    };
  });
}

function fittingLines(design: DesignDraft): PartsLine[] {
  const counts = new Map<string, PartsLine>();
  for (const segment of design.system.segments) {
    const labels = pipeLabels(segment.series, segment.size);
    for (const fitting of segment.fittings) {
      if (fitting.count === 0 || notParts.test(fitting.kind)) continue;
      const key = `${fitting.kind}|${segment.size}`;
      const line = counts.get(key) ?? {
        section: valveKinds.test(fitting.kind) ? 'valve' : 'fitting',
        item: FITTINGS.find((entry) => entry.kind === fitting.kind)?.label ?? fitting.kind,
        size: labels.size,
        quantity: 0,
        unit: 'each',
        sticks10ft: null,
        sticks20ft: null,
        sticks6m: null,
        notes: `to suit ${labels.series}`,
      };
      line.quantity += fitting.count;
      counts.set(key, line);
    }
  }
  const order: PartsSection[] = ['fitting', 'valve'];
  return [...counts.values()].sort((a, b) => order.indexOf(a.section) - order.indexOf(b.section));
}

function equipmentLines(design: DesignDraft): PartsLine[] {
  return design.system.segments.flatMap((segment, index) =>
    segment.extraK > 0
      ? [
          {
            section: 'equipment' as const,
            item: 'In-line equipment (filter, manifold or nozzle)',
            size: pipeLabels(segment.series, segment.size).size,
            quantity: 1,
            unit: 'set',
            sticks10ft: null,
            sticks20ft: null,
            sticks6m: null,
            notes: `segment ${index + 1}, counted in the design as K = ${segment.extraK}`,
          },
        ]
      : [],
  );
}

function pumpLines(candidate: SelectionCandidate | null): PartsLine[] {
  if (!candidate) return [];
  const { installed, running } = candidate.arrangement;
  const line = (role: string, quantity: number): PartsLine => ({
    section: 'pump',
    item: `${candidate.supplier} ${candidate.model}`,
    size: candidate.modelCode,
    quantity,
    unit: 'each',
    sticks10ft: null,
    sticks20ft: null,
    sticks6m: null,
    notes: role,
  });
  return [line('duty', running), ...(installed > running ? [line('standby', installed - running)] : [])];
}

/**
 * The crew's parts list of a design: pipe by series and nominal size with the sticks to buy after
 * the allowance, fittings and valves by kind and size, in-line equipment, and the pumps of the
 * chosen candidate (duty and standby).
 */
export function partsList(
  design: DesignDraft,
  chosen: SelectionCandidate | null,
  allowancePercent = DEFAULT_WASTE_ALLOWANCE_PERCENT,
): PartsLine[] {
  return [
    ...pipeLines(design, allowancePercent),
    ...fittingLines(design),
    ...equipmentLines(design),
    ...pumpLines(chosen),
  ];
}

const csvColumns = [
  'section',
  'item',
  'size',
  'quantity',
  'unit',
  'sticks10ft',
  'sticks20ft',
  'sticks6m',
  'notes',
] as const satisfies ReadonlyArray<keyof PartsLine>;

/** The parts list as CSV; a text cell a spreadsheet would run as a formula gets a leading apostrophe. */
export function partsListCsv(lines: readonly PartsLine[]): string {
  const header = ['section', 'item', 'size', 'quantity', 'unit', 'sticks_10ft', 'sticks_20ft', 'sticks_6m', 'notes'];
  const records = lines.map((line) =>
    csvColumns.map((column) => {
      const value = line[column];
      if (value === null) return '';
      return typeof value === 'number' ? String(value) : spreadsheetSafeText(value);
    }),
  );
  return stringify([header, ...records], { record_delimiter: '\n', eof: true });
}
