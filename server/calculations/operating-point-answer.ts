import type { OperatingPointRequest, OperatingPointResponse } from '../../shared/api/api-schemas';
import { npshAtDuty, parallelHeadCurve, preferredFlowRegion, seriesHeadCurve } from '../../shared/hydraulics';
import { engineInputErrorText } from '../../shared/messages/engine-issue-text';
import { dutyOfParallelPumps, dutyOfSeriesPumps, type DutyOutcome } from './arrangement-duty';
import { balancingAnswer } from './branch-answers';
import { pointerInto, unprocessable, withRequestPointers } from './engine-problem';
import { mixedSetAnswer } from './mixed-set-answer';
import { lowSpeedWarning, pumpOnFileAtSpeed, speedAnswer, speedAsked } from './pump-at-speed';
import { dutyWarningMessages, noOperatingPoint, noPointTitles, operatingPointSummary } from './operating-point-summary';
import { preferredBandOf, requestPump, summarizeFit, type CurrentPumpCurves } from './pump-request';
import { answerUnits, echoedUnits } from './request-units';
import { gravityFlowMessage, npshCheckAnswer, npshGuidanceOf, npshMessage, suctionLiftCaution } from './suction-answer';
import { prepareSystem } from './system-request';

/*
 * POST /calculations/operating-point: one pump model, alone, as identical pumps in parallel or in
 * series (`arrangement`), or a mixed set of models in parallel (`pumps`, mixed-set-answer.ts).
 */

/** Exactly one of `pump` and `pumps`; a 422 naming the field otherwise. */
function requireOnePumpField(body: OperatingPointRequest): void {
  if (body.pump !== undefined && body.pumps !== undefined)
    throw unprocessable('/body/pumps', 'give either pump (one model) or pumps (a mixed set), not both');
  if (body.pump === undefined && body.pumps === undefined)
    throw unprocessable('/body/pump', 'give pump (one model) or pumps (a mixed set)');
}

/** Series needs two pumps or more and has no standby; a 422 naming the field otherwise. */
function requireSeriesArrangement(installed: number, running: number): void {
  if (running < 2)
    throw unprocessable(
      '/body/arrangement/running',
      'pumps in series need 2 or more running (one pump is not a series)',
    );
  if (installed !== running)
    throw unprocessable(
      '/body/arrangement/installed',
      `pumps in series have no standby: installed (${installed}) must equal running (${running})`,
    );
}

export async function operatingPointAnswer(
  pumps: CurrentPumpCurves,
  body: OperatingPointRequest,
): Promise<OperatingPointResponse> {
  requireOnePumpField(body);
  if (body.pumps !== undefined) {
    if (body.speed !== undefined) throw unprocessable('/body/speed', 'is for one model (pump), not a mixed set');
    return mixedSetAnswer(pumps, body, body.pumps);
  }
  const { curve, branched, density, suction, gravityFlow } = prepareSystem(body.units, body.system);
  const band = preferredBandOf(body.preferredBand);
  const guidance = npshGuidanceOf(body.npshMarginRatio);
  const requested = await requestPump(pumps, body.units, body.pump!);
  const { motorEfficiency } = requested;
  const asked = body.speed === undefined ? null : speedAsked(body.speed, requested.speeds, requested.fromCatalog);
  const pump = asked ? pumpOnFileAtSpeed(requested.pump, asked.ratio) : requested.pump;
  const layout = body.arrangement?.layout ?? 'parallel';
  const installed = body.arrangement?.installed ?? 1;
  const running = body.arrangement?.running ?? installed;
  if (layout === 'series') requireSeriesArrangement(installed, running);
  else if (running > installed)
    throw unprocessable(
      '/body/arrangement/running',
      engineInputErrorText({ code: 'running-exceeds-installed', params: { running, installed }, pointer: '/running' }),
    );
  const dutyOf = (count: number): DutyOutcome =>
    layout === 'series'
      ? dutyOfSeriesPumps(pump, curve, count, band, density, motorEfficiency)
      : dutyOfParallelPumps(pump, curve, count, band, density, motorEfficiency);
  const duty = withRequestPointers(() => dutyOf(running), pointerInto('/body/arrangement'));
  if (!duty.ok) throw noOperatingPoint(duty.reason, gravityFlow, body, '/body/pump');
  // one failed: in parallel the rest share the flow; in series the rest stay in series, the stopped one bypassed
  const oneFailed = running === installed && installed >= 2 ? dutyOf(running - 1) : null;
  const warnings = dutyWarningMessages(duty.point, curve, body.units);
  const lowSpeed = asked ? lowSpeedWarning(asked.ratio, body.units) : null;
  if (lowSpeed) warnings.push(lowSpeed);
  if (oneFailed && !oneFailed.ok) warnings.push(`with one pump failed: ${noPointTitles[oneFailed.reason]}`);
  // in series the first pump takes the suction: the full flow
  const npsh = suction ? npshAtDuty(suction, pump.fit, duty.point.flow, duty.point.flowPerPump, guidance) : null;
  const npshText = npsh ? npshMessage(npsh, guidance, body.units) : null;
  if (npshText) warnings.push(npshText);
  const caution = suctionLiftCaution(suction, body.units);
  if (caution) warnings.push(caution);
  if (gravityFlow !== null) warnings.push(gravityFlowMessage(gravityFlow, body.units));
  const combined = layout === 'series' ? seriesHeadCurve(pump.fit, running) : parallelHeadCurve(pump.fit, running);
  return {
    units: echoedUnits(body.units),
    layout,
    operatingPoint: operatingPointSummary(duty.point, body.units, branched),
    oneFailed: oneFailed?.ok ? operatingPointSummary(oneFailed.point, body.units, branched) : null,
    fit: summarizeFit(pump.fit, body.units, preferredFlowRegion(pump.fit, band, pump.declaredPreferred)),
    ...(body.balance === undefined ? {} : { balancing: balancingAnswer(branched, combined, body.balance, body.units) }),
    ...(npsh ? { npsh: npshCheckAnswer(npsh, guidance, body.units) } : {}),
    ...(gravityFlow === null ? {} : { gravityFlow: answerUnits(body.units).flow(gravityFlow) }),
    ...(asked ? { speed: speedAnswer(asked, pump, body.units) } : {}),
    warnings,
  };
}
