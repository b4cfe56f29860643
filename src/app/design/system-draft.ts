import type { CalculationUnits, DesignSystem, PipeSystem } from '../../../shared/api/api-schemas';
import { designPipeSystem, designStaticHead } from '../../../shared/api/design-system';
import { systemInputOf } from '../../../shared/api/system-input';
import {
  compileSystemCurve,
  convertDiameter,
  convertFlow,
  convertHead,
  convertLength,
  type CompiledSystemCurve,
} from '../../../shared/hydraulics';

/** The system as the designer's form holds it, in the draft's unit system (the contract's DesignSystem). */
export type SystemDraft = DesignSystem;
export type SegmentDraft = DesignSystem['segments'][number];

/** Static head from the draft: entered directly, or the rise from the intake to the discharge level. */
export const staticHeadOf: (draft: SystemDraft) => number = designStaticHead;

/** The draft as the API's `system`. Fittings with a zero count are left out. */
export const toPipeSystem: (draft: SystemDraft) => PipeSystem = designPipeSystem;

/**
 * The same system compiled by the shared engine in the browser, for the live preview; the
 * server stays the authority for every figure it answers.
 */
export function compileDraft(system: PipeSystem, units: CalculationUnits): CompiledSystemCurve {
  return compileSystemCurve(systemInputOf(system, units));
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
  return {
    ...draft,
    staticHead: head(draft.staticHead),
    intakeLevel: head(draft.intakeLevel),
    dischargeLevel: head(draft.dischargeLevel),
    outletPressureHead: head(draft.outletPressureHead),
    segments: draft.segments.map((segment) => ({
      ...segment,
      length: length(segment.length),
      insideDiameter: diameter(segment.insideDiameter),
      roughness: diameter(segment.roughness),
      equipment: segment.equipment?.map((entry) => ({
        ...entry,
        headLoss: head(entry.headLoss),
        atFlow: flow(entry.atFlow),
      })),
    })),
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
