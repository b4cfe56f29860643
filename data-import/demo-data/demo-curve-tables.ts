import {
  convertDiameter,
  flowFromSI,
  headFromSI,
  STANDARD_GRAVITY,
  waterDensity,
  type FlowUnit,
  type HeadUnit,
} from '../../shared/hydraulics';
import type { PumpKind } from '../../shared/vocabularies';
import type { CurveTableColumn } from '../curve-table-format';
import { formatCurveTable, type CurveTableDraft } from '../curve-table-writer';
import { seededRandom } from './seeded-random';

/*
 * The demo catalog: invented pumps of invented suppliers, generated from parametric curve shapes
 * so that the files are the same on every run. No real supplier, model or published curve is meant.
 *
 * Shapes (our own, chosen to look like rotodynamic pumps, not taken from any maker's data), with
 * x = Q / Q_runout:
 *   head        H(x) = H0 (1 + s x - (1 + s - e) x^2), s <= 0 so that head never rises, e = H(1)/H0;
 *   efficiency  eta(x) = eta_max (1 - ((x - x_b) / x_b)^2), zero at shut-off, peak at x_b;
 *   power       P = rho g Q H / eta (hydraulic power over efficiency, rho of water at 20 C);
 *   NPSH3       N(x) = N0 + N1 x^2;
 *   full-load current  I = 1.15 P_max / (eta_m pf V k), the motor rated 15 % over the curve's largest
 *               shaft power, eta_m = 0.8 and pf = 0.85 (invented round figures), k = 1 for single
 *               phase and sqrt(3) for three phase.
 */

/**
 * Invented drives, by model code: pumps sold with a speed controller (a continuous range, rpm) or
 * a two-speed motor (fixed speeds, rpm), so that the demo shows variable- and multi-speed pumps.
 */
const demoSpeeds: Readonly<Record<string, { range?: [number, number]; fixed?: number[] }>> = {
  'AB-SUB-30': { range: [1400, 2850] },
  'AB-CEN-20': { range: [1450, 3190] },
  'QW-CEN-50': { fixed: [1450, 2900] },
};

/** The invented motors' efficiency and power factor at full load. */
const MOTOR_EFFICIENCY = 0.8;
const POWER_FACTOR = 0.85;

interface KindShape {
  kind: PumpKind;
  label: string;
  /** Shut-off head of the smallest and largest size, m. */
  shutOff: [number, number];
  /** Run-out flow of the smallest and largest size, m3/h. */
  runOut: [number, number];
  /** Peak efficiency of the smallest and largest size. */
  peakEfficiency: [number, number];
  slope: number;
  endRatio: number;
  speedRpm: number;
  npsh: [number, number] | null;
  /** Discharge of the smallest and largest size, mm. */
  discharge: [number, number];
  solids: [number, number];
  phases: 1 | 3;
  voltage: number;
  basePrice: [number, number];
}

const kindShapes: Record<PumpKind, KindShape> = {
  submersible: {
    kind: 'submersible',
    label: 'pond submersible',
    shutOff: [1.6, 12],
    runOut: [1.8, 44],
    peakEfficiency: [0.22, 0.52],
    slope: -0.05,
    endRatio: 0.3,
    speedRpm: 2850,
    npsh: null,
    discharge: [19, 50],
    solids: [4, 20],
    phases: 1,
    voltage: 230,
    basePrice: [90, 900],
  },
  'external-centrifugal': {
    kind: 'external-centrifugal',
    label: 'end-suction centrifugal',
    shutOff: [11, 34],
    runOut: [7, 60],
    peakEfficiency: [0.48, 0.74],
    slope: -0.05,
    endRatio: 0.3,
    speedRpm: 2900,
    npsh: [1.2, 3.4],
    discharge: [32, 80],
    solids: [6, 12],
    phases: 1,
    voltage: 230,
    basePrice: [480, 2600],
  },
  'mixed-flow': {
    kind: 'mixed-flow',
    label: 'mixed-flow',
    shutOff: [3.2, 9.5],
    runOut: [70, 420],
    peakEfficiency: [0.62, 0.8],
    slope: -0.4,
    endRatio: 0.1,
    speedRpm: 1450,
    npsh: [2.2, 4.5],
    discharge: [100, 200],
    solids: [25, 60],
    phases: 3,
    voltage: 400,
    basePrice: [2400, 9800],
  },
};

interface SupplierPlan {
  code: 'ALDERBROOK' | 'QUILLWATER' | 'STONETARN';
  prefix: string;
  delimiter: ',' | ';';
  flowUnit: FlowUnit;
  headUnit: HeadUnit;
  curveData: 'power-W' | 'power-kW' | 'efficiency';
  powerBasis: 'shaft' | 'electrical';
  sizeUnit: 'mm' | 'in';
  currency: string | null;
  sizes: Record<PumpKind, number>;
  seed: number;
}

const supplierPlans: SupplierPlan[] = [
  {
    code: 'ALDERBROOK',
    prefix: 'AB',
    delimiter: ',',
    flowUnit: 'gph',
    headUnit: 'ft',
    curveData: 'power-W',
    powerBasis: 'electrical',
    sizeUnit: 'in',
    currency: 'USD',
    sizes: { submersible: 10, 'external-centrifugal': 6, 'mixed-flow': 5 },
    seed: 11,
  },
  {
    code: 'QUILLWATER',
    prefix: 'QW',
    delimiter: ';',
    flowUnit: 'm3/h',
    headUnit: 'm',
    curveData: 'power-kW',
    powerBasis: 'shaft',
    sizeUnit: 'mm',
    currency: 'EUR',
    sizes: { submersible: 8, 'external-centrifugal': 8, 'mixed-flow': 6 },
    seed: 23,
  },
  {
    code: 'STONETARN',
    prefix: 'ST',
    delimiter: ',',
    flowUnit: 'L/min',
    headUnit: 'm',
    curveData: 'efficiency',
    powerBasis: 'electrical',
    sizeUnit: 'mm',
    currency: null,
    sizes: { submersible: 9, 'external-centrifugal': 7, 'mixed-flow': 5 },
    seed: 37,
  },
];

/** Geometric steps between the smallest and the largest size, as pump ranges are usually spaced. */
function between([low, high]: [number, number], share: number): number {
  return low * Math.pow(high / low, share);
}

function round(value: number, digits: number): number {
  return Number(value.toFixed(digits));
}

const density = waterDensity(20);
const inchesPerMm = convertDiameter(1, 'mm', 'in');

/** The rows of one invented pump, in the supplier's file units. */
function pumpRows(
  plan: SupplierPlan,
  shape: KindShape,
  size: number,
  sizes: number,
  random: () => number,
): Array<Partial<Record<CurveTableColumn, string | number | null>>> {
  const share = sizes === 1 ? 0 : size / (sizes - 1);
  const shutOff = between(shape.shutOff, share);
  const runOutM3s = between(shape.runOut, share) / 3600;
  const peak = between(shape.peakEfficiency, share);
  const bepShare = 0.55 + 0.1 * random();
  const pointCount = 7 + Math.floor(random() * 6);
  const withCurveData = random() > 0.15;
  const declaresRanges = random() < 0.45;
  const startsAtShutOff = random() > 0.1;
  const sizeNumber = (size + 1) * 10;
  const code = `${plan.prefix}-${shape.kind === 'submersible' ? 'SUB' : shape.kind === 'mixed-flow' ? 'MXF' : 'CEN'}-${sizeNumber}`;
  const sizeIn = (mm: number) => (plan.sizeUnit === 'in' ? round(mm * inchesPerMm, 2) : round(mm, 0));
  const basePrice = between(shape.basePrice, share);
  const shareOf = (index: number) =>
    startsAtShutOff ? index / (pointCount - 1) : 0.08 + (0.92 * index) / (pointCount - 1);
  const headAt = (x: number) => shutOff * (1 + shape.slope * x - (1 + shape.slope - shape.endRatio) * x * x);
  const efficiencyAt = (x: number) => peak * (1 - ((x - bepShare) / bepShare) ** 2);
  // At shut-off the efficiency is zero; the power drawn there is taken as half of that near the BEP.
  const powerNearBep = (density * STANDARD_GRAVITY * bepShare * runOutM3s * 0.8 * shutOff) / peak;
  const shaftPower = (x: number, head: number) =>
    x === 0 ? 0.5 * powerNearBep : (density * STANDARD_GRAVITY * x * runOutM3s * head) / efficiencyAt(x);
  const largestPower = Math.max(
    ...Array.from({ length: pointCount }, (_, index) => shaftPower(shareOf(index), headAt(shareOf(index)))),
  );
  const fullLoadCurrent =
    (1.15 * largestPower) / (MOTOR_EFFICIENCY * POWER_FACTOR * shape.voltage * (shape.phases === 3 ? Math.sqrt(3) : 1));

  return Array.from({ length: pointCount }, (_, index) => {
    const x = shareOf(index);
    const flow = x * runOutM3s;
    const head = headAt(x) * (1 + 0.006 * (random() - 0.5));
    const efficiency = efficiencyAt(x);
    const power = shaftPower(x, head);
    const first = index === 0;
    const npsh = shape.npsh && x > 0 ? shape.npsh[0] + (shape.npsh[1] - shape.npsh[0]) * x * x : null;
    const bepFlow = bepShare * runOutM3s;
    return {
      model_code: code,
      display_name: first ? `${plan.code[0]}${plan.code.slice(1).toLowerCase()} ${shape.label} ${sizeNumber}` : null,
      kind: first ? shape.kind : null,
      speed_rpm: first ? shape.speedRpm : null,
      speed_min_rpm: first ? (demoSpeeds[code]?.range?.[0] ?? null) : null,
      speed_max_rpm: first ? (demoSpeeds[code]?.range?.[1] ?? null) : null,
      speeds_rpm: first ? (demoSpeeds[code]?.fixed?.join(';') ?? null) : null,
      voltage: first ? shape.voltage : null,
      phases: first ? shape.phases : null,
      full_load_current: first ? round(fullLoadCurrent, fullLoadCurrent < 1 ? 2 : 1) : null,
      discharge_size: first ? sizeIn(between(shape.discharge, share)) : null,
      solids_size: first ? sizeIn(between(shape.solids, share)) : null,
      list_price: first && plan.currency ? round(basePrice * (0.95 + 0.1 * random()), 0) : null,
      status: first ? (size === sizes - 1 && shape.kind === 'submersible' ? 'retired' : 'active') : null,
      preferred_flow_min:
        first && declaresRanges && withCurveData ? round(flowFromSI(0.75 * bepFlow, plan.flowUnit), 3) : null,
      preferred_flow_max:
        first && declaresRanges && withCurveData ? round(flowFromSI(1.15 * bepFlow, plan.flowUnit), 3) : null,
      allowable_flow_min:
        first && declaresRanges && withCurveData ? round(flowFromSI(0.4 * bepFlow, plan.flowUnit), 3) : null,
      allowable_flow_max:
        first && declaresRanges && withCurveData
          ? round(flowFromSI(Math.min(1.3 * bepFlow, runOutM3s), plan.flowUnit), 3)
          : null,
      notes: first ? 'Invented demo pump; not a real product.' : null,
      flow: round(flowFromSI(flow, plan.flowUnit), 3),
      head: round(headFromSI(head, plan.headUnit), 3),
      power:
        withCurveData && plan.curveData !== 'efficiency'
          ? round(plan.curveData === 'power-kW' ? power / 1000 : power, plan.curveData === 'power-kW' ? 4 : 1)
          : null,
      efficiency: withCurveData && plan.curveData === 'efficiency' ? round(100 * Math.max(efficiency, 0), 2) : null,
      npsh_required: npsh === null ? null : round(headFromSI(npsh, plan.headUnit), 2),
    };
  });
}

export interface DemoCurveFile {
  supplierCode: SupplierPlan['code'];
  fileName: string;
}

export interface DemoCurveTable extends DemoCurveFile {
  text: string;
}

/** Where each supplier's demo file is kept, beside this module. */
export const demoCurveFiles: readonly DemoCurveFile[] = supplierPlans.map((plan) => ({
  supplierCode: plan.code,
  fileName: `${plan.code.toLowerCase()}-demo-curves.csv`,
}));

/** The three demo files, the same on every call. */
export function demoCurveTables(): DemoCurveTable[] {
  return supplierPlans.map((plan, index) => {
    const random = seededRandom(plan.seed);
    const rows = (Object.keys(plan.sizes) as PumpKind[]).flatMap((kind) =>
      Array.from({ length: plan.sizes[kind] }, (_, size) =>
        pumpRows(plan, kindShapes[kind], size, plan.sizes[kind], random),
      ).flat(),
    );
    const speedsOf = (kind: 'range' | 'fixed') =>
      Object.entries(demoSpeeds).some(([code, speeds]) => code.startsWith(`${plan.prefix}-`) && speeds[kind]);
    const curveColumn: CurveTableColumn = plan.curveData === 'efficiency' ? 'efficiency' : 'power';
    const draft: CurveTableDraft = {
      delimiter: plan.delimiter,
      comments: [
        `Riffle demo curve table for ${plan.code}, generated by data-import/demo-data/generate-demo-curves.ts.`,
        'INVENTED DATA: the supplier, the pumps and their curves are made up for the demo; no real product is meant.',
      ],
      units: {
        'flow-unit': plan.flowUnit,
        'head-unit': plan.headUnit,
        ...(plan.curveData === 'efficiency'
          ? { 'efficiency-unit': '%' }
          : { 'power-unit': plan.curveData === 'power-kW' ? 'kW' : 'W' }),
        'npsh-unit': plan.headUnit,
        'size-unit': plan.sizeUnit,
        'power-basis': plan.powerBasis,
        ...(plan.currency ? { currency: plan.currency } : {}),
      },
      columns: [
        'model_code',
        'display_name',
        'kind',
        'speed_rpm',
        ...(speedsOf('range') ? (['speed_min_rpm', 'speed_max_rpm'] as const) : []),
        ...(speedsOf('fixed') ? (['speeds_rpm'] as const) : []),
        'voltage',
        'phases',
        'full_load_current',
        'discharge_size',
        'solids_size',
        ...(plan.currency ? (['list_price'] as const) : []),
        'status',
        'preferred_flow_min',
        'preferred_flow_max',
        'allowable_flow_min',
        'allowable_flow_max',
        'notes',
        'flow',
        'head',
        curveColumn,
        'npsh_required',
      ],
      rows,
    };
    return { ...demoCurveFiles[index], text: formatCurveTable(draft) };
  });
}
