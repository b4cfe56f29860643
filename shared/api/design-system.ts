import { PIPE_SERIES } from '../hydraulics/pipe-catalogue';
import type { CalculationUnits, DesignDraft, DesignSystem, PipeSystem, SelectionRequest } from './api-schemas';

/*
 * A saved or drafted design (the contract's DesignDraft) as the calculations take it: one mapping
 * for the design pages, the proposals, the project history and the re-check, so that a figure on
 * a page, in a PDF and in a site visit's comparison comes from the same request.
 */

/** The units a design's numbers are in, by its unit system (DesignDraft: us gpm, ft, in; si L/min, m, mm). */
export const DESIGN_UNITS: Readonly<Record<DesignDraft['unitSystem'], Required<CalculationUnits>>> = Object.freeze({
  us: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' },
  si: { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm', power: 'kW' },
});

/**
 * Static head of a design's system: as typed, or the rise from the intake to the discharge level.
 * @param system - the design's system, in its units
 * @returns static head, in the design's head unit
 */
export function designStaticHead(system: DesignSystem): number {
  return system.staticMode === 'levels' ? system.dischargeLevel - system.intakeLevel : system.staticHead;
}

/** One segment as the API's: a custom bore replaces the size (the series' material gives the defaults C and roughness do not override). */
function designPipeSegment(segment: DesignSystem['segments'][number]): PipeSystem['segments'][number] {
  const customBore = segment.insideDiameter ?? null;
  return {
    length: segment.length,
    ...(customBore === null
      ? { pipe: segment.size }
      : {
          insideDiameter: customBore,
          material: PIPE_SERIES.find((series) => series.id === segment.series)?.material,
        }),
    ...(segment.hazenWilliamsC == null ? {} : { hazenWilliamsC: segment.hazenWilliamsC }),
    ...(segment.roughness == null ? {} : { roughness: segment.roughness }),
    fittings: segment.fittings.filter((fitting) => fitting.count > 0) as PipeSystem['segments'][number]['fittings'],
    minorLossK: segment.extraK,
    ...(segment.equipment?.length ? { equipment: segment.equipment } : {}),
  };
}

/**
 * A design's system as the API's `system`; fittings counted zero are left out.
 * @param system - the design's system, in its units
 * @returns the contract's PipeSystem, in the same units
 */
export function designPipeSystem(system: DesignSystem): PipeSystem {
  return {
    staticHead: designStaticHead(system),
    outletPressureHead: system.outletPressureHead,
    frictionMethod: system.frictionMethod,
    waterTemperatureC: system.waterTemperatureC,
    segments: system.segments.map(designPipeSegment),
  };
}

/** The selection request of a design: the search the pages run, the proposal prints and a re-check repeats. */
export function designSelectionRequest(design: DesignDraft): SelectionRequest {
  const { search } = design;
  return {
    units: DESIGN_UNITS[design.unitSystem],
    system: designPipeSystem(design.system),
    duty: { flowMin: design.band.flowMin, flowMax: design.band.flowMax },
    arrangements: search.arrangements,
    requireOneFailed: search.requireOneFailed,
    standby: search.standby ?? false,
    filters: {
      onlyPreferredRegion: search.onlyPreferredRegion,
      ...(search.kinds?.length ? { kinds: search.kinds } : {}),
      ...(search.minSolidsMm == null ? {} : { minSolidsMm: search.minSolidsMm }),
      ...(search.maxInputPowerPerPump === null ? {} : { maxInputPowerPerPump: search.maxInputPowerPerPump }),
    },
    energy: {
      hoursPerDay: search.hoursPerDay,
      ...(search.tariffPerKWh === null ? {} : { tariffPerKWh: search.tariffPerKWh }),
      ...(search.motorEfficiency == null ? {} : { motorEfficiency: search.motorEfficiency }),
    },
    ...(search.rankBy === undefined ? {} : { rankBy: search.rankBy }),
    ...(search.costs == null ? {} : { costs: search.costs }),
    limit: search.limit,
  };
}
