import { PIPE_SERIES } from '../hydraulics/pipe-catalogue';
import type {
  CalculationUnits,
  DesignBranch,
  DesignDraft,
  DesignSystem,
  PipeSystem,
  SelectionRequest,
} from './api-schemas';

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

/**
 * Static head of one branch: as typed, or its outlet's level above the system's intake level.
 * @param branch - the branch, in the design's units
 * @param system - its system (for the intake level)
 * @returns the branch's outlet above the intake water surface, in the design's head unit
 */
export function designBranchStaticHead(branch: DesignBranch, system: Pick<DesignSystem, 'intakeLevel'>): number {
  return branch.staticMode === 'levels' ? branch.outletLevel - system.intakeLevel : branch.staticHead;
}

/** Whether the route (or common run) starts with a suction side. */
export function designHasSuction(system: DesignSystem): boolean {
  return system.segments.some((segment) => segment.side === 'suction');
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
    ...(segment.side === 'suction' ? { side: 'suction' as const } : {}),
  };
}

/**
 * A design's system as the API's `system`; fittings counted zero are left out. With branches the
 * segments are the common run and each branch brings its own outlet level and pressure (the
 * system's own static head and outlet pressure are not used); the site and pump elevations go
 * along only with a suction side (the API refuses a pump elevation without one).
 * @param system - the design's system, in its units
 * @returns the contract's PipeSystem, in the same units
 */
export function designPipeSystem(system: DesignSystem): PipeSystem {
  const suction = designHasSuction(system)
    ? {
        ...(system.siteElevation === undefined ? {} : { siteElevation: system.siteElevation }),
        ...(system.pumpElevation === undefined ? {} : { pumpElevation: system.pumpElevation }),
      }
    : {};
  const common = {
    frictionMethod: system.frictionMethod,
    waterTemperatureC: system.waterTemperatureC,
    ...suction,
    segments: system.segments.map(designPipeSegment),
  };
  if (system.branches?.length) {
    return {
      ...common,
      branches: system.branches.map((branch) => ({
        name: branch.name,
        staticHead: designBranchStaticHead(branch, system),
        outletPressureHead: branch.outletPressureHead,
        segments: branch.segments.map(designPipeSegment),
      })),
    };
  }
  return { staticHead: designStaticHead(system), outletPressureHead: system.outletPressureHead, ...common };
}

/** The selection request of a design: the search the pages run, the proposal prints and a re-check repeats. */
export function designSelectionRequest(design: DesignDraft): SelectionRequest {
  const { search } = design;
  return {
    units: DESIGN_UNITS[design.unitSystem],
    system: designPipeSystem(design.system),
    duty: { flowMin: design.band.flowMin, flowMax: design.band.flowMax },
    // beside a kept pump, one pump is added and no standby (SelectionKeep)
    arrangements: search.keepPumpId == null ? search.arrangements : [1],
    requireOneFailed: search.requireOneFailed,
    standby: search.keepPumpId == null ? (search.standby ?? false) : false,
    ...(search.keepPumpId == null ? {} : { keep: { pump: { pumpId: search.keepPumpId } } }),
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
