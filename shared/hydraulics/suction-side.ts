import { HydraulicsInputError, requireInRange } from './hydraulics-error';
import { npshAvailable, npshMargin, standardAtmosphericPressure, type NpshGuidance, type NpshMargin } from './npsh';
import { pumpNpshRequiredAt } from './pump-curve-evaluation';
import type { PumpCurveFit } from './pump-curve-fit';
import { compileSystemCurve, type CompiledSystemCurve } from './system-curve';
import { SYSTEM_INPUT_LIMITS, type SystemCurveInput } from './system-input';

/*
 * The suction side of a system: the segments from the intake water surface to the pump, and
 * NPSH available over flow from them. The pump's height is given as `pumpElevation`, the impeller
 * eye above the intake surface (positive for a suction lift, negative for a flooded suction),
 * because that is what a designer measures on site and its sign alone says whether the pump
 * must prime; the engine's surface elevation z_s is its negative.
 */

export interface SuctionSide {
  /** Absolute pressure on the intake surface, Pa: the standard atmosphere at the site. */
  surfacePressure: number;
  /** Water temperature, C. */
  temperature: number;
  /** Impeller eye above the intake surface, m (negative when flooded). */
  pumpElevation: number;
  /** The suction segments alone, with no static head: their loss head over flow. */
  losses: CompiledSystemCurve;
}

/**
 * The suction side of `input`, or null when no segment is marked suction (e.g. a submersible
 * pump in the intake). Suction segments must come first; a suction side needs siteElevation and
 * pumpElevation, and pumpElevation without a suction side is refused. Surface pressure by the
 * standard atmosphere (ISO 2533, npsh.ts); losses by the system's friction method and fittings
 * (system-curve.ts) over the suction segments.
 * @param input - the system in SI (segments with `side`, siteElevation m, pumpElevation m)
 * @returns the suction side, or null without one
 * @example
 * // 6 m of 3" Sch 40 PVC on the suction side, 1000 m site, pump 2 m above the water
 * const side = compileSuctionSide({ staticHead: 3, frictionMethod: 'hazen-williams', siteElevation: 1000, pumpElevation: 2, segments: [{ length: 6, pipeSizeId: 'pvc-sch40-3', side: 'suction' }, { length: 30, pipeSizeId: 'pvc-sch40-3' }] })
 * side?.surfacePressure // => 89875
 * side?.losses.evaluate(0) // => 0
 */
export function compileSuctionSide(input: SystemCurveInput): SuctionSide | null {
  const firstDischarge = input.segments.findIndex((segment) => segment.side !== 'suction');
  const suctionCount = firstDischarge === -1 ? input.segments.length : firstDischarge;
  const misplaced = input.segments.findIndex((segment, index) => index > suctionCount && segment.side === 'suction');
  if (misplaced !== -1) {
    throw new HydraulicsInputError({
      code: 'suction-after-discharge',
      params: { segment: misplaced },
      pointer: `/segments/${misplaced}/side`,
    });
  }
  if (suctionCount === 0) {
    if (input.pumpElevation !== undefined) {
      throw new HydraulicsInputError({ code: 'pump-elevation-without-suction', params: {}, pointer: '/pumpElevation' });
    }
    return null;
  }
  for (const what of ['siteElevation', 'pumpElevation'] as const) {
    if (input[what] === undefined) {
      throw new HydraulicsInputError({ code: 'suction-needs-site', params: { what }, pointer: `/${what}` });
    }
  }
  const siteElevation = requireInRange(input.siteElevation!, -500, 11000, '/siteElevation', 'site elevation (m)');
  const limit = SYSTEM_INPUT_LIMITS.maxAbsoluteHead;
  const pumpElevation = requireInRange(input.pumpElevation!, -limit, limit, '/pumpElevation', 'pump elevation (m)');
  const losses = compileSystemCurve({
    staticHead: 0,
    outletPressureHead: 0,
    segments: input.segments.slice(0, suctionCount),
    temperature: input.temperature,
    frictionMethod: input.frictionMethod,
  });
  return {
    surfacePressure: standardAtmosphericPressure(siteElevation),
    temperature: losses.temperature,
    pumpElevation,
    losses,
  };
}

/**
 * NPSH available at the pump at a total flow through the suction side, m, by npshAvailable
 * (ANSI/HI 9.6.1): NPSHa = (p_atm - p_v)/(rho g) - pumpElevation - h_loss,suction(Q).
 * @param side - the suction side (compileSuctionSide)
 * @param flow - total flow through the suction pipe, m3/s (>= 0)
 * @returns NPSH available, m
 * @example
 * // sea level, 20 C, pump 2 m above the water, no flow: by hand with the IAPWS values
 * // (101325 - 2339.2) / (998.206 x 9.80665) - 2 = 8.1119 m
 * const side = compileSuctionSide({ staticHead: 3, frictionMethod: 'hazen-williams', siteElevation: 0, pumpElevation: 2, segments: [{ length: 6, pipeSizeId: 'pvc-sch40-3', side: 'suction' }] })
 * npshAvailableAt(side, 0) // => 8.1119
 */
export function npshAvailableAt(side: SuctionSide, flow: number): number {
  return npshAvailable({
    surfacePressure: side.surfacePressure,
    temperature: side.temperature,
    surfaceElevation: -side.pumpElevation,
    suctionLosses: side.losses.evaluate(flow),
  });
}

export interface NpshAtDuty {
  /** m */
  available: number;
  /** NPSH3 at the flow per pump, m; null when the curve gives none at that flow. */
  required: number | null;
  /** Against the guidance; null when NPSH required is unknown. */
  margin: NpshMargin | null;
}

/**
 * NPSH at a duty: available at the total flow through the shared suction pipe, required (NPSH3,
 * the fitted curve, never extrapolated) at the flow per pump, and the margin by npshMargin
 * against `guidance` (ANSI/HI 9.6.1).
 * @param side - the suction side
 * @param fit - the pump's fitted curve
 * @param flow - total flow, m3/s
 * @param flowPerPump - flow of each running pump, m3/s
 * @param guidance - least ratio and difference (m)
 * @returns available and required (m) and the margin, or required null when unknown
 * @example
 * // no NPSH data on the curve: required unknown
 * const side = compileSuctionSide({ staticHead: 3, frictionMethod: 'hazen-williams', siteElevation: 0, pumpElevation: 2, segments: [{ length: 6, pipeSizeId: 'pvc-sch40-3', side: 'suction' }] })
 * npshAtDuty(side, fitPumpCurve([{ flow: 0, head: 10 }, { flow: 0.005, head: 8.75 }, { flow: 0.01, head: 5 }]), 0, 0, DEFAULT_NPSH_GUIDANCE).required // => null
 */
export function npshAtDuty(
  side: SuctionSide,
  fit: PumpCurveFit,
  flow: number,
  flowPerPump: number,
  guidance: NpshGuidance,
): NpshAtDuty {
  const available = npshAvailableAt(side, flow);
  const range = fit.npshRequired;
  const published = range !== null && flowPerPump >= range.flowMin && flowPerPump <= range.flowMax;
  const required = published ? pumpNpshRequiredAt(fit, flowPerPump) : null;
  return { available, required, margin: required === null ? null : npshMargin(available, required, guidance) };
}
