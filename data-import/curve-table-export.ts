import type { CurveFileUnits } from '../shared/api/api-schemas';
import {
  convertDiameter,
  flowFromSI,
  headFromSI,
  powerFromSI,
  type FlowUnit,
  type HeadUnit,
  type PowerUnit,
} from '../shared/hydraulics';
import type { PumpKind, PumpStatus } from '../shared/vocabularies';
import { pointColumns, pumpColumns, type CurveTableColumn } from './curve-table-format';
import { formatCurveTable, type CurveTableDraft } from './curve-table-writer';

type Row = Partial<Record<CurveTableColumn, string | number | null>>;

/** Fifteen significant figures: a number read from a file comes back as it was typed, so loading the export again changes nothing. */
function exact(value: number): string {
  return Number(value.toPrecision(15)).toString();
}

/** The value most pumps used, or the fallback when none gave one. */
function mostCommon<T extends string>(values: ReadonlyArray<T | undefined>, fallback: T): T {
  const counts = new Map<T, number>();
  for (const value of values) if (value !== undefined) counts.set(value, (counts.get(value) ?? 0) + 1);
  return [...counts.entries()].sort((a, b) => b[1] - a[1])[0]?.[0] ?? fallback;
}

/** A stored pump with its current curve revision, as the catalog store reads it (SI units). */
export interface StoredPumpCurve {
  modelCode: string;
  displayName: string;
  kind: PumpKind;
  nominalSpeedRpm: number | null;
  voltageV: number | null;
  phaseCount: number | null;
  fullLoadCurrentA?: number | null;
  speedMinRpm?: number | null;
  speedMaxRpm?: number | null;
  /** rpm ascending, as the pumps table keeps them (`1450;2900`). */
  fixedSpeedsRpm?: string | null;
  dischargeSizeMm: number | null;
  solidsHandlingMm: number | null;
  listPrice: string | null;
  priceCurrency: string | null;
  motorEfficiency?: number | null;
  status: PumpStatus;
  currentRevision?: {
    fileUnits: object;
    notes: string | null;
    points?: ReadonlyArray<{
      flowM3s: number;
      headM: number;
      powerW: number | null;
      efficiency: number | null;
      npshRequiredM: number | null;
    }>;
    declaredRanges?: ReadonlyArray<{ region: 'preferred' | 'allowable'; flowMinM3s: number; flowMaxM3s: number }>;
  } | null;
}

export interface CurveTableExport {
  text: string;
  pumpCount: number;
  units: CurveFileUnits;
}

/**
 * A supplier's current curves as a curve table (format version 1, data-import/README.md), to keep,
 * edit and load again. Each quantity is written in the unit most of the pumps' own files used;
 * a pump loaded in other units is converted. Retired pumps are written with their status. A
 * price in another currency than the file's is left out, and a comment says so. Pumps in model-code
 * order, points in curve order.
 */
export function curveTableOf(supplier: { name: string; code: string }, pumps: StoredPumpCurve[]): CurveTableExport {
  const declared = pumps.map((pump) => (pump.currentRevision?.fileUnits ?? {}) as Partial<CurveFileUnits>);
  const units: CurveFileUnits = {
    flow: mostCommon<FlowUnit>(
      declared.map((file) => file.flow),
      'm3/h',
    ),
    head: mostCommon<HeadUnit>(
      declared.map((file) => file.head),
      'm',
    ),
    power: mostCommon<PowerUnit>(
      declared.map((file) => file.power),
      'kW',
    ),
    efficiency: mostCommon<'%' | 'fraction'>(
      declared.map((file) => file.efficiency),
      '%',
    ),
    npsh: mostCommon<HeadUnit>(
      declared.map((file) => file.npsh),
      'm',
    ),
    size: mostCommon<'mm' | 'in'>(
      declared.map((file) => file.size),
      'mm',
    ),
    powerBasis: mostCommon<'shaft' | 'electrical'>(
      declared.map((file) => file.powerBasis),
      'shaft',
    ),
  };
  const currency = mostCommon<string>(
    pumps.map((pump) => pump.priceCurrency ?? undefined),
    'USD',
  );
  const size = (millimetres: number | null) =>
    millimetres === null ? null : exact(units.size === 'in' ? convertDiameter(millimetres, 'mm', 'in') : millimetres);
  const points = pumps.flatMap((pump) => pump.currentRevision?.points ?? []);
  const ranges = pumps.flatMap((pump) => pump.currentRevision?.declaredRanges ?? []);
  const has = {
    power: points.some((point) => point.powerW !== null),
    efficiency: points.some((point) => point.efficiency !== null),
    npsh: points.some((point) => point.npshRequiredM !== null),
    size: pumps.some((pump) => pump.dischargeSizeMm !== null || pump.solidsHandlingMm !== null),
    price: pumps.some((pump) => pump.listPrice !== null),
    motor: pumps.some((pump) => (pump.motorEfficiency ?? null) !== null),
    current: pumps.some((pump) => (pump.fullLoadCurrentA ?? null) !== null),
    speedRange: pumps.some((pump) => (pump.speedMinRpm ?? null) !== null),
    fixedSpeeds: pumps.some((pump) => (pump.fixedSpeedsRpm ?? null) !== null),
  };
  const comments = [
    `Curve table of ${supplier.name} (${supplier.code}), written by Riffle. Loaded again unchanged, it changes nothing.`,
  ];
  const otherCurrency = pumps
    .filter((pump) => pump.listPrice !== null && pump.priceCurrency !== currency)
    .map((pump) => pump.modelCode);
  if (otherCurrency.length > 0)
    comments.push(`Prices in other currencies than ${currency} are left out: ${otherCurrency.join(', ')}.`);

  // the format's own column order, less the optional columns no pump has anything for
  const unused = new Set<CurveTableColumn>([
    ...(has.size ? [] : (['discharge_size', 'solids_size'] as const)),
    ...(has.price ? [] : (['list_price'] as const)),
    ...(has.motor ? [] : (['motor_efficiency'] as const)),
    ...(has.current ? [] : (['full_load_current'] as const)),
    ...(has.speedRange ? [] : (['speed_min_rpm', 'speed_max_rpm'] as const)),
    ...(has.fixedSpeeds ? [] : (['speeds_rpm'] as const)),
    ...(ranges.length > 0
      ? []
      : (['preferred_flow_min', 'preferred_flow_max', 'allowable_flow_min', 'allowable_flow_max'] as const)),
    ...(has.power ? [] : (['power'] as const)),
    ...(has.efficiency ? [] : (['efficiency'] as const)),
    ...(has.npsh ? [] : (['npsh_required'] as const)),
  ]);
  const columns = [...pumpColumns, ...pointColumns].filter((column) => !unused.has(column));
  const flow = (value: number) => exact(flowFromSI(value, units.flow));
  const rows: Row[] = pumps.flatMap((pump) => {
    const revision = pump.currentRevision!;
    const range = (region: 'preferred' | 'allowable') =>
      revision.declaredRanges?.find((candidate) => candidate.region === region);
    const preferred = range('preferred');
    const allowable = range('allowable');
    const details: Row = {
      display_name: pump.displayName,
      kind: pump.kind,
      speed_rpm: pump.nominalSpeedRpm,
      speed_min_rpm: pump.speedMinRpm ?? null,
      speed_max_rpm: pump.speedMaxRpm ?? null,
      speeds_rpm: pump.fixedSpeedsRpm ?? null,
      voltage: pump.voltageV,
      phases: pump.phaseCount,
      full_load_current: pump.fullLoadCurrentA == null ? null : exact(pump.fullLoadCurrentA),
      discharge_size: size(pump.dischargeSizeMm),
      solids_size: size(pump.solidsHandlingMm),
      list_price: pump.priceCurrency === currency ? pump.listPrice : null,
      motor_efficiency: pump.motorEfficiency == null ? null : exact(pump.motorEfficiency * 100),
      status: pump.status,
      preferred_flow_min: preferred ? flow(preferred.flowMinM3s) : null,
      preferred_flow_max: preferred ? flow(preferred.flowMaxM3s) : null,
      allowable_flow_min: allowable ? flow(allowable.flowMinM3s) : null,
      allowable_flow_max: allowable ? flow(allowable.flowMaxM3s) : null,
      notes: revision.notes,
    };
    return (revision.points ?? []).map((point, index) => ({
      model_code: pump.modelCode,
      ...(index === 0 ? details : {}),
      flow: flow(point.flowM3s),
      head: exact(headFromSI(point.headM, units.head)),
      power: point.powerW === null ? null : exact(powerFromSI(point.powerW, units.power!)),
      efficiency:
        point.efficiency === null ? null : exact(units.efficiency === '%' ? point.efficiency * 100 : point.efficiency),
      npsh_required: point.npshRequiredM === null ? null : exact(headFromSI(point.npshRequiredM, units.npsh!)),
    }));
  });

  const draft: CurveTableDraft = {
    comments,
    units: {
      'flow-unit': units.flow,
      'head-unit': units.head,
      ...(has.power ? { 'power-unit': units.power } : {}),
      ...(has.efficiency ? { 'efficiency-unit': units.efficiency } : {}),
      ...(has.npsh ? { 'npsh-unit': units.npsh } : {}),
      ...(has.size ? { 'size-unit': units.size } : {}),
      ...(has.price ? { currency } : {}),
      'power-basis': units.powerBasis,
    },
    columns,
    rows,
  };
  return {
    text: formatCurveTable(draft),
    pumpCount: pumps.length,
    units: { ...units, ...(has.price ? { currency } : {}) },
  };
}
