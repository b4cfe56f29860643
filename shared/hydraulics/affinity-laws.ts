import { engineIssueText } from '../messages/engine-issue-text';
import type { EngineIssue } from './engine-issues';
import { HydraulicsInputError, requireFinite, requirePositive } from './hydraulics-error';
import type { HeadCurve, NoOperatingPointReason } from './operating-point';
import { polynomialScaled, polynomialValue } from './polynomial';
import type { PumpCurveFit } from './pump-curve-fit';
import { findRootBracketed } from './root-finding';
import { flowFromSI, headFromSI } from './units';

/*
 * Similarity laws of rotodynamic pumps. Three different laws, kept apart:
 * - speed change of one pump (affinity laws): Q ~ N, H ~ N^2, P ~ N^3;
 * - impeller trim of one pump (small trims only): Q ~ D, H ~ D^2, P ~ D^3;
 * - geometric similarity between sizes of one design: Q ~ N D^3,
 *   H ~ N^2 D^2, P ~ N^3 D^5.
 * Source: F. M. White, Fluid Mechanics, 7th ed. (2011), section 11.4
 * (pump similarity rules C_Q = Q/(n D^3), C_H = gH/(n^2 D^2),
 * C_P = P/(rho n^3 D^5)); I. J. Karassik et al., Pump Handbook, 4th ed.
 * (2008), affinity laws and impeller trimming. Efficiency is taken as
 * unchanged between similar points, which holds for moderate changes.
 */

export interface PerformancePoint {
  /** m3/s */
  flow: number;
  /** m */
  head: number;
  /** W (optional) */
  power?: number;
}

function scalePoint(
  point: PerformancePoint,
  flowFactor: number,
  headFactor: number,
  powerFactor: number,
): PerformancePoint {
  requireFinite(point.flow, '/flow', 'flow');
  requireFinite(point.head, '/head', 'head');
  const scaled: PerformancePoint = { flow: point.flow * flowFactor, head: point.head * headFactor };
  if (point.power !== undefined) {
    scaled.power = requireFinite(point.power, '/power', 'power') * powerFactor;
  }
  return scaled;
}

/**
 * Same pump at another speed, N/N0 = speedRatio: Q r, H r^2, P r^3 (affinity laws; White, Fluid
 * Mechanics, 7th ed., section 11.4). Efficiency taken as unchanged: good for moderate speed changes.
 * @param point - flow m3/s, head m, optional power W at the rated speed
 * @param speedRatio - N / N0, dimensionless (> 0)
 * @returns the similar point at the new speed, same units
 * @example
 * // exact: half speed gives half the flow, a quarter of the head, an eighth of the power
 * scaleBySpeed({ flow: 0.01, head: 20, power: 3000 }, 0.5).flow // => 0.005
 * scaleBySpeed({ flow: 0.01, head: 20, power: 3000 }, 0.5).head // => 5
 * scaleBySpeed({ flow: 0.01, head: 20, power: 3000 }, 0.5).power // => 375
 */
export function scaleBySpeed(point: PerformancePoint, speedRatio: number): PerformancePoint {
  const r = requirePositive(speedRatio, '/speedRatio', 'speed ratio');
  return scalePoint(point, r, r * r, r * r * r);
}

/**
 * Same pump with its impeller trimmed to D/D0 = diameterRatio (<= 1):
 * Q d, H d^2, P d^3. An approximation for small trims (within about 10 %
 * is the usual guidance); larger trims change the impeller's geometry. Source: Karassik, Pump
 * Handbook, 4th ed. (2008), impeller trimming.
 * @param point - flow m3/s, head m, optional power W at the full diameter
 * @param diameterRatio - D / D0, dimensionless (0 < d <= 1; about 0.9-1 for the law to hold)
 * @returns the point with the trimmed impeller, same units
 * @example
 * // exact: a 90 % trim gives 0.9 Q, 0.81 H, 0.729 P
 * scaleByImpellerTrim({ flow: 0.01, head: 20, power: 3000 }, 0.9).head // => 16.2
 * scaleByImpellerTrim({ flow: 0.01, head: 20, power: 3000 }, 0.9).power // => 2187
 */
export function scaleByImpellerTrim(point: PerformancePoint, diameterRatio: number): PerformancePoint {
  const d = requirePositive(diameterRatio, '/diameterRatio', 'diameter ratio');
  if (d > 1) {
    throw new HydraulicsInputError({ code: 'trim-only', params: { ratio: d }, pointer: '/diameterRatio' });
  }
  return scalePoint(point, d, d * d, d * d * d);
}

/**
 * A geometrically similar pump of another size and speed: Q ~ N D^3,
 * H ~ N^2 D^2, P ~ N^3 D^5 (same fluid). Not for trims of one impeller. Source: White, Fluid
 * Mechanics, 7th ed., section 11.4 (C_Q, C_H, C_P held constant).
 * @param point - flow m3/s, head m, optional power W of the model pump
 * @param speedRatio - N / N0, dimensionless (> 0)
 * @param diameterRatio - D / D0, dimensionless (> 0)
 * @returns the similar point of the other pump, same units
 * @example
 * // exact: twice the size at the same speed gives 8 Q, 4 H, 32 P
 * scaleByGeometricSimilarity({ flow: 0.01, head: 20, power: 3000 }, 1, 2).flow // => 0.08
 * scaleByGeometricSimilarity({ flow: 0.01, head: 20, power: 3000 }, 1, 2).head // => 80
 * scaleByGeometricSimilarity({ flow: 0.01, head: 20, power: 3000 }, 1, 2).power // => 96000
 */
export function scaleByGeometricSimilarity(
  point: PerformancePoint,
  speedRatio: number,
  diameterRatio: number,
): PerformancePoint {
  const n = requirePositive(speedRatio, '/speedRatio', 'speed ratio');
  const d = requirePositive(diameterRatio, '/diameterRatio', 'diameter ratio');
  return scalePoint(point, n * d ** 3, n * n * d * d, n ** 3 * d ** 5);
}

/**
 * A fitted curve moved to speed ratio r by the affinity laws: H'(Q) =
 * r^2 H(Q/r), P'(Q) = r^3 P(Q/r), eta'(Q) = eta(Q/r), NPSH required scaled as
 * r^2 (a common approximation); flow range, BEP and allowable region move
 * with it. The result is again a plain PumpCurveFit. Source as scaleBySpeed (White, Fluid
 * Mechanics, 7th ed., section 11.4); valid for moderate speed changes.
 * @param fit - a fitted curve (fitPumpCurve) at its rated speed
 * @param speedRatio - N / N0, dimensionless (> 0)
 * @returns the fit at the new speed, SI coefficients
 * @example
 * // invented curve with its BEP at 7.5 L/s, 7.1875 m (see fitPumpCurve); exact at half speed:
 * // shut-off 10 m x 0.25, BEP flow x 0.5, BEP head x 0.25, and H(2.5 L/s) = 0.25 H(5 L/s) = 0.25 x 8.75
 * const fit = fitPumpCurve([{ flow: 0, head: 10, efficiency: 0 }, { flow: 0.0025, head: 9.6875, efficiency: 0.4 }, { flow: 0.005, head: 8.75, efficiency: 0.64 }, { flow: 0.0075, head: 7.1875, efficiency: 0.72 }, { flow: 0.01, head: 5, efficiency: 0.64 }])
 * const half = pumpCurveAtSpeed(fit, 0.5)
 * half.shutOffHead // => 2.50000
 * half.bep.flow // => 0.00375000
 * half.bep.head // => 1.796875
 * pumpHeadAt(half, 0.0025) // => 2.18750
 */
export function pumpCurveAtSpeed(fit: PumpCurveFit, speedRatio: number): PumpCurveFit {
  const r = requirePositive(speedRatio, '/speedRatio', 'speed ratio');
  const scaleRange = <T extends { flowMin: number; flowMax: number }>(range: T): T => ({
    ...range,
    flowMin: range.flowMin * r,
    flowMax: range.flowMax * r,
  });
  return {
    ...fit,
    headCoefficients: polynomialScaled(fit.headCoefficients, r * r, r),
    flowMin: fit.flowMin * r,
    flowMax: fit.flowMax * r,
    shutOffHead: fit.shutOffHead * r * r,
    efficiencyCoefficients: fit.efficiencyCoefficients && polynomialScaled(fit.efficiencyCoefficients, 1, r),
    powerCoefficients: fit.powerCoefficients && polynomialScaled(fit.powerCoefficients, r ** 3, r),
    npshRequired: fit.npshRequired && {
      ...scaleRange(fit.npshRequired),
      coefficients: polynomialScaled(fit.npshRequired.coefficients, r * r, r),
    },
    bep: fit.bep && { flow: fit.bep.flow * r, head: fit.bep.head * r * r, efficiency: fit.bep.efficiency },
    allowableRegion: fit.allowableRegion && scaleRange(fit.allowableRegion),
    statistics: {
      ...fit.statistics,
      rmsHead: fit.statistics.rmsHead * r * r,
      worstResidual: fit.statistics.worstResidual * r * r,
      worstResidualFlow: fit.statistics.worstResidualFlow * r,
    },
    warnings: [...fit.warnings, engineIssueText({ code: 'affinity-scaled', params: { speedRatio: r } })],
  };
}

export type SpeedRatioResult =
  | {
      ok: true;
      /** N/N0 that puts the curve through the duty point. */
      speedRatio: number;
      /** The full-speed point that maps onto the duty point, m3/s and m. */
      fullSpeedFlow: number;
      fullSpeedHead: number;
      /** True when the duty point needs more than the curve's rated speed. */
      aboveRatedSpeed: boolean;
    }
  | { ok: false; reason: NoOperatingPointReason; issue: EngineIssue };

/**
 * Speed ratio r = N/N0 at which the pump's curve passes through the duty
 * point (Qd, Hd). Points that map onto each other by the affinity laws lie on
 * a parabola through the origin, H = Hd (Q/Qd)^2; where it meets the
 * full-speed curve, at Q', r = Qd/Q'. Exact for any system: the scaled curve
 * passes through (Qd, Hd) whatever the system's static head.
 * Solved by a bracketed root finder on [flowMin, flowMax]; the parabola
 * meeting the curve outside that range gives 'before-curve' or 'beyond-curve'.
 * Source: the affinity laws (White, Fluid Mechanics, 7th ed., section 11.4; Karassik, Pump
 * Handbook, 4th ed.); valid for moderate speed changes, as scaleBySpeed.
 * @param pump - head coefficients (m, ascending powers of m3/s) and the published flow range, m3/s
 * @param dutyFlow - flow wanted, m3/s (> 0)
 * @param dutyHead - head wanted, m (> 0)
 * @returns the speed ratio and the full-speed point that maps onto the duty point, or why there is none
 * @example
 * // pump H = 10 - 125000 Q^2, duty 4 L/s at 4 m: by hand the parabola 250000 Q^2 meets the curve
 * // at Q' = sqrt(10 / 375000) = 5.16398 L/s, so r = 0.004 / Q' = sqrt(0.6) = 0.774597
 * const pump = { headCoefficients: [10, 0, -125000], flowMin: 0, flowMax: 0.008 }
 * speedRatioForDutyPoint(pump, 0.004, 4).speedRatio // => 0.774597
 * speedRatioForDutyPoint(pump, 0.004, 4).fullSpeedFlow // => 0.00516398
 */
export function speedRatioForDutyPoint(pump: HeadCurve, dutyFlow: number, dutyHead: number): SpeedRatioResult {
  requirePositive(dutyFlow, '/dutyFlow', 'duty flow');
  requirePositive(dutyHead, '/dutyHead', 'duty head');
  const parabola = dutyHead / (dutyFlow * dutyFlow);
  const gap = (flow: number) => polynomialValue(pump.headCoefficients, flow) - parabola * flow * flow;
  if (gap(pump.flowMin) < 0) {
    return { ok: false, reason: 'before-curve', issue: { code: 'duty-before-curve', params: {} } };
  }
  if (gap(pump.flowMax) > 0) {
    return { ok: false, reason: 'beyond-curve', issue: { code: 'duty-beyond-curve', params: {} } };
  }
  const fullSpeedFlow = findRootBracketed(gap, pump.flowMin, pump.flowMax);
  const speedRatio = dutyFlow / fullSpeedFlow;
  return {
    ok: true,
    speedRatio,
    fullSpeedFlow,
    fullSpeedHead: polynomialValue(pump.headCoefficients, fullSpeedFlow),
    aboveRatedSpeed: speedRatio > 1,
  };
}

/**
 * Specific speed in metric form, n_q = N sqrt(Q) / H^0.75 (N rpm, Q m3/s,
 * H m), at the best efficiency point, per stage and per impeller eye.
 * Source: ANSI/HI 1.1-1.2 (nomenclature: specific speed); Karassik, Pump Handbook.
 * Valid for any rotodynamic pump; n_q runs from about 10 (radial) to a few hundred (axial), quoted from memory.
 * @param speedRpm - rotational speed, rpm (> 0)
 * @param flow - flow at BEP per impeller eye, m3/s (> 0)
 * @param head - head at BEP per stage, m (> 0)
 * @returns specific speed n_q, in (rpm, m3/s, m) units
 * @example
 * // by hand: 1750 x sqrt(0.0315451) / 30.48^0.75 for 500 gpm at 100 ft
 * specificSpeedMetric(1750, flowToSI(500, 'gpm'), headToSI(100, 'ft')) // => 23.960
 */
export function specificSpeedMetric(speedRpm: number, flow: number, head: number): number {
  requirePositive(speedRpm, '/speed', 'speed');
  requirePositive(flow, '/flow', 'flow');
  requirePositive(head, '/head', 'head');
  return (speedRpm * Math.sqrt(flow)) / Math.pow(head, 0.75);
}

/**
 * Specific speed in US units, N_s = N sqrt(Q) / H^0.75 (N rpm, Q gpm, H ft),
 * from SI inputs (m3/s, m). N_s = 51.65 n_q. Source as specificSpeedMetric.
 * @param speedRpm - rotational speed, rpm (> 0)
 * @param flow - flow at BEP per impeller eye, m3/s (> 0)
 * @param head - head at BEP per stage, m (> 0)
 * @returns specific speed N_s, in (rpm, gpm, ft) units
 * @example
 * // by hand: 1750 x sqrt(500) / 100^0.75 = 1237.4; and N_s / n_q is the handbook's 51.65
 * specificSpeedUS(1750, flowToSI(500, 'gpm'), headToSI(100, 'ft')) // => 1237.4
 * specificSpeedUS(1750, 0.01, 10) / specificSpeedMetric(1750, 0.01, 10) // => 51.65
 */
export function specificSpeedUS(speedRpm: number, flow: number, head: number): number {
  specificSpeedMetric(speedRpm, flow, head);
  return (speedRpm * Math.sqrt(flowFromSI(flow, 'gpm'))) / Math.pow(headFromSI(head, 'ft'), 0.75);
}

/**
 * Specific speed of a fitted curve at its BEP, metric n_q and US N_s, for a
 * pump running at `speedRpm`; null when the fit has no BEP (see
 * PumpCurveFit.bepUnknownReason). Source as specificSpeedMetric (ANSI/HI 1.1-1.2).
 * @param fit - a fit's BEP (flow m3/s, head m), or null
 * @param speedRpm - rotational speed, rpm (> 0)
 * @returns n_q (rpm, m3/s, m) and N_s (rpm, gpm, ft), or null
 * @example
 * // a BEP of 7.5 L/s at 7.1875 m at 2900 rpm; by hand 2900 x sqrt(0.0075) / 7.1875^0.75
 * specificSpeedAtBep({ bep: { flow: 0.0075, head: 7.1875, efficiency: 0.72 } }, 2900).metric // => 57.213
 * specificSpeedAtBep({ bep: null }, 2900) // => null
 */
export function specificSpeedAtBep(
  fit: Pick<PumpCurveFit, 'bep'>,
  speedRpm: number,
): { metric: number; us: number } | null {
  if (!fit.bep) {
    return null;
  }
  return {
    metric: specificSpeedMetric(speedRpm, fit.bep.flow, fit.bep.head),
    us: specificSpeedUS(speedRpm, fit.bep.flow, fit.bep.head),
  };
}
