import {
  PRESSURE_UNITS,
  diameterToSI,
  flowToSI,
  headToSI,
  lengthToSI,
  pressureToHead,
  waterDensity,
  type BranchedSystemInput,
  type HeadUnit,
  type PipeSegmentInput,
  type PressureUnit,
  type SystemCurveInput,
} from '../hydraulics';
import type { CalculationUnits, PipeSystem } from './api-schemas';

/*
 * The contract's `system`, in the request's units, as the engine's SI input: one mapping for the
 * server's answers and the client's live preview. The contract's names differ from the engine's
 * in three places; SYSTEM_FIELD_RENAMES turns an engine field back into the contract's.
 */

/**
 * Engine field name -> the contract's name for it.
 * @example
 * SYSTEM_FIELD_RENAMES.extraK // => 'minorLossK'
 */
export const SYSTEM_FIELD_RENAMES: Readonly<Record<string, string>> = Object.freeze({
  temperature: 'waterTemperatureC',
  pipeSizeId: 'pipe',
  extraK: 'minorLossK',
});

/**
 * A head given in a head unit, or a pressure (psi, kPa, bar) turned into head of water at the
 * system's temperature by h = p / (rho g) (units.ts pressureToHead; density from IAPWS-95 as
 * water-properties.ts gives it).
 */
function headOrPressureToSI(value: number, unit: HeadUnit | PressureUnit, temperature: number | undefined): number {
  return (PRESSURE_UNITS as readonly string[]).includes(unit)
    ? pressureToHead(value, unit as PressureUnit, waterDensity(temperature ?? 20))
    : headToSI(value, unit as HeadUnit);
}

/** One segment of the contract's system in SI (lengths in `units.length`, bores and roughness in `units.diameter`). */
function segmentInputOf(
  segment: PipeSystem['segments'][number],
  units: CalculationUnits,
  temperature: number | undefined,
): PipeSegmentInput {
  return {
    length: lengthToSI(segment.length, units.length),
    pipeSizeId: segment.pipe,
    insideDiameter:
      segment.insideDiameter === undefined ? undefined : diameterToSI(segment.insideDiameter, units.diameter),
    material: segment.material,
    hazenWilliamsC: segment.hazenWilliamsC,
    roughness: segment.roughness === undefined ? undefined : diameterToSI(segment.roughness, units.diameter),
    fittings: segment.fittings,
    extraK: segment.minorLossK,
    side: segment.side,
    equipment: segment.equipment?.map((entry) => ({
      name: entry.name,
      headLoss: headOrPressureToSI(entry.headLoss, entry.headLossUnit ?? units.head, temperature),
      atFlow: flowToSI(entry.atFlow, units.flow),
    })),
  };
}

/**
 * The system as compileSystemCurve takes it: lengths (with the site and pump elevations), bores,
 * roughness, heads and flows converted to SI by the engine's unit conversions (units.ts; NIST SP
 * 811 factors), no outlet pressure meaning 0; an outlet pressure or equipment loss given in a
 * pressure unit becomes head of water at the system's temperature (h = p / rho g).
 * @param system - the contract's system, in the request's units
 * @param units - the request's units: `length` for lengths, `diameter` for bores and roughness, `head` for heads, `flow` for equipment's rated flows
 * @returns the engine's SI input (m, C)
 * @example
 * // exact: 10 ft = 3.048 m, 100 ft = 30.48 m, 0.0018 in = 4.572e-5 m
 * const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' }
 * const input = systemInputOf({ staticHead: 10, frictionMethod: 'darcy-weisbach', segments: [{ length: 100, insideDiameter: 2.067, roughness: 0.0018 }] }, units)
 * input.staticHead // => 3.048
 * input.segments[0].length // => 30.48
 * input.segments[0].roughness // => 4.572e-5
 * compileSystemCurve(input).staticHead // => 3.048
 * // 1 bar at 20 C: 1e5 / (998.206 x 9.80665) = 10.2155 m (water density of python3-iapws)
 * systemInputOf({ staticHead: 0, outletPressureHead: 1, outletPressureUnit: 'bar', frictionMethod: 'darcy-weisbach', segments: [{ length: 1, insideDiameter: 2 }] }, units).outletPressureHead // => 10.2155
 */
export function systemInputOf(system: PipeSystem, units: CalculationUnits): SystemCurveInput {
  return {
    // The contract requires staticHead on a system without branches; a missing one is refused at /staticHead.
    staticHead: headToSI(system.staticHead ?? Number.NaN, units.head, '/staticHead'),
    outletPressureHead: headOrPressureToSI(
      system.outletPressureHead ?? 0,
      system.outletPressureUnit ?? units.head,
      system.waterTemperatureC,
    ),
    segments: system.segments.map((segment) => segmentInputOf(segment, units, system.waterTemperatureC)),
    temperature: system.waterTemperatureC,
    frictionMethod: system.frictionMethod,
    siteElevation: system.siteElevation === undefined ? undefined : lengthToSI(system.siteElevation, units.length),
    pumpElevation: system.pumpElevation === undefined ? undefined : lengthToSI(system.pumpElevation, units.length),
  };
}

/**
 * A branched system (one with `branches`) as compileBranchedSystem takes it, converted as in
 * systemInputOf: the common run's segments, and each branch's outlet level, outlet pressure head
 * (none meaning 0) and segments; null for a system without branches. (The contract refuses a
 * system staticHead or outletPressureHead beside branches.)
 * @param system - the contract's system, in the request's units
 * @param units - the request's units
 * @returns the engine's SI input (m, C), or null
 * @example
 * const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' }
 * const pipe = [{ length: 100, insideDiameter: 2 }]
 * const input = branchedSystemInputOf({ frictionMethod: 'hazen-williams', segments: [], branches: [{ name: 'falls', staticHead: 10, segments: pipe }, { name: 'return', staticHead: -1, segments: pipe }] }, units)
 * input?.branches[0].staticHead // => 3.048
 * input?.branches[1].outletPressureHead // => 0
 */
export function branchedSystemInputOf(system: PipeSystem, units: CalculationUnits): BranchedSystemInput | null {
  if (system.branches === undefined) return null;
  return {
    frictionMethod: system.frictionMethod,
    temperature: system.waterTemperatureC,
    segments: system.segments.map((segment) => segmentInputOf(segment, units, system.waterTemperatureC)),
    branches: system.branches.map((branch) => ({
      name: branch.name,
      staticHead: headToSI(branch.staticHead, units.head),
      outletPressureHead: headToSI(branch.outletPressureHead ?? 0, units.head),
      segments: branch.segments.map((segment) => segmentInputOf(segment, units, system.waterTemperatureC)),
    })),
  };
}
