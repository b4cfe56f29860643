import type { CalculationUnits, OperatingPointRequest, OperatingPointSummary } from '../../shared/api/api-schemas';
import {
  branchFlowsAt,
  type CompiledBranchedSystem,
  type CompiledSystemCurve,
  type NoOperatingPointReason,
} from '../../shared/hydraulics';
import { ProblemError } from '../api/problem-details';
import type { DutyPoint } from './arrangement-duty';
import { branchFlowSummaries } from './branch-answers';
import { answerUnits, round } from './request-units';
import { gravityFlowMessage } from './suction-answer';
import { velocityWarnings } from './system-request';

/** A duty point as the answer shows it, in the request's units; on a branched system, with each branch's flow. */
export function operatingPointSummary(
  point: DutyPoint,
  units: CalculationUnits,
  branched: CompiledBranchedSystem | null = null,
): OperatingPointSummary {
  const to = answerUnits(units);
  return {
    flow: to.flow(point.flow),
    head: to.head(point.head),
    flowPerPump: to.flow(point.flowPerPump),
    percentOfBep: point.percentOfBep,
    region: point.region,
    efficiency: point.efficiency === null ? null : point.efficiency * 100,
    inputPower: point.inputPower === null ? null : to.power(point.inputPower),
    ...(point.headPerPump === undefined ? {} : { headPerPump: to.head(point.headPerPump) }),
    ...(branched === null ? {} : { branches: branchFlowSummaries(branchFlowsAt(branched, point.flow), units) }),
  };
}

export const noPointTitles: Record<NoOperatingPointReason, string> = {
  'below-static-head':
    'the pump cannot lift the water this high: its shut-off head is below the static head plus outlet pressure head',
  'before-curve':
    'the curves would cross left of the first published point of the pump curve, where the maker gives no data',
  'beyond-curve':
    'the curves would cross right of the last published point (run-out): the system needs less head than the pump gives even there',
};

/** The messages of one pump model's duty, in the request's units; `which` names the pumps ('each pump'). */
export function pumpDutyMessages(point: DutyPoint, units: CalculationUnits, which = 'each pump'): string[] {
  const to = answerUnits(units);
  const messages: string[] = [];
  if (point.warnings.includes('run-out')) {
    messages.push(
      `run-out: ${which} runs at ${round(to.flow(point.flowPerPump))} ${units.flow}, at the end of its published curve`,
    );
  }
  if (point.warnings.includes('dead-head')) {
    const subject = which === 'each pump' ? 'the pump runs' : `${which} runs`;
    messages.push(`near dead-head: ${subject} close to its shut-off head and passes little water; it may overheat`);
  }
  if (point.region === 'outside') {
    const subject = which === 'each pump' ? '' : ` (${which})`;
    messages.push(`outside the preferred operating region${subject}: expect shorter bearing and seal life`);
  }
  return messages;
}

/** The duty-point messages a designer reads, in the request's units. */
export function dutyWarningMessages(point: DutyPoint, system: CompiledSystemCurve, units: CalculationUnits): string[] {
  return [...velocityWarnings(system, point.flow, units), ...pumpDutyMessages(point, units)];
}

/** The 422 for a set that meets the system nowhere, with gravity's own flow when the outlet is below. */
export function noOperatingPoint(
  reason: keyof typeof noPointTitles,
  gravityFlow: number | null,
  body: OperatingPointRequest,
  pointer: string,
): ProblemError {
  const detail =
    gravityFlow === null
      ? noPointTitles[reason]
      : `${noPointTitles[reason]}; ${gravityFlowMessage(gravityFlow, body.units)}`;
  return new ProblemError(422, 'No operating point', detail, [{ pointer, detail }], 'no-operating-point', {
    reason,
    ...(gravityFlow === null ? {} : { gravityFlow: answerUnits(body.units).flow(gravityFlow) }),
  });
}
