import { stringify } from 'csv-stringify/sync';
import type { DesignDraft, SelectionCandidate } from '../../shared/api/api-schemas';
import { convertLength, FITTINGS, lengthToSI, PIPE_SERIES } from '../../shared/hydraulics';
import { DEFAULT_MAX_DROP_PERCENT, smallestConductorForDrop, type ConductorSeries } from '../../shared/electrical';
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

export type PartsSection = 'pipe' | 'fitting' | 'valve' | 'equipment' | 'pump' | 'electrical';

/** A pump's motor rating as the catalog gives it; null where it gives none. */
export interface PumpElectrical {
  fullLoadCurrent: number | null;
  voltage: number | null;
  phases: number | null;
}

type DesignSegment = DesignDraft['system']['segments'][number];

/** Every segment of a design with where it runs: the route or common run first, then each branch's. */
function runsOf(design: DesignDraft): Array<{ segment: DesignSegment; where: string }> {
  const branched = (design.system.branches?.length ?? 0) > 0;
  return [
    ...design.system.segments.map((segment, index) => ({
      segment,
      where: `${branched ? 'common run' : 'segment'} ${index + 1}`,
    })),
    ...(design.system.branches ?? []).flatMap((branch) =>
      branch.segments.map((segment, index) => ({ segment, where: `${branch.name}, segment ${index + 1}` })),
    ),
  ];
}

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
  for (const { segment } of runsOf(design)) {
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
  for (const { segment } of runsOf(design)) {
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
  const unsized = { sticks10ft: null, sticks20ft: null, sticks6m: null };
  return runsOf(design).flatMap(({ segment, where }) => [
    ...(segment.equipment ?? []).map((entry): PartsLine => ({
      section: 'equipment',
      item: entry.name,
      size: pipeLabels(segment.series, segment.size).size,
      quantity: 1,
      unit: 'each',
      ...unsized,
      notes: `${where}, rated ${entry.headLoss} ${designUnits(design).head} at ${entry.atFlow} ${designUnits(design).flow}`,
    })),
    ...(segment.extraK > 0
      ? [
          {
            section: 'equipment' as const,
            item: 'In-line equipment (filter, manifold or nozzle)',
            size: pipeLabels(segment.series, segment.size).size,
            quantity: 1,
            unit: 'set',
            ...unsized,
            notes: `${where}, counted in the design as K = ${segment.extraK}`,
          },
        ]
      : []),
  ]);
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
 * The cable to each pump of the chosen set (duty and standby, each on its own circuit): the
 * design's one-way run with the allowance, in the smallest copper conductor under the 3 % drop at
 * the pump's full-load current (shared/electrical), AWG in US units and mm2 in metric with the
 * other beside it. The electrician decides the cable; the note says so.
 */
function cableLines(
  design: DesignDraft,
  chosen: SelectionCandidate | null,
  electrical: PumpElectrical | null,
  allowancePercent: number,
): PartsLine[] {
  if (!chosen || design.cableLength === undefined) return [];
  const unit = designUnits(design).length;
  const pumps = chosen.arrangement.installed;
  const bought = design.cableLength * pumps * (1 + allowancePercent / 100);
  const line = (size: string, notes: string): PartsLine => ({
    section: 'electrical',
    item: 'Copper pump cable',
    size,
    quantity: Number(bought.toFixed(1)),
    unit,
    sticks10ft: null,
    sticks20ft: null,
    sticks6m: null,
    notes,
  });
  const runs = `${pumps} circuit${pumps > 1 ? 's' : ''} of ${design.cableLength} ${unit} one way + ${allowancePercent} % allowance`;
  const { fullLoadCurrent: current, voltage, phases } = electrical ?? {};
  if (!current || !voltage || (phases !== 1 && phases !== 3))
    return [line('to be sized', `${runs}; the catalog gives no full-load current, voltage and phases for this pump`)];
  const run = { current, voltage, phases, length: lengthToSI(design.cableLength, unit) } as const;
  const sized = (series: ConductorSeries) => {
    try {
      return smallestConductorForDrop(series, run).conductor.label;
    } catch {
      return null;
    }
  };
  const [first, second] =
    design.unitSystem === 'us' ? [sized('awg'), sized('metric')] : [sized('metric'), sized('awg')];
  if (first === null)
    return [line('to be sized', `${runs}; no listed conductor keeps the drop under ${DEFAULT_MAX_DROP_PERCENT} %`)];
  return [
    line(
      second === null ? first : `${first} (or ${second})`,
      `${runs}; smallest under ${DEFAULT_MAX_DROP_PERCENT} % drop at ${current} A, ${voltage} V, ${phases} phase; a licensed electrician and the local code decide the cable`,
    ),
  ];
}

/**
 * The crew's parts list of a design: pipe by series and nominal size with the sticks to buy after
 * the allowance, fittings and valves by kind and size, in-line equipment, the pumps of the
 * chosen candidate (duty and standby) and, with a cable run, the cable to each of them, over the
 * route or the common run and every branch.
 */
export function partsList(
  design: DesignDraft,
  chosen: SelectionCandidate | null,
  allowancePercent = DEFAULT_WASTE_ALLOWANCE_PERCENT,
  electrical: PumpElectrical | null = null,
): PartsLine[] {
  return [
    ...pipeLines(design, allowancePercent),
    ...fittingLines(design),
    ...equipmentLines(design),
    ...pumpLines(chosen),
    ...cableLines(design, chosen, electrical, allowancePercent),
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
