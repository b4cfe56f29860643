import { diameterToSI, headToSI, lengthToSI, type PipeSegmentInput, type SystemCurveInput } from '../hydraulics';
import type { CalculationUnits, PipeSystem } from './api-schemas';

/*
 * The contract's `system`, in the request's units, as the engine's SI input: one mapping for the
 * server's answers and the client's live preview. The contract's names differ from the engine's
 * in three places; SYSTEM_FIELD_RENAMES turns an engine field back into the contract's.
 */

/** Engine field name -> the contract's name for it. */
export const SYSTEM_FIELD_RENAMES: Readonly<Record<string, string>> = Object.freeze({
  temperature: 'waterTemperatureC',
  pipeSizeId: 'pipe',
  extraK: 'minorLossK',
});

/** One segment of the contract's system in SI (lengths in `units.length`, bores and roughness in `units.diameter`). */
function segmentInputOf(segment: PipeSystem['segments'][number], units: CalculationUnits): PipeSegmentInput {
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
  };
}

/** The system as compileSystemCurve takes it; heads in `units.head`, no outlet pressure meaning 0. */
export function systemInputOf(system: PipeSystem, units: CalculationUnits): SystemCurveInput {
  return {
    staticHead: headToSI(system.staticHead, units.head),
    outletPressureHead: headToSI(system.outletPressureHead ?? 0, units.head),
    segments: system.segments.map((segment) => segmentInputOf(segment, units)),
    temperature: system.waterTemperatureC,
    frictionMethod: system.frictionMethod,
  };
}
