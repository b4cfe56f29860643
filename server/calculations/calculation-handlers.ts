import type { Request, RequestHandler } from 'express';
import type {
  DiameterUnit,
  FittingsQuery,
  FittingsResponse,
  OperatingPointRequest,
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
  npshAvailableAt,
  PIPE_SERIES,
  SI_PLAUSIBLE_UNITS,
  systemBreakdown,
  VELOCITY_WARNING_LIMIT,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { branchedCurvePoint } from './branch-answers';
import { operatingPointAnswer } from './operating-point-answer';
import type { CurrentPumpCurves } from './pump-request';
import { answerUnits, echoedUnits, requestValueText } from './request-units';
import { gravityFlowMessage, suctionLiftCaution } from './suction-answer';
import { prepareSystem, requirePlausible, requirePlausibleFlow, velocityWarnings } from './system-request';

export type { CurrentPumpCurves } from './pump-request';
export { dutyWarningMessages, operatingPointSummary } from './operating-point-summary';

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
      response.json(await operatingPointAnswer(pumps, request.body as OperatingPointRequest));
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
