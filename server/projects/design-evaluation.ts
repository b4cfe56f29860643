import type { CalculationUnits, ChoiceOutcome, DesignDraft, DesignOutcome } from '../../shared/api/api-schemas';
import { DESIGN_UNITS, designPipeSystem } from '../../shared/api/design-system';
import {
  branchFlowsAt,
  DEFAULT_NPSH_GUIDANCE,
  flowToSI,
  MAX_SPEED_RATIO,
  motorEfficiencyFor,
} from '../../shared/hydraulics';
import { pumpOnFileAtSpeed } from '../calculations/pump-at-speed';
import { branchFlowSummaries } from '../calculations/branch-answers';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import { dutyOfParallelPumps } from '../calculations/arrangement-duty';
import { operatingPointSummary } from '../calculations/calculation-handlers';
import { preferredBandOf } from '../calculations/pump-request';
import { answerUnits, requestValueText } from '../calculations/request-units';
import { prepareSystem, type PreparedSystem } from '../calculations/system-request';
import { pumpSpeedsOf, type CatalogPump } from '../catalog/catalog-snapshot';
import { CurveDeclaredRange, CurveRevision, Pump, Supplier } from '../database/models';
import { costTermsOf, type SelectionQuery } from '../selection/selection-query';
import { rankCandidate } from '../selection/selection-reasons';

/*
 * A saved design worked out as the API works out a calculation and a search: its system through
 * `prepareSystem`, the chosen pumps through `dutyOfParallelPumps`, and band, region and the
 * one-failed check through the search's own `rankCandidate`, so the project page and the
 * candidates page cannot disagree.
 */

/** The units a design's numbers are in (DesignDraft in openapi.yaml: us gpm, ft, in; si L/min, m, mm). */
export function designUnits(unitSystem: DesignDraft['unitSystem']): CalculationUnits {
  return DESIGN_UNITS[unitSystem];
}

/** A chosen pump on one stored curve revision, as the search holds catalog pumps. */
export interface ChosenCurve {
  pump: CatalogPump;
  revisionNumber: number;
}

/** The pump's curve revision `revisionId` as the search would hold it, or null when it is not that pump's. */
export async function chosenCurve(pumpId: number, revisionId: number): Promise<ChosenCurve | null> {
  const [pump, revision, preferred] = await Promise.all([
    Pump.findByPk(pumpId, { include: [{ model: Supplier, as: 'supplier' }] }),
    CurveRevision.findByPk(revisionId, { attributes: ['id', 'pumpId', 'number', 'fit'] }),
    CurveDeclaredRange.findOne({ where: { revisionId, region: 'preferred' } }),
  ]);
  if (!pump || !revision || revision.pumpId !== pump.id) return null;
  const fit = typeof revision.fit === 'string' ? JSON.parse(revision.fit) : revision.fit;
  return {
    revisionNumber: revision.number,
    pump: {
      pumpId: pump.id,
      supplierId: pump.supplierId,
      supplier: pump.supplier?.name ?? '',
      model: pump.displayName,
      modelCode: pump.modelCode,
      kind: pump.kind,
      solidsHandlingMm: pump.solidsHandlingMm,
      revisionId: revision.id,
      fit,
      declaredPreferred: preferred ? { flowMin: preferred.flowMinM3s, flowMax: preferred.flowMaxM3s } : null,
      motorEfficiency: pump.motorEfficiency,
      listPrice:
        pump.listPrice === null || pump.priceCurrency === null
          ? null
          : { amount: Number(pump.listPrice), currency: pump.priceCurrency },
      electrical: { fullLoadCurrent: pump.fullLoadCurrentA, voltage: pump.voltageV, phases: pump.phaseCount },
      speeds: pumpSpeedsOf({
        nominal_speed_rpm: pump.nominalSpeedRpm,
        speed_min_rpm: pump.speedMinRpm,
        speed_max_rpm: pump.speedMaxRpm,
        fixed_speeds_rpm: pump.fixedSpeedsRpm,
      }),
    },
  };
}

interface Arrangement {
  installed: number;
  running: number;
  /** The speed kept with the choice for a variable-speed pump, rpm; null or absent for the nominal speed. */
  speedRpm?: number | null;
}

/** The chosen pump at the choice's speed (affinity laws), when it has one its nominal speed scales to. */
function pumpAtChosenSpeed(pump: CatalogPump, speedRpm: number | null | undefined): CatalogPump {
  const nominal = pump.speeds.nominalRpm;
  if (speedRpm == null || nominal === null || speedRpm === nominal) return pump;
  const ratio = speedRpm / nominal;
  if (!(ratio > 0 && ratio <= MAX_SPEED_RATIO)) return pump;
  return { ...pumpOnFileAtSpeed(pump, ratio), atSpeed: { ratio, rpm: speedRpm } };
}

function queryFor(design: DesignDraft, { curve: system, density, suction }: PreparedSystem, arrangement: Arrangement) {
  const units = designUnits(design.unitSystem);
  const query: SelectionQuery = {
    system,
    density,
    flowMin: flowToSI(design.band.flowMin, units.flow),
    flowMax: flowToSI(design.band.flowMax, units.flow),
    arrangements: [arrangement.running],
    requireOneFailed: design.search.requireOneFailed,
    standby: arrangement.installed > arrangement.running,
    band: preferredBandOf(undefined),
    hoursPerDay: design.search.hoursPerDay,
    tariffPerKWh: design.search.tariffPerKWh,
    motorEfficiency: design.search.motorEfficiency == null ? null : design.search.motorEfficiency / 100,
    rankBy: design.search.rankBy ?? 'energy',
    costs: costTermsOf(design.search.costs ?? undefined),
    // the chosen pump is judged, not filtered: no power limit, every region
    maxInputPowerPerPump: null,
    onlyPreferredRegion: false,
    accepts: () => true,
    limit: 1,
    // the design's suction side, when it has one, as the search checks it
    suction,
    npshGuidance: DEFAULT_NPSH_GUIDANCE,
    keep: null,
  };
  return query;
}

/** The chosen pumps on `design`'s system, answered in `units`. */
export function choiceOutcome(
  design: DesignDraft,
  curve: ChosenCurve,
  arrangement: Arrangement,
  units: CalculationUnits,
): ChoiceOutcome {
  const prepared = prepareSystem(designUnits(design.unitSystem), designPipeSystem(design.system), '');
  const { curve: system, density, branched } = prepared;
  const query = queryFor(design, prepared, arrangement);
  const base = { curveRevisionId: curve.pump.revisionId, curveRevisionNumber: curve.revisionNumber };
  const pump = pumpAtChosenSpeed(curve.pump, arrangement.speedRpm);
  const motor = motorEfficiencyFor(pump, query.motorEfficiency).value;
  const duty = dutyOfParallelPumps(pump, system, arrangement.running, query.band, density, motor);
  if (!duty.ok)
    return {
      ...base,
      operatingPoint: null,
      inBand: false,
      region: null,
      redundant: false,
      reasons: [engineIssueText(duty.issue, requestValueText(units))],
    };
  const ranked = rankCandidate(pump, arrangement.running, duty.point, query);
  if (!ranked) throw new Error('a chosen pump is never filtered out');
  return {
    ...base,
    operatingPoint: operatingPointSummary(duty.point, units, branched),
    inBand: ranked.inBand,
    region: ranked.point.region,
    redundant: ranked.oneFailedMeetsMinimum === true,
    reasons: ranked.reasons,
  };
}

/** TDH over the band (low end, middle, high end) and the chosen pumps on `design`, in `units`. */
export function designOutcome(
  design: DesignDraft,
  units: CalculationUnits,
  chosen: { curve: ChosenCurve; arrangement: Arrangement } | null,
): DesignOutcome {
  const from = designUnits(design.unitSystem);
  const { curve: system, branched } = prepareSystem(from, designPipeSystem(design.system), '');
  const to = answerUnits(units);
  const low = flowToSI(design.band.flowMin, from.flow);
  const high = flowToSI(design.band.flowMax, from.flow);
  return {
    units: { flow: units.flow, head: units.head },
    systemHead: [low, (low + high) / 2, high].map((flow) => ({
      flow: to.flow(flow),
      head: to.head(system.evaluate(flow)),
      ...(branched === null ? {} : { branches: branchFlowSummaries(branchFlowsAt(branched, flow), units) }),
    })),
    choice: chosen ? choiceOutcome(design, chosen.curve, chosen.arrangement, units) : null,
  };
}
