import type { Request, RequestHandler } from 'express';
import type {
  CalculationUnits,
  DiameterUnit,
  FittingsQuery,
  FittingsResponse,
  OperatingPointRequest,
  OperatingPointResponse,
  OperatingPointSummary,
  PipeSizesQuery,
  PipeSizesResponse,
  SystemCurveRequest,
  SystemCurveResponse,
} from '../../shared/api/api-schemas';
import {
  craneFullyTurbulentFrictionFactor,
  diameterFromSI,
  diameterToSI,
  FITTINGS,
  flowToSI,
  npshAtDuty,
  npshAvailableAt,
  PIPE_SERIES,
  preferredFlowRegion,
  SI_PLAUSIBLE_UNITS,
  systemBreakdown,
  VELOCITY_WARNING_LIMIT,
  branchFlowsAt,
  type CompiledBranchedSystem,
  type CompiledSystemCurve,
  type NoOperatingPointReason,
} from '../../shared/hydraulics';
import { engineInputErrorText, engineIssueText } from '../../shared/messages/engine-issue-text';
import { ProblemError } from '../api/problem-details';
import { balancingAnswer, branchedCurvePoint, branchFlowSummaries } from './branch-answers';
import { dutyOfParallelPumps, type DutyPoint, type PumpOnFile } from './arrangement-duty';
import { pointerInto, unprocessable, withRequestPointers } from './engine-problem';
import { fitInlinePump, preferredBandOf, summarizeFit } from './pump-request';
import { answerUnits, echoedUnits, requestValueText, round } from './request-units';
import { gravityFlowMessage, npshCheckAnswer, npshGuidanceOf, npshMessage, suctionLiftCaution } from './suction-answer';
import { prepareSystem, requirePlausible, requirePlausibleFlow, velocityWarnings } from './system-request';

/** Where the calculations find a catalog pump's current curve. */
export interface CurrentPumpCurves {
  findPump(pumpId: number): Promise<PumpOnFile | undefined>;
}

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
    ...(branched === null ? {} : { branches: branchFlowSummaries(branchFlowsAt(branched, point.flow), units) }),
  };
}

const noPointTitles: Record<NoOperatingPointReason, string> = {
  'below-static-head':
    'the pump cannot lift the water this high: its shut-off head is below the static head plus outlet pressure head',
  'before-curve':
    'the curves would cross left of the first published point of the pump curve, where the maker gives no data',
  'beyond-curve':
    'the curves would cross right of the last published point (run-out): the system needs less head than the pump gives even there',
};

/** The duty-point messages a designer reads, in the request's units. */
export function dutyWarningMessages(point: DutyPoint, system: CompiledSystemCurve, units: CalculationUnits): string[] {
  const to = answerUnits(units);
  const messages = velocityWarnings(system, point.flow, units);
  if (point.warnings.includes('run-out')) {
    messages.push(
      `run-out: each pump runs at ${round(to.flow(point.flowPerPump))} ${units.flow}, at the end of its published curve`,
    );
  }
  if (point.warnings.includes('dead-head')) {
    messages.push('near dead-head: the pump runs close to its shut-off head and passes little water; it may overheat');
  }
  if (point.region === 'outside')
    messages.push('outside the preferred operating region: expect shorter bearing and seal life');
  return messages;
}

function diameterUnitOf(request: Request): DiameterUnit {
  return (request.query as PipeSizesQuery | FittingsQuery).diameter ?? 'in';
}

export function createCalculationHandlers(
  pumps: CurrentPumpCurves,
): Record<'calculateSystemCurve' | 'calculateOperatingPoint' | 'listPipeSizes' | 'listFittings', RequestHandler> {
  return {
    calculateSystemCurve: (request, response) => {
      const body = request.body as SystemCurveRequest;
      const { curve, branched, suction, gravityFlow } = prepareSystem(body.units, body.system);
      const to = answerUnits(body.units);
      const warnings = new Set<string>();
      const valueText = requestValueText(body.units);
      // transitional flow and Hazen-Williams out of range: once per segment, at the first flow they occur
      const reportedSegmentIssues = new Set<string>();
      const points = body.flows.map((flowInUnits, index) => {
        const flow = flowToSI(flowInUnits, body.units.flow);
        requirePlausibleFlow(flow, `/body/flows/${index}`, body.units);
        if (branched !== null) {
          for (const warning of velocityWarnings(curve, flow, body.units)) warnings.add(warning);
          return branchedCurvePoint(branched, flowInUnits, flow, body.units, warnings);
        }
        const breakdown = systemBreakdown(curve, flow);
        for (const issue of breakdown.issues) {
          if (issue.code === 'segment-velocity') continue;
          const key = `${issue.code} ${issue.pointer ?? ''}`;
          if (issue.code === 'hazen-williams-temperature' || !reportedSegmentIssues.has(key)) {
            reportedSegmentIssues.add(key);
            warnings.add(engineIssueText(issue, valueText));
          }
        }
        if (breakdown.segments.some((segment) => segment.velocity > VELOCITY_WARNING_LIMIT)) {
          for (const warning of velocityWarnings(curve, flow, body.units)) warnings.add(warning);
        }
        return {
          flow: flowInUnits,
          head: to.head(breakdown.totalHead),
          staticHead: to.head(breakdown.staticHead),
          outletPressureHead: to.head(breakdown.outletPressureHead),
          frictionHead: to.head(breakdown.frictionHead),
          minorHead: to.head(breakdown.minorHead),
          equipmentHead: to.head(breakdown.equipmentHead),
          velocities: breakdown.segments.map((segment) => to.length(segment.velocity)),
          reynoldsNumbers: breakdown.segments.map((segment) => segment.reynolds),
          equipment: breakdown.segments.flatMap((segment) =>
            segment.equipment.map((entry) => ({
              segment: segment.index,
              name: entry.name,
              headLoss: to.head(entry.headLoss),
            })),
          ),
          ...(suction ? { npshAvailable: to.head(npshAvailableAt(suction, flow)) } : {}),
        };
      });
      const caution = suctionLiftCaution(suction, body.units);
      if (caution) warnings.add(caution);
      if (gravityFlow !== null) warnings.add(gravityFlowMessage(gravityFlow, body.units));
      const answer: SystemCurveResponse = {
        units: echoedUnits(body.units),
        points,
        ...(gravityFlow === null ? {} : { gravityFlow: to.flow(gravityFlow) }),
        warnings: [...warnings],
      };
      response.json(answer);
    },

    calculateOperatingPoint: async (request, response) => {
      const body = request.body as OperatingPointRequest;
      const { curve, branched, density, suction, gravityFlow } = prepareSystem(body.units, body.system);
      const band = preferredBandOf(body.preferredBand);
      const guidance = npshGuidanceOf(body.npshMarginRatio);
      let pump: PumpOnFile;
      if ('pumpId' in body.pump) {
        const found = await pumps.findPump(body.pump.pumpId);
        if (!found) {
          throw new ProblemError(404, 'Pump not found', `No pump with a current curve has id ${body.pump.pumpId}`, [
            { pointer: '/body/pump/pumpId', detail: 'no pump with a current curve has this id' },
          ]);
        }
        pump = found;
      } else {
        pump = { fit: fitInlinePump(body.units, body.pump) };
      }
      const installed = body.arrangement?.installed ?? 1;
      const running = body.arrangement?.running ?? installed;
      if (running > installed)
        throw unprocessable(
          '/body/arrangement/running',
          engineInputErrorText({
            code: 'running-exceeds-installed',
            params: { running, installed },
            pointer: '/running',
          }),
        );
      const duty = withRequestPointers(
        () => dutyOfParallelPumps(pump, curve, running, band, density),
        pointerInto('/body/arrangement'),
      );
      if (!duty.ok) {
        const detail =
          gravityFlow === null
            ? noPointTitles[duty.reason]
            : `${noPointTitles[duty.reason]}; ${gravityFlowMessage(gravityFlow, body.units)}`;
        throw new ProblemError(
          422,
          'No operating point',
          detail,
          [{ pointer: '/body/pump', detail }],
          'no-operating-point',
          {
            reason: duty.reason,
            ...(gravityFlow === null ? {} : { gravityFlow: answerUnits(body.units).flow(gravityFlow) }),
          },
        );
      }
      const oneFailed =
        running === installed && installed >= 2 ? dutyOfParallelPumps(pump, curve, running - 1, band, density) : null;
      const warnings = dutyWarningMessages(duty.point, curve, body.units);
      if (oneFailed && !oneFailed.ok) warnings.push(`with one pump failed: ${noPointTitles[oneFailed.reason]}`);
      const npsh = suction ? npshAtDuty(suction, pump.fit, duty.point.flow, duty.point.flowPerPump, guidance) : null;
      const npshText = npsh ? npshMessage(npsh, guidance, body.units) : null;
      if (npshText) warnings.push(npshText);
      const caution = suctionLiftCaution(suction, body.units);
      if (caution) warnings.push(caution);
      if (gravityFlow !== null) warnings.push(gravityFlowMessage(gravityFlow, body.units));
      const answer: OperatingPointResponse = {
        units: echoedUnits(body.units),
        operatingPoint: operatingPointSummary(duty.point, body.units, branched),
        oneFailed: oneFailed?.ok ? operatingPointSummary(oneFailed.point, body.units, branched) : null,
        fit: summarizeFit(pump.fit, body.units, preferredFlowRegion(pump.fit, band, pump.declaredPreferred)),
        ...(body.balance === undefined
          ? {}
          : { balancing: balancingAnswer(branched, pump.fit, running, body.balance, body.units) }),
        ...(npsh ? { npsh: npshCheckAnswer(npsh, guidance, body.units) } : {}),
        ...(gravityFlow === null ? {} : { gravityFlow: answerUnits(body.units).flow(gravityFlow) }),
        warnings,
      };
      response.json(answer);
    },

    listPipeSizes: (request, response) => {
      const diameter = diameterUnitOf(request);
      const answer: PipeSizesResponse = {
        units: { diameter },
        series: PIPE_SERIES.map((series) => ({
          id: series.id,
          label: series.label,
          material: series.material,
          source: series.source,
          sizes: series.sizes.map((size) => ({
            id: size.id,
            nominalSize: size.nominalSize,
            nominalLabel: size.nominalLabel,
            insideDiameter: diameterFromSI(size.insideDiameter, diameter),
            outsideDiameter: size.outsideDiameter === null ? null : diameterFromSI(size.outsideDiameter, diameter),
            hazenWilliamsC: size.hazenWilliamsC,
            roughness: diameterFromSI(size.roughness, diameter),
          })),
        })),
      };
      response.set('Cache-Control', 'private, max-age=3600').json(answer);
    },

    listFittings: (request, response) => {
      const query = request.query as FittingsQuery;
      let frictionFactor: number | null = null;
      if (query.insideDiameter !== undefined) {
        const bore = diameterToSI(query.insideDiameter, diameterUnitOf(request));
        requirePlausible('insideDiameter', bore, '/query/insideDiameter', {
          ...SI_PLAUSIBLE_UNITS,
          diameter: diameterUnitOf(request),
        });
        frictionFactor = craneFullyTurbulentFrictionFactor(bore);
      }
      const answer: FittingsResponse = {
        fittings: FITTINGS.map(({ kind, label, resistance, source }) => {
          if (resistance.method === 'fixed') return { kind, label, method: 'fixed', k: resistance.k, source };
          if (resistance.method === 'diameter-ratio') return { kind, label, method: 'diameter-ratio', source };
          return {
            kind,
            label,
            method: 'crane',
            multiplier: resistance.multiplier,
            ...(frictionFactor === null ? {} : { k: resistance.multiplier * frictionFactor }),
            source,
          };
        }),
      };
      response.set('Cache-Control', 'private, max-age=3600').json(answer);
    },
  };
}
