import type { CalculationUnits, DesignDraft, SelectionRequest, SelectionResponse } from '../../shared/api/api-schemas';
import { DESIGN_UNITS, designSelectionRequest } from '../../shared/api/design-system';
import { flowToSI, headFromSI } from '../../shared/hydraulics';
import { prepareSystem } from '../calculations/system-request';
import type { CatalogSnapshot } from '../catalog/catalog-snapshot';
import { answerSelection } from '../selection/selection-handlers';

/** The units of a saved design, as the contract's DesignDraft states them (us: gpm, ft, in; si: L/min, m, mm). */
export function designUnits(design: DesignDraft): Required<CalculationUnits> {
  return DESIGN_UNITS[design.unitSystem];
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
