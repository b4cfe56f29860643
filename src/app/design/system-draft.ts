import type { CalculationUnits, DesignBranch, DesignSystem, PipeSystem } from '../../../shared/api/api-schemas';
import { designPipeSystem, designStaticHead } from '../../../shared/api/design-system';
import { branchedSystemInputOf, systemInputOf } from '../../../shared/api/system-input';
import {
  branchFlowsAt,
  compileBranchedSystem,
  compileSystemCurve,
  flowFromSI,
  flowToSI,
  lengthFromSI,
  convertDiameter,
  convertFlow,
  convertHead,
  convertLength,
  type CompiledSystemCurve,
} from '../../../shared/hydraulics';

/** The system as the designer's form holds it, in the draft's unit system (the contract's DesignSystem). */
export type SystemDraft = DesignSystem;
export type SegmentDraft = DesignSystem['segments'][number];
export type BranchDraft = DesignBranch;

/** Static head from the draft: entered directly, or the rise from the intake to the discharge level. */
export const staticHeadOf: (draft: SystemDraft) => number = designStaticHead;

/** The draft as the API's `system`. Fittings with a zero count are left out. */
export const toPipeSystem: (draft: SystemDraft) => PipeSystem = designPipeSystem;

/**
 * The same system compiled by the shared engine in the browser, for the live preview; the
 * server stays the authority for every figure it answers.
 */
export function compileDraft(system: PipeSystem, units: CalculationUnits): CompiledSystemCurve {
  const branched = branchedSystemInputOf(system, units);
  return branched === null ? compileSystemCurve(systemInputOf(system, units)) : compileBranchedSystem(branched);
}

/** One branch's share at a total flow, in the draft's units (velocity: its fastest segment). */
export interface BranchShare {
  name: string;
  flow: number;
  velocity: number;
}

/**
 * Each branch's flow at the given total flows (draft units), by the shared engine's split
 * (branch-flows.ts); an empty list for a single route.
 * @returns one row per total flow, each with one share per branch in the system's order
 */
export function branchSharesOf(
  system: PipeSystem,
  units: CalculationUnits,
  totalFlows: readonly number[],
): BranchShare[][] {
  const input = branchedSystemInputOf(system, units);
  if (input === null) return [];
  const compiled = compileBranchedSystem(input);
  return totalFlows.map((total) =>
    branchFlowsAt(compiled, flowToSI(total, units.flow)).branches.map((branch) => ({
      name: branch.name,
      flow: flowFromSI(branch.flow, units.flow),
      velocity: lengthFromSI(branch.maxVelocity, units.length),
    })),
  );
}

/** Seven significant figures: survey levels keep well under a millimetre, and switching back gives the typed numbers again. */
function roundConverted(value: number): number {
  return Number(value.toPrecision(7));
}

/** The same measured system in other units: levels, heads, lengths, custom bores, roughness and equipment converted, the rest as it was. */
export function convertSystemDraft(draft: SystemDraft, from: CalculationUnits, to: CalculationUnits): SystemDraft {
  const head = (value: number) => roundConverted(convertHead(value, from.head, to.head));
  const length = (value: number) => roundConverted(convertLength(value, from.length, to.length));
  const diameter = (value: number | null | undefined) =>
    value == null ? value : roundConverted(convertDiameter(value, from.diameter, to.diameter));
  const flow = (value: number) => roundConverted(convertFlow(value, from.flow, to.flow));
  const segment = (entry: SegmentDraft): SegmentDraft => ({
    ...entry,
    length: length(entry.length),
    insideDiameter: diameter(entry.insideDiameter),
    roughness: diameter(entry.roughness),
    equipment: entry.equipment?.map((item) => ({
      ...item,
      headLoss: head(item.headLoss),
      atFlow: flow(item.atFlow),
    })),
  });
  return {
    ...draft,
    staticHead: head(draft.staticHead),
    intakeLevel: head(draft.intakeLevel),
    dischargeLevel: head(draft.dischargeLevel),
    outletPressureHead: head(draft.outletPressureHead),
    segments: draft.segments.map(segment),
    ...(draft.siteElevation === undefined ? {} : { siteElevation: length(draft.siteElevation) }),
    ...(draft.pumpElevation === undefined ? {} : { pumpElevation: length(draft.pumpElevation) }),
    ...(draft.branches === undefined
      ? {}
      : {
          branches: draft.branches.map((branch) => ({
            ...branch,
            staticHead: head(branch.staticHead),
            outletLevel: head(branch.outletLevel),
            outletPressureHead: head(branch.outletPressureHead),
            segments: branch.segments.map(segment),
          })),
        }),
  };
}

/**
 * A new branch after the split: the draft's static head (or outlet at the discharge level) and one
 * short run of the common run's last size with an exit.
 */
export function newBranch(draft: SystemDraft, name: string): BranchDraft {
  const last = draft.segments.at(-1) ?? exampleDraft().segments[0];
  return {
    name,
    staticMode: draft.staticMode,
    staticHead: staticHeadOf(draft),
    outletLevel: draft.dischargeLevel,
    outletPressureHead: 0,
    segments: [{ series: last.series, size: last.size, length: 20, fittings: [{ kind: 'exit', count: 1 }], extraK: 0 }],
  };
}

/**
 * A first system to edit: a waterfall lifting 14.5 ft through 240 ft of 3" Schedule 40 PVC
 * with four standard elbows and the exit. Invented for the demo.
 */
export function exampleDraft(): SystemDraft {
  return {
    staticMode: 'direct',
    staticHead: 14.5,
    intakeLevel: 0,
    dischargeLevel: 14.5,
    outletPressureHead: 0,
    waterTemperatureC: 20,
    frictionMethod: 'hazen-williams',
    segments: [
      {
        series: 'pvc-sch40',
        size: 'pvc-sch40-3',
        length: 240,
        fittings: [
          { kind: 'elbow-90-standard', count: 4 },
          { kind: 'exit', count: 1 },
        ],
        extraK: 0,
      },
    ],
  };
}
