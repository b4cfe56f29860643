import type {
  CalculationUnits,
  MixedSetEntry,
  MixedSetOperatingPoint,
  MixedSetPumpPoint,
  OperatingPointRequest,
  OperatingPointResponse,
} from '../../shared/api/api-schemas';
import {
  branchFlowsAt,
  npshAtDuty,
  preferredFlowRegion,
  type CompiledBranchedSystem,
  type NpshGuidance,
  type SuctionSide,
} from '../../shared/hydraulics';
import { branchFlowSummaries } from './branch-answers';
import { unprocessable, withRequestPointers } from './engine-problem';
import { dutyOfMixedSet, worstSingleFailure, type MixedSetMember, type MixedSetPoint } from './mixed-set-duty';
import { noOperatingPoint, noPointTitles, pumpDutyMessages } from './operating-point-summary';
import { preferredBandOf, requestPump, summarizeFit, type CurrentPumpCurves } from './pump-request';
import { answerUnits, echoedUnits, requestValueText } from './request-units';
import { gravityFlowMessage, npshCheckAnswer, npshGuidanceOf, npshMessage, suctionLiftCaution } from './suction-answer';
import { prepareSystem, velocityWarnings } from './system-request';

/*
 * The operating point of a mixed set (`pumps`): different models in parallel, all running
 * (mixed-set-duty.ts), each entry's figures per single pump of that model.
 */

/** Most pumps a mixed set runs, over all its entries: Riffle's own limit (a water feature's pump station). */
export const MIXED_SET_MOST_PUMPS = 4;

interface MemberContext {
  units: CalculationUnits;
  suction: SuctionSide | null;
  guidance: NpshGuidance;
  totalFlow: number;
}

function memberSummary(
  entry: number,
  point: MixedSetPoint['members'][number]['point'],
  context: MemberContext,
  fit: MixedSetMember['pump']['fit'],
): MixedSetPumpPoint {
  const to = answerUnits(context.units);
  const npsh = context.suction
    ? npshAtDuty(context.suction, fit, context.totalFlow, point.flowPerPump, context.guidance)
    : null;
  return {
    entry,
    running: point.running,
    flow: to.flow(point.flowPerPump),
    head: to.head(point.head),
    percentOfBep: point.percentOfBep,
    region: point.region,
    efficiency: point.efficiency === null ? null : point.efficiency * 100,
    inputPower: point.inputPower === null ? null : to.power(point.inputPower / point.running),
    ...(npsh ? { npsh: npshCheckAnswer(npsh, context.guidance, context.units) } : {}),
  };
}

function mixedSetSummary(
  point: MixedSetPoint,
  members: readonly MixedSetMember[],
  context: Omit<MemberContext, 'totalFlow'>,
  branched: CompiledBranchedSystem | null,
): MixedSetOperatingPoint {
  const to = answerUnits(context.units);
  const fitOf = (entry: number) => members.find((member) => member.entry === entry)!.pump.fit;
  return {
    flow: to.flow(point.flow),
    head: to.head(point.head),
    inputPower: point.inputPower === null ? null : to.power(point.inputPower),
    pumps: point.members.map(({ entry, point: member }) =>
      memberSummary(entry, member, { ...context, totalFlow: point.flow }, fitOf(entry)),
    ),
    ...(branched === null ? {} : { branches: branchFlowSummaries(branchFlowsAt(branched, point.flow), context.units) }),
  };
}

/** What a designer reads of each entry: run-out, dead-head, outside the region, delivering nothing, NPSH. */
function memberMessages(
  point: MixedSetPoint,
  members: readonly MixedSetMember[],
  context: Omit<MemberContext, 'totalFlow'>,
): string[] {
  const text = requestValueText(context.units);
  return point.members.flatMap(({ entry, point: member }) => {
    const fit = members.find((candidate) => candidate.entry === entry)!.pump.fit;
    const name = `pumps[${entry}]`;
    const messages: string[] = [];
    if (member.flowPerPump === 0) {
      messages.push(
        `${name} delivers nothing: its shut-off head ${text.head(fit.shutOffHead)} is not above the common head ${text.head(point.head)}, so its check valve stays shut`,
      );
    } else messages.push(...pumpDutyMessages(member, context.units, `each pump of ${name}`));
    if (context.suction) {
      const npsh = npshAtDuty(context.suction, fit, point.flow, member.flowPerPump, context.guidance);
      const npshText = npshMessage(npsh, context.guidance, context.units);
      if (npshText) messages.push(`${name}: ${npshText}`);
    }
    return messages;
  });
}

/** The answer for `pumps`; refusals are 4xx problems naming the field. */
export async function mixedSetAnswer(
  pumps: CurrentPumpCurves,
  body: OperatingPointRequest,
  entries: readonly MixedSetEntry[],
): Promise<OperatingPointResponse> {
  if (body.arrangement !== undefined)
    throw unprocessable(
      '/body/arrangement',
      'a mixed set gives its running pumps per entry of pumps; arrangement is for one model',
    );
  if (body.balance !== undefined)
    throw unprocessable(
      '/body/balance',
      'balancing is worked out for one model (alone, in parallel or in series), not for a mixed set',
    );
  const total = entries.reduce((sum, entry) => sum + entry.running, 0);
  if (total > MIXED_SET_MOST_PUMPS)
    throw unprocessable('/body/pumps', `a mixed set runs at most ${MIXED_SET_MOST_PUMPS} pumps in all, got ${total}`);
  const { curve, branched, density, suction, gravityFlow } = prepareSystem(body.units, body.system);
  const band = preferredBandOf(body.preferredBand);
  const guidance = npshGuidanceOf(body.npshMarginRatio);
  const members: MixedSetMember[] = [];
  for (const [entry, { pump: spec, running }] of entries.entries()) {
    const { pump, motorEfficiency } = await requestPump(pumps, body.units, spec, `/body/pumps/${entry}/pump`);
    members.push({ entry, pump, running, motorEfficiency });
  }
  const toRequest = (field: string) => field.replace(/^\/pumps\/(\d+)/, '/body/pumps/$1/pump');
  const duty = withRequestPointers(
    () => dutyOfMixedSet(members, curve, band, density),
    toRequest,
    requestValueText(body.units),
  );
  if (!duty.ok) throw noOperatingPoint(duty.reason, gravityFlow, body, '/body/pumps');
  const failed = withRequestPointers(() => worstSingleFailure(members, curve, band, density), toRequest);
  const context = { units: body.units, suction, guidance };
  const warnings = [
    ...velocityWarnings(curve, duty.point.flow, body.units),
    ...memberMessages(duty.point, members, context),
  ];
  if (!failed.ok)
    warnings.push(`with one pump of pumps[${failed.stoppedEntry}] failed: ${noPointTitles[failed.reason]}`);
  const caution = suctionLiftCaution(suction, body.units);
  if (caution) warnings.push(caution);
  if (gravityFlow !== null) warnings.push(gravityFlowMessage(gravityFlow, body.units));
  const fits = members.map(({ pump }) =>
    summarizeFit(pump.fit, body.units, preferredFlowRegion(pump.fit, band, pump.declaredPreferred)),
  );
  return {
    units: echoedUnits(body.units),
    layout: 'parallel',
    operatingPoint: mixedSetSummary(duty.point, members, context, branched),
    oneFailed: failed.ok ? mixedSetSummary(failed.point, members, context, branched) : null,
    fit: fits[0],
    fits,
    ...(gravityFlow === null ? {} : { gravityFlow: answerUnits(body.units).flow(gravityFlow) }),
    warnings,
  };
}
