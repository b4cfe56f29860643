import {
  classifyOperatingRegion,
  powerAtOperatingPoint,
  pumpEfficiencyAt,
  pumpHeadAt,
  solveParallelIdentical,
  solveSeries,
  type CompiledSystemCurve,
  type EngineIssue,
  type NoOperatingPointReason,
  type OperatingRegion,
  type PreferredBand,
  type PumpCurveFit,
} from '../../shared/hydraulics';

/*
 * Identical pumps in parallel on one system, at the duty they settle to: where the pumps run on
 * their curve (flows add at equal head; Karassik, Pump Handbook, 4th ed., ch. 10), how far from
 * BEP, and what they draw. SI throughout.
 */

/** Share of the published range at its right end taken as run-out: Riffle's own margin. */
const RUN_OUT_SHARE = 0.05;
/** Pump head at or above this share of shut-off head counts as running near dead-head: Riffle's own margin. */
const DEAD_HEAD_SHARE = 0.95;

export type DutyWarning = 'run-out' | 'dead-head';

export interface DutyPoint {
  running: number;
  /** Total flow of the running pumps, m3/s. */
  flow: number;
  /** m */
  head: number;
  flowPerPump: number;
  percentOfBep: number | null;
  region: OperatingRegion;
  /** Pump efficiency 0-1 at the point, or null without efficiency data. */
  efficiency: number | null;
  /** Electrical input of all running pumps, W, or null without power or efficiency data. */
  inputPower: number | null;
  warnings: DutyWarning[];
  /** Pumps in series only: the head each adds, m (each carries the full flow). */
  headPerPump?: number;
}

export type DutyOutcome =
  { ok: true; point: DutyPoint } | { ok: false; reason: NoOperatingPointReason; issue: EngineIssue };

export interface PumpOnFile {
  fit: PumpCurveFit;
  /** The preferred region the supplier declares, per pump, m3/s; null to use the band around BEP. */
  declaredPreferred?: { flowMin: number; flowMax: number } | null;
}

/**
 * The duty of `running` identical pumps in parallel on `system`. Region: inside the supplier's
 * declared preferred range when there is one, else the engine's band around BEP (ANSI/HI 9.6.3).
 * Warnings: 'run-out' in the last 5 % of the published range, 'dead-head' at 95 % of shut-off
 * head or more (both margins Riffle's own).
 */
export function dutyOfParallelPumps(
  pump: PumpOnFile,
  system: CompiledSystemCurve,
  running: number,
  band: PreferredBand,
  density: number,
  motorEfficiency = 1,
): DutyOutcome {
  const solved = solveParallelIdentical(pump.fit, system, running, running);
  if (!solved.ok) return solved;
  return {
    ok: true,
    point: dutyPoint(
      pump,
      running,
      solved.totalFlow,
      solved.totalFlow / running,
      solved.head,
      band,
      density,
      motorEfficiency,
    ),
  };
}

/**
 * The duty of `running` identical pumps in series on `system` (heads add at equal flow; Karassik,
 * Pump Handbook, 4th ed., ch. 10): each pump carries the full flow and adds an equal share of the
 * head; region, power and warnings as for dutyOfParallelPumps, per pump at that flow and share.
 */
export function dutyOfSeriesPumps(
  pump: PumpOnFile,
  system: CompiledSystemCurve,
  running: number,
  band: PreferredBand,
  density: number,
  motorEfficiency = 1,
): DutyOutcome {
  const solved = solveSeries(pump.fit, system, running);
  if (!solved.ok) return solved;
  const point = dutyPoint(
    pump,
    running,
    solved.totalFlow,
    solved.totalFlow,
    solved.head / running,
    band,
    density,
    motorEfficiency,
  );
  return { ok: true, point: { ...point, head: solved.head, headPerPump: solved.head / running } };
}

/**
 * One pump model's duty at a flow per pump (kept inside its published range) and a head per pump,
 * `running` of them; `flow` is the set's total.
 */
export function dutyPoint(
  pump: PumpOnFile,
  running: number,
  flow: number,
  rawFlowPerPump: number,
  head: number,
  band: PreferredBand,
  density: number,
  motorEfficiency: number,
): DutyPoint {
  const { fit } = pump;
  const flowPerPump = Math.min(Math.max(rawFlowPerPump, fit.flowMin), fit.flowMax);
  const classified = classifyOperatingRegion(fit, flowPerPump, band, pump.declaredPreferred ?? null);
  const power = powerAtOperatingPoint(fit, flowPerPump, head, density, { motor: motorEfficiency });
  const warnings: DutyWarning[] = [];
  if (flowPerPump >= fit.flowMax - RUN_OUT_SHARE * (fit.flowMax - fit.flowMin)) warnings.push('run-out');
  if (pumpHeadAt(fit, flowPerPump) >= DEAD_HEAD_SHARE * fit.shutOffHead) warnings.push('dead-head');
  return {
    running,
    flow,
    head,
    flowPerPump,
    percentOfBep: classified.percentOfBep,
    region: classified.region,
    efficiency: pumpEfficiencyAt(fit, flowPerPump),
    inputPower: power.electrical === null ? null : power.electrical * running,
    warnings,
  };
}
