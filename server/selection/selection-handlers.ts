import type { RequestHandler } from 'express';
import type { SelectionCandidate, SelectionRequest, SelectionResponse } from '../../shared/api/api-schemas';
import {
  DEFAULT_MOTOR_EFFICIENCY_BY_KIND,
  flowToSI,
  powerToSI,
  type CompiledBranchedSystem,
} from '../../shared/hydraulics';
import { branchTotalFlowBand } from '../calculations/branch-answers';
import { operatingPointSummary } from '../calculations/calculation-handlers';
import { unprocessable } from '../calculations/engine-problem';
import { preferredBandOf } from '../calculations/pump-request';
import { answerUnits, echoedUnits, powerUnitOf, type AnswerUnits } from '../calculations/request-units';
import {
  gravityFlowMessage,
  npshCheckAnswer,
  npshGuidanceOf,
  suctionLiftCaution,
} from '../calculations/suction-answer';
import { prepareSystem, requirePlausibleFlow } from '../calculations/system-request';
import type { CatalogPump, CatalogSnapshot } from '../catalog/catalog-snapshot';
import { costTermsOf, type RankedCandidate, type SelectionQuery } from './selection-query';
import { keptPumpOf, keptSetAnswer } from './kept-pump-request';
import { pipeSizeSuggestions } from './pipe-size-suggestions';
import { sampledCombinedCurve, searchCatalog } from './selection-search';
import { unmetSummary, type BandMissFacts } from './selection-shortfalls';

const defaultArrangements = [1, 2];
const defaultLimit = 20;
/** Ponds and streams usually run around the clock. */
const defaultHoursPerDay = 24;

function pumpFilter(filters: SelectionRequest['filters']): (pump: CatalogPump) => boolean {
  const suppliers = filters?.supplierIds?.length ? new Set(filters.supplierIds) : null;
  const kinds = filters?.kinds?.length ? new Set<string>(filters.kinds) : null;
  const text = filters?.modelContains?.trim().toLowerCase() || null;
  const minSolids = filters?.minSolidsMm ?? null;
  return (pump) =>
    (!suppliers || suppliers.has(pump.supplierId)) &&
    (!kinds || kinds.has(pump.kind)) &&
    // a pump whose solids handling the catalog does not give cannot be said to pass them
    (minSolids === null || (pump.solidsHandlingMm !== null && pump.solidsHandlingMm >= minSolids)) &&
    (!text || pump.model.toLowerCase().includes(text) || pump.modelCode.toLowerCase().includes(text));
}

function candidateAnswer(
  candidate: RankedCandidate,
  rank: number,
  body: SelectionRequest,
  query: SelectionQuery,
  branched: CompiledBranchedSystem | null,
): SelectionCandidate {
  const to = answerUnits(body.units);
  return {
    rank,
    pumpId: candidate.pump.pumpId,
    supplier: candidate.pump.supplier,
    model: candidate.pump.model,
    modelCode: candidate.pump.modelCode,
    kind: candidate.pump.kind as SelectionCandidate['kind'],
    solidsHandlingMm: candidate.pump.solidsHandlingMm,
    arrangement: { installed: candidate.running + (body.standby ? 1 : 0), running: candidate.running },
    operatingPoint: operatingPointSummary(candidate.point, body.units, branched),
    oneFailed: candidate.oneFailed ? operatingPointSummary(candidate.oneFailed, body.units, branched) : null,
    inBand: candidate.inBand,
    oneFailedMeetsMinimum: candidate.oneFailedMeetsMinimum,
    region: candidate.point.region,
    annualKWh: candidate.annualKWh,
    annualCost: candidate.annualCost,
    motorEfficiency: {
      percent: candidate.motor.source === 'curve-is-electrical' ? null : candidate.motor.value * 100,
      source: candidate.motor.source,
    },
    listPrice: candidate.pump.listPrice,
    firstCost: candidate.firstCost,
    lifeCycleCost: candidate.lifeCycleCost,
    misses: candidate.misses,
    warnings: candidate.warnings,
    ...(candidate.npsh
      ? { npsh: npshCheckAnswer(candidate.npsh, npshGuidanceOf(body.npshMarginRatio), body.units) }
      : {}),
    reasons: candidate.reasons,
    curve: sampledCombinedCurve(candidate.pump, candidate.running).map((point) => ({
      flow: to.flow(point.flow),
      head: to.head(point.head),
    })),
    preferredRange: candidate.preferredRange
      ? { flowMin: to.flow(candidate.preferredRange.flowMin), flowMax: to.flow(candidate.preferredRange.flowMax) }
      : null,
    speed: candidate.pump.atSpeed ?? null,
    ...(candidate.set
      ? { set: keptSetAnswer(candidate.set, query.keep?.pumpId ?? null, candidate.pump.pumpId, body) }
      : {}),
  };
}

/** With no pair in band: which side the nearest fall on, and whether three in parallel would reach it. */
function bandMissFacts(
  outcome: ReturnType<typeof searchCatalog>,
  query: SelectionQuery,
  state: Parameters<typeof searchCatalog>[0],
): BandMissFacts {
  const below = outcome.candidates.filter((candidate) => candidate.point.flow < query.flowMin).length;
  if (query.keep)
    return { below: 2 * below >= outcome.candidates.length, threeInParallelInBand: null, besideKeptPump: true };
  const threeInParallelInBand = query.arrangements.includes(3)
    ? null
    : searchCatalog(state, { ...query, arrangements: [3], limit: 1 }).inBand;
  return { below: 2 * below >= outcome.candidates.length, threeInParallelInBand };
}

/** The duty band as total flow (SI): the band itself, or with duty.branch the totals that keep that branch in it. */
function totalDutyBand(
  body: SelectionRequest,
  branched: CompiledBranchedSystem | null,
): { flowMin: number; flowMax: number } {
  const flowMin = flowToSI(body.duty.flowMin, body.units.flow);
  const flowMax = flowToSI(body.duty.flowMax, body.units.flow);
  requirePlausibleFlow(flowMin, '/body/duty/flowMin', body.units);
  requirePlausibleFlow(flowMax, '/body/duty/flowMax', body.units);
  if (flowMin > flowMax)
    throw unprocessable(
      '/body/duty/flowMax',
      `must not be less than flowMin (${body.duty.flowMin} ${body.units.flow})`,
    );
  if (body.duty.branch === undefined) return { flowMin, flowMax };
  return branchTotalFlowBand(branched, body.duty.branch, flowMin, flowMax, body.units);
}

/** The band the search ranks on, in the request's units, when the duty names a branch. */
function totalFlowBandAnswer(band: { flowMin: number; flowMax: number }, to: AnswerUnits) {
  return { flowMin: to.flow(band.flowMin), flowMax: to.flow(band.flowMax) };
}

/** The search's input in SI, every problem a 4xx pointing at the field. */
function selectionQuery(body: SelectionRequest): {
  query: SelectionQuery;
  branched: CompiledBranchedSystem | null;
  gravityFlow: number | null;
  warnings: string[];
} {
  const { curve, branched, density, suction, gravityFlow } = prepareSystem(body.units, body.system);
  const { flowMin, flowMax } = totalDutyBand(body, branched);
  const rankBy = body.rankBy ?? 'energy';
  if (rankBy !== 'energy' && !body.costs)
    throw unprocessable('/body/costs', `must be given to rank by ${rankBy} (the currency prices are compared in)`);
  if (rankBy === 'life-cycle-cost' && body.energy?.tariffPerKWh === undefined)
    throw unprocessable('/body/energy/tariffPerKWh', 'must be given to rank by life-cycle cost');
  const maxPower = body.filters?.maxInputPowerPerPump;
  const warnings: string[] = [];
  if (body.energy?.tariffPerKWh === undefined) warnings.push('no tariff given: annual cost is left out');
  const caution = suctionLiftCaution(suction, body.units);
  if (caution) warnings.push(`external pumps: ${caution}`);
  if (gravityFlow !== null) {
    warnings.push(gravityFlowMessage(gravityFlow, body.units));
    if (gravityFlow >= flowMax) warnings.push('gravity alone delivers the whole duty band: no pump is needed for it');
  }
  return {
    query: {
      system: curve,
      density,
      flowMin,
      flowMax,
      arrangements: body.arrangements ?? (body.keep ? [1] : defaultArrangements),
      requireOneFailed: body.requireOneFailed ?? false,
      standby: body.standby ?? false,
      band: preferredBandOf(body.preferredBand),
      hoursPerDay: body.energy?.hoursPerDay ?? defaultHoursPerDay,
      tariffPerKWh: body.energy?.tariffPerKWh ?? null,
      motorEfficiency: body.energy?.motorEfficiency === undefined ? null : body.energy.motorEfficiency / 100,
      rankBy,
      costs: costTermsOf(body.costs),
      maxInputPowerPerPump: maxPower === undefined ? null : powerToSI(maxPower, powerUnitOf(body.units)),
      onlyPreferredRegion: body.filters?.onlyPreferredRegion ?? false,
      accepts: pumpFilter(body.filters),
      limit: body.limit ?? defaultLimit,
      suction,
      npshGuidance: npshGuidanceOf(body.npshMarginRatio),
      keep: null,
    },
    branched,
    gravityFlow,
    warnings,
  };
}

/** The search's answer for one request, as `POST /selections` gives it (reports use it too). */
export async function answerSelection(catalog: CatalogSnapshot, body: SelectionRequest): Promise<SelectionResponse> {
  const { query: plain, branched, gravityFlow, warnings } = selectionQuery(body);
  const state = await catalog.current();
  const query = { ...plain, keep: keptPumpOf(body, state, plain.motorEfficiency) };
  const outcome = searchCatalog(state, query);
  if (outcome.candidates.length === 0) warnings.push('no catalog pump meets this system in the arrangements asked for');
  if (outcome.leftOut)
    warnings.push(
      `catalog pumps left out (${outcome.leftOut}): a curve that does not start at zero flow cannot be set in parallel beside the kept pump`,
    );
  return {
    units: echoedUnits(body.units),
    duty: body.duty,
    ...(body.duty.branch === undefined ? {} : { totalFlowBand: totalFlowBandAnswer(query, answerUnits(body.units)) }),
    rankBy: query.rankBy,
    energyBasis: {
      basis: 'wire-to-water',
      motorEfficiencyByKind: {
        submersible: DEFAULT_MOTOR_EFFICIENCY_BY_KIND.submersible * 100,
        'external-centrifugal': DEFAULT_MOTOR_EFFICIENCY_BY_KIND['external-centrifugal'] * 100,
        'mixed-flow': DEFAULT_MOTOR_EFFICIENCY_BY_KIND['mixed-flow'] * 100,
      },
    },
    unmet: unmetSummary(
      outcome.candidates.map((candidate) => candidate.misses),
      outcome.inBand === 0 && outcome.candidates.length > 0 ? bandMissFacts(outcome, query, state) : null,
    ),
    considered: outcome.considered,
    inBand: outcome.inBand,
    candidates: outcome.candidates.map((candidate, index) =>
      candidateAnswer(candidate, index + 1, body, query, branched),
    ),
    ...(gravityFlow === null ? {} : { gravityFlow: answerUnits(body.units).flow(gravityFlow) }),
    pipeSizeSuggestions: pipeSizeSuggestions(body.system, branched, query.flowMax, answerUnits(body.units)),
    warnings,
  };
}

export function createSelectionHandlers(catalog: CatalogSnapshot): Record<'searchSelections', RequestHandler> {
  return {
    searchSelections: async (request, response) => {
      response.json(await answerSelection(catalog, request.body as SelectionRequest));
    },
  };
}
