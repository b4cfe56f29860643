import type {
  CalculationUnits,
  DesignDraft,
  PipeSystem,
  SelectionRequest,
  SelectionResponse,
} from '../../shared/api/api-schemas';
import { flowToSI, headFromSI } from '../../shared/hydraulics';
import { prepareSystem } from '../calculations/system-request';
import type { CatalogSnapshot } from '../catalog/catalog-snapshot';
import { answerSelection } from '../selection/selection-handlers';

/** The units of a saved design, as the contract's DesignDraft states them (us: gpm, ft, in; si: L/min, m, mm). */
export function designUnits(design: DesignDraft): Required<CalculationUnits> {
  return design.unitSystem === 'us'
    ? { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' }
    : { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm', power: 'kW' };
}

/** Static head of the saved system: as typed, or the rise from the intake to the discharge level. */
export function designStaticHead(design: DesignDraft): number {
  const { system } = design;
  return system.staticMode === 'levels' ? system.dischargeLevel - system.intakeLevel : system.staticHead;
}

/** The saved system as the API's `system`, fittings with a zero count left out (as the design pages send it). */
export function designPipeSystem(design: DesignDraft): PipeSystem {
  const { system } = design;
  return {
    staticHead: designStaticHead(design),
    outletPressureHead: system.outletPressureHead,
    frictionMethod: system.frictionMethod,
    waterTemperatureC: system.waterTemperatureC,
    segments: system.segments.map((segment) => ({
      length: segment.length,
      pipe: segment.size,
      fittings: segment.fittings.filter((fitting) => fitting.count > 0),
      minorLossK: segment.extraK,
    })),
  };
}

/** The selection request the design pages send for this design: the same search, the same answer. */
export function designSelectionRequest(design: DesignDraft): SelectionRequest {
  const { search } = design;
  return {
    units: designUnits(design),
    system: designPipeSystem(design),
    duty: { flowMin: design.band.flowMin, flowMax: design.band.flowMax },
    arrangements: search.arrangements,
    requireOneFailed: search.requireOneFailed,
    standby: search.standby ?? false,
    filters: {
      onlyPreferredRegion: search.onlyPreferredRegion,
      ...(search.maxInputPowerPerPump === null ? {} : { maxInputPowerPerPump: search.maxInputPowerPerPump }),
    },
    energy: {
      hoursPerDay: search.hoursPerDay,
      ...(search.tariffPerKWh === null ? {} : { tariffPerKWh: search.tariffPerKWh }),
    },
    limit: search.limit,
  };
}

export interface DesignFigures {
  request: SelectionRequest;
  selection: SelectionResponse;
  /** The system curve from no flow to past the widest candidate curve, in the design's units. */
  systemCurve: Array<{ flow: number; head: number }>;
  /** Total dynamic head the system needs at the band's ends, in the design's units. */
  headAtBand: { min: number; max: number };
}

/** The selection answer and the system curve of a saved design, from the server's own search and engine. */
export async function designFigures(catalog: CatalogSnapshot, design: DesignDraft): Promise<DesignFigures> {
  const request = designSelectionRequest(design);
  const selection = await answerSelection(catalog, request);
  const { curve } = prepareSystem(request.units, request.system);
  const headAt = (flow: number) => headFromSI(curve.evaluate(flowToSI(flow, request.units.flow)), request.units.head);
  const widest = Math.max(
    design.band.flowMax * 1.25,
    ...selection.candidates.flatMap((candidate) => candidate.curve.map((point) => point.flow)),
  );
  const steps = 40;
  const systemCurve = Array.from({ length: steps + 1 }, (_, step) => {
    const flow = (widest * step) / steps;
    return { flow, head: headAt(flow) };
  });
  return {
    request,
    selection,
    systemCurve,
    headAtBand: { min: headAt(design.band.flowMin), max: headAt(design.band.flowMax) },
  };
}
