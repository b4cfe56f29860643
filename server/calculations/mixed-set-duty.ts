import {
  parallelHeadCurve,
  solveParallelUnequal,
  type CompiledSystemCurve,
  type EngineIssue,
  type NoOperatingPointReason,
  type PreferredBand,
} from '../../shared/hydraulics';
import { dutyPoint, type DutyPoint, type PumpOnFile } from './arrangement-duty';

/*
 * A mixed set: different pump models in parallel on one system, each with a check valve, at the
 * common head where their flows add up to what the system takes (solveParallelUnequal; Karassik,
 * Pump Handbook, 4th ed., ch. 10). SI throughout.
 */

export interface MixedSetMember {
  /** Index of the entry in the request's `pumps`. */
  entry: number;
  pump: PumpOnFile;
  /** Pumps of this model running, >= 1. */
  running: number;
  /** 0-1, the motor efficiency its curve power is divided by. */
  motorEfficiency: number;
}

export interface MixedSetPoint {
  /** Total flow, m3/s. */
  flow: number;
  /** The common head, m. */
  head: number;
  /** Electrical input of every running pump, W; null when one model lacks power or efficiency data. */
  inputPower: number | null;
  /** Each member's duty: flow its total, flowPerPump and head per pump, inputPower of its running pumps. */
  members: Array<{ entry: number; point: DutyPoint }>;
}

export type MixedSetOutcome =
  { ok: true; point: MixedSetPoint } | { ok: false; reason: NoOperatingPointReason; issue: EngineIssue };

/**
 * The duty of a mixed set on `system`. A member whose shut-off head is below the common head
 * delivers nothing (its check valve stays shut) and runs at its shut-off head. Engine refusals
 * point at `/pumps/<index into members>`.
 */
export function dutyOfMixedSet(
  members: readonly MixedSetMember[],
  system: CompiledSystemCurve,
  band: PreferredBand,
  density: number,
): MixedSetOutcome {
  const solved = solveParallelUnequal(
    members.map((member) => parallelHeadCurve(member.pump.fit, member.running)),
    system,
  );
  if (!solved.ok) return solved;
  const points = members.map((member, index) => {
    const flow = solved.pumpFlows[index];
    const flowPerPump = flow / member.running;
    const head = flowPerPump > 0 ? solved.head : member.pump.fit.shutOffHead;
    const point = dutyPoint(
      member.pump,
      member.running,
      flow,
      flowPerPump,
      head,
      band,
      density,
      member.motorEfficiency,
    );
    return { entry: member.entry, point };
  });
  const powers = points.map(({ point }) => point.inputPower);
  return {
    ok: true,
    point: {
      flow: solved.totalFlow,
      head: solved.head,
      inputPower: powers.some((power) => power === null)
        ? null
        : powers.reduce<number>((sum, power) => sum + (power ?? 0), 0),
      members: points,
    },
  };
}

/** The members with one pump of member `index` stopped (the member left out when it was its only one). */
export function withOnePumpStopped(members: readonly MixedSetMember[], index: number): MixedSetMember[] {
  return members.flatMap((member, at) => {
    if (at !== index) return [member];
    return member.running > 1 ? [{ ...member, running: member.running - 1 }] : [];
  });
}

export type MixedSetFailure =
  | { ok: true; point: MixedSetPoint; stoppedEntry: number }
  | { ok: false; reason: NoOperatingPointReason; stoppedEntry: number };

/**
 * The worst single failure of a mixed set: of the sets with one pump stopped (one per member), the
 * one with no operating point, else the one with the least total flow.
 */
export function worstSingleFailure(
  members: readonly MixedSetMember[],
  system: CompiledSystemCurve,
  band: PreferredBand,
  density: number,
): MixedSetFailure {
  let worst: MixedSetFailure | null = null;
  for (const [index, member] of members.entries()) {
    const outcome = dutyOfMixedSet(withOnePumpStopped(members, index), system, band, density);
    if (!outcome.ok) return { ok: false, reason: outcome.reason, stoppedEntry: member.entry };
    if (worst === null || (worst.ok && outcome.point.flow < worst.point.flow))
      worst = { ok: true, point: outcome.point, stoppedEntry: member.entry };
  }
  if (worst === null) throw new Error('a mixed set has at least two members');
  return worst;
}
