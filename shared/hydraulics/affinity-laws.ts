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

/** Same pump at another speed, N/N0 = speedRatio: Q r, H r^2, P r^3 (affinity laws). */
export function scaleBySpeed(point: PerformancePoint, speedRatio: number): PerformancePoint {
  const r = requirePositive(speedRatio, '/speedRatio', 'speed ratio');
  return scalePoint(point, r, r * r, r * r * r);
}

/**
 * Same pump with its impeller trimmed to D/D0 = diameterRatio (<= 1):
 * Q d, H d^2, P d^3. An approximation for small trims (within about 10 %
 * is the usual guidance); larger trims change the impeller's geometry.
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
 * H ~ N^2 D^2, P ~ N^3 D^5 (same fluid). Not for trims of one impeller.
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
 * with it. The result is again a plain PumpCurveFit.
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
 */
export function specificSpeedUS(speedRpm: number, flow: number, head: number): number {
  specificSpeedMetric(speedRpm, flow, head);
  return (speedRpm * Math.sqrt(flowFromSI(flow, 'gpm'))) / Math.pow(headFromSI(head, 'ft'), 0.75);
}

/**
 * Specific speed of a fitted curve at its BEP, metric n_q and US N_s, for a
 * pump running at `speedRpm`; null when the fit has no BEP (see
 * PumpCurveFit.bepUnknownReason).
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
