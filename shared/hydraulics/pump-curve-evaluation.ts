import { HydraulicsInputError, requireFinite } from './hydraulics-error';
import { polynomialValue } from './polynomial';
import type { PumpCurveFit } from './pump-curve-fit';

/*
 * Reading a stored pump-curve fit at a flow: head, efficiency and NPSH required, only inside the
 * published flows (a fitted curve is never extrapolated).
 */

/**
 * Throws unless `flow` is in [flowMin, flowMax] (slack 1e-12 flowMax): fits never extrapolate (our rule).
 * @param range - the published flow range, m3/s
 * @param flow - volumetric flow, m3/s
 * @param field - JSON pointer named when the flow is rejected
 * @returns the flow, unchanged, m3/s
 * @example
 * requireFlowInRange({ flowMin: 0, flowMax: 0.01 }, 0.004) // => 0.004
 */
export function requireFlowInRange(range: { flowMin: number; flowMax: number }, flow: number, field = '/flow'): number {
  requireFinite(flow, field, 'flow');
  const slack = 1e-12 * range.flowMax;
  if (flow < range.flowMin - slack || flow > range.flowMax + slack) {
    throw new HydraulicsInputError({
      code: 'flow-outside-curve',
      params: { flow, flowMin: range.flowMin, flowMax: range.flowMax },
      pointer: field,
    });
  }
  return flow;
}

/**
 * Pump head at `flow` from the fitted polynomial; outside the curve's range -> HydraulicsInputError.
 * @param fit - a fitted curve (fitPumpCurve)
 * @param flow - volumetric flow, m3/s, within [fit.flowMin, fit.flowMax]
 * @returns head, m
 * @example
 * // invented points on H = 10 - 50000 Q^2: 9.2 m at 4 L/s by hand
 * pumpHeadAt(fitPumpCurve([{ flow: 0, head: 10 }, { flow: 0.005, head: 8.75 }, { flow: 0.01, head: 5 }]), 0.004) // => 9.20000
 */
export function pumpHeadAt(fit: PumpCurveFit, flow: number): number {
  return polynomialValue(fit.headCoefficients, requireFlowInRange(fit, flow));
}

/**
 * Fitted efficiency at `flow`, or null when the curve has none; outside the range -> HydraulicsInputError.
 * @param fit - a fitted curve (fitPumpCurve)
 * @param flow - volumetric flow, m3/s, within [fit.flowMin, fit.flowMax]
 * @returns efficiency, 0-1 (pump, or wire-to-water for an electrical power basis), or null
 * @example
 * // invented points on eta = 192 Q - 12800 Q^2: 0.5632 at 4 L/s by hand
 * pumpEfficiencyAt(fitPumpCurve([{ flow: 0, head: 10, efficiency: 0 }, { flow: 0.005, head: 8.75, efficiency: 0.64 }, { flow: 0.01, head: 5, efficiency: 0.64 }]), 0.004) // => 0.563200
 */
export function pumpEfficiencyAt(fit: PumpCurveFit, flow: number): number | null {
  requireFlowInRange(fit, flow);
  return fit.efficiencyCoefficients ? polynomialValue(fit.efficiencyCoefficients, flow) : null;
}

/**
 * Fitted NPSH required (NPSH3) at `flow`, or null when not given; outside its range -> HydraulicsInputError.
 * @param fit - a fitted curve (fitPumpCurve)
 * @param flow - volumetric flow, m3/s, within fit.npshRequired's range
 * @returns NPSH required, m, or null
 * @example
 * // invented points on NPSH3 = 1 + 15000 Q^2: 1.24 m at 4 L/s by hand
 * pumpNpshRequiredAt(fitPumpCurve([{ flow: 0, head: 10, npshRequired: 1 }, { flow: 0.005, head: 8.75, npshRequired: 1.375 }, { flow: 0.01, head: 5, npshRequired: 2.5 }]), 0.004) // => 1.24000
 */
export function pumpNpshRequiredAt(fit: PumpCurveFit, flow: number): number | null {
  if (!fit.npshRequired) {
    return null;
  }
  return polynomialValue(fit.npshRequired.coefficients, requireFlowInRange(fit.npshRequired, flow));
}
