import { engineIssueText } from '../messages/engine-issue-text';
import type { EngineIssue } from './engine-issues';
import { HydraulicsInputError, requireNonNegative, requirePositive } from './hydraulics-error';
import { leastSquaresPolynomial } from './least-squares';
import { STANDARD_GRAVITY } from './physical-constants';
import { maximumOver, polynomialShifted, polynomialValue, totalRiseOver } from './polynomial';
import { droopPeakIndex, flowOrdered, isTwoPointSheet, validatePumpCurvePoints } from './pump-curve-points';
import { waterDensity } from './water-properties';

/*
 * Fitting a pump's published curve (head, and optionally power, efficiency
 * and NPSH required, at a few flows) to polynomials in flow, and evaluating
 * the stored fit. All values SI: flow m3/s, head m, power W, efficiency 0-1.
 */

/** One point of a published pump curve. */
export interface PumpCurvePoint {
  /** m3/s, >= 0, strictly increasing along the curve */
  flow: number;
  /** m, > 0 (0 on the last point only: the open-flow point), non-increasing after its peak */
  head: number;
  /** Input power at this flow, W (shaft or electrical, see powerBasis). */
  power?: number;
  /** Efficiency at this flow, 0-1 (pump, or wire-to-water with powerBasis 'electrical'). */
  efficiency?: number;
  /** NPSH required (NPSH3), m. */
  npshRequired?: number;
}

export type PowerBasis = 'shaft' | 'electrical';

/** Where the head curve comes from: published points, or the fallback shape through shut-off and open flow. */
export type CurveBasis = 'published' | 'estimated-from-two-points';

export interface PumpCurveFitOptions {
  /** What the supplier's power means: pump shaft power (default) or electrical input (wire-to-water). */
  powerBasis?: PowerBasis;
  /** The allowable operating region, when the supplier states one, m3/s. */
  allowableRegion?: { flowMin: number; flowMax: number };
}

/** A polynomial with the flow range it was fitted over. */
export interface FittedRange {
  /** Ascending powers of flow (m3/s). */
  coefficients: number[];
  flowMin: number;
  flowMax: number;
}

/** A fitted pump curve, SI coefficients in ascending powers of flow (m3/s): plain JSON, reloaded without refitting. */
export interface PumpCurveFit {
  schemaVersion: 1;
  /** Degree of the head polynomial. */
  degree: 2 | 3;
  /** Head, m. */
  headCoefficients: number[];
  /** Published points fitted, or a two-point sheet's estimated shape (no efficiency or BEP from it). */
  curveBasis: CurveBasis;
  /** Valid flow range, m3/s: from the first published point (the peak of a drooping curve) to the last. */
  flowMin: number;
  flowMax: number;
  /** Head at zero flow, m (extrapolated, with a warning, when the first point is not at zero flow). */
  shutOffHead: number;
  /** Efficiency 0-1, through the origin (first coefficient 0); null without efficiency or power data. */
  efficiencyCoefficients: number[] | null;
  /** Input power, W; null without power data. */
  powerCoefficients: number[] | null;
  /** Meaning of power and efficiency: shaft (pump) or electrical (wire-to-water); null without either. */
  powerBasis: PowerBasis | null;
  npshRequired: FittedRange | null;
  /** Best efficiency point; null when it cannot be located (see bepUnknownReason). */
  bep: { flow: number; head: number; efficiency: number } | null;
  bepUnknownReason: string | null;
  allowableRegion: { flowMin: number; flowMax: number } | null;
  statistics: {
    /** Root-mean-square head residual, m. */
    rmsHead: number;
    /** Signed residual (published - fitted) of largest magnitude, m. */
    worstResidual: number;
    /** Flow of that point, m3/s. */
    worstResidualFlow: number;
    pointCount: number;
  };
  warnings: string[];
}

/** Density at which suppliers' power figures are converted to efficiency: water at 20 C (IAPWS-IF97, see waterDensity). */
const TEST_WATER_DENSITY = waterDensity(20);

/** Rise (fraction of the highest head) below which a fitted curve counts as non-increasing: round-off only. */
const HEAD_RISE_TOLERANCE = 1e-9;

/**
 * Degree rule: a cubic for five or more points spread over at least half of the flow range (last -
 * first >= 0.5 last), else a quadratic: fewer or clustered points let a cubic wander between them.
 */
function preferredDegree(flows: readonly number[]): 2 | 3 {
  const first = flows[0];
  const last = flows[flows.length - 1];
  return flows.length >= 5 && last - first >= 0.5 * last ? 3 : 2;
}

function powersUpTo(degree: number, from: number): number[] {
  return Array.from({ length: degree - from + 1 }, (_, index) => from + index);
}

interface HeadCandidate {
  degree: 2 | 3;
  /** Powers of x = Q - origin used by the fit; leaving out power 1 holds the slope at zero there. */
  powers: number[];
  origin: 'first' | 'last';
}

function candidate(degree: 2 | 3, powers: number[], origin: 'first' | 'last'): HeadCandidate {
  return { degree, powers, origin };
}

/**
 * Head fit that does not rise over the data (constrained, not merely flagged): the unconstrained
 * fit of the preferred degree when it does not rise; else, with a warning saying which, the
 * least-RMS non-rising one of a cubic held flat (zero slope) at the first or last point, a
 * quadratic, a quadratic held flat at the first or last point (x = Q - Q_origin, no x term: it
 * cannot rise when its x^2 coefficient has the right sign); none -> HydraulicsInputError.
 */
function fitNonIncreasingHead(
  flows: readonly number[],
  heads: readonly number[],
): { degree: 2 | 3; headCoefficients: number[]; note: EngineIssue | null } {
  const first = flows[0];
  const last = flows[flows.length - 1];
  const tolerance = HEAD_RISE_TOLERANCE * Math.max(...heads);
  const fit = (option: HeadCandidate) => {
    const origin = option.origin === 'first' ? first : last;
    const headCoefficients = polynomialShifted(
      leastSquaresPolynomial(
        flows.map((flow) => flow - origin),
        heads,
        option.powers,
      ),
      origin,
    );
    const rises = totalRiseOver(headCoefficients, first, last) > tolerance;
    const squares = flows.reduce(
      (sum, flow, index) => sum + (heads[index] - polynomialValue(headCoefficients, flow)) ** 2,
      0,
    );
    return { option, headCoefficients, rises, squares };
  };

  const preferred = preferredDegree(flows);
  const unconstrained = fit(candidate(preferred, preferred === 3 ? [0, 1, 2, 3] : [0, 1, 2], 'first'));
  if (!unconstrained.rises) {
    return { degree: preferred, headCoefficients: unconstrained.headCoefficients, note: null };
  }
  const alternatives: HeadCandidate[] = [
    ...(preferred === 3
      ? [candidate(3, [0, 2, 3], 'first'), candidate(3, [0, 2, 3], 'last'), candidate(2, [0, 1, 2], 'first')]
      : []),
    candidate(2, [0, 2], 'first'),
    candidate(2, [0, 2], 'last'),
  ];
  const best = alternatives
    .map(fit)
    .filter((result) => !result.rises)
    .sort((a, b) => a.squares - b.squares)[0];
  if (!best) {
    throw new HydraulicsInputError({ code: 'no-falling-fit', params: {}, pointer: '/points' });
  }
  return {
    degree: best.option.degree,
    headCoefficients: best.headCoefficients,
    note: {
      code: 'head-fit-constrained',
      params: {
        leastSquaresDegree: preferred,
        degree: best.option.degree,
        heldFlatAt: best.option.powers.includes(1) ? null : best.option.origin,
      },
    },
  };
}

function pointEfficiencies(points: readonly PumpCurvePoint[]): number[] | null {
  if (points[0].efficiency !== undefined) {
    return points.map((point) => point.efficiency as number);
  }
  if (points[0].power !== undefined) {
    return points.map((point, index) => {
      const power = point.power as number;
      if (power === 0) {
        throw new HydraulicsInputError({ code: 'power-not-positive', params: {}, pointer: `/points/${index}/power` });
      }
      const efficiency = (TEST_WATER_DENSITY * STANDARD_GRAVITY * point.flow * point.head) / power;
      if (efficiency > 1) {
        throw new HydraulicsInputError({
          code: 'power-below-water-power',
          params: { power, waterPower: efficiency * power },
          pointer: `/points/${index}/power`,
        });
      }
      return efficiency;
    });
  }
  return null;
}

/**
 * Head through a two-point sheet's shut-off head H0 and open flow Qmax: H = H0 (1 - (Q/Qmax)^2),
 * the parabola of a small centrifugal pump with zero slope at shut-off. Our own assumption (common
 * practice for a curve known only at its ends), not a published shape; such fits are marked
 * 'estimated-from-two-points'.
 */
function estimatedTwoPointHead(shutOffHead: number, openFlow: number): number[] {
  return [shutOffHead, 0, -shutOffHead / (openFlow * openFlow)];
}

function locateBep(
  efficiencyCoefficients: number[] | null,
  headCoefficients: number[],
  flowMin: number,
  flowMax: number,
): Pick<PumpCurveFit, 'bep' | 'bepUnknownReason'> {
  if (!efficiencyCoefficients) {
    return { bep: null, bepUnknownReason: 'the curve has no efficiency or power data' };
  }
  const best = maximumOver(efficiencyCoefficients, flowMin, flowMax);
  const span = flowMax - flowMin;
  if (best.x >= flowMax - 1e-9 * span) {
    return {
      bep: null,
      bepUnknownReason: 'efficiency still rises at the last curve point: the BEP lies beyond the published data',
    };
  }
  if (best.x <= flowMin + 1e-9 * span && flowMin > 0) {
    return {
      bep: null,
      bepUnknownReason: 'efficiency falls from the first curve point: the BEP lies before the published data',
    };
  }
  return {
    bep: { flow: best.x, head: polynomialValue(headCoefficients, best.x), efficiency: best.value },
    bepUnknownReason: null,
  };
}

/**
 * Fits a pump curve to published points by least squares (QR; Golub & Van Loan, Matrix Computations, 4th ed.,
 * section 5.3): head of degree 2 or 3 that does not rise (preferredDegree and fitNonIncreasingHead, our own
 * rules); efficiency through the origin, from the points' efficiency or eta = rho g Q H / P (ANSI/HI 1.6 /
 * 14.6, water at 20 C); power of the head's degree; NPSH3 quadratic (3 or more points); BEP at the efficiency
 * maximum inside the data, else null with a reason. Points in falling flow order are reversed, a drooping
 * curve is fitted from its peak on, a two-point sheet takes estimatedTwoPointHead (each with an issue).
 * Throws HydraulicsInputError for the points validatePumpCurvePoints refuses.
 * @param points - published points: flow m3/s, head m, optional power W, efficiency 0-1, NPSH3 m
 * @param options - what the power means (shaft or electrical) and the supplier's allowable region, m3/s
 * @returns the fit (SI coefficients, BEP, statistics, warnings) as plain JSON, valid only on [flowMin, flowMax]
 * @example
 * // invented points on H = 10 - 50000 Q^2, eta = 192 Q - 12800 Q^2: BEP by hand 7.5 L/s, 0.72, 7.1875 m
 * const fit = fitPumpCurve([{ flow: 0, head: 10, efficiency: 0 }, { flow: 0.0025, head: 9.6875, efficiency: 0.4 }, { flow: 0.005, head: 8.75, efficiency: 0.64 }, { flow: 0.0075, head: 7.1875, efficiency: 0.72 }, { flow: 0.01, head: 5, efficiency: 0.64 }])
 * fit.bep.flow // => 0.00750000
 * fit.bep.efficiency // => 0.720000
 */
export function fitPumpCurve(points: readonly PumpCurvePoint[], options: PumpCurveFitOptions = {}): PumpCurveFit {
  return fitPumpCurveWithIssues(points, options).fit;
}

/**
 * fitPumpCurve, with what the fit has to say as engine issues (codes with SI values); the fit's
 * `warnings` are their sentences, made once here because fits are stored and these carry no
 * values that depend on a reader's units.
 * @param points - published points: flow m3/s, head m, optional power W, efficiency 0-1, NPSH3 m
 * @param options - what the power means (shaft or electrical) and the supplier's allowable region, m3/s
 * @returns the fit, as fitPumpCurve gives it, and its issues
 * @example
 * // invented points on H = 10 - 50000 Q^2 from 2.5 L/s: the shut-off head is extrapolated
 * const { fit, issues } = fitPumpCurveWithIssues([{ flow: 0.0025, head: 9.6875 }, { flow: 0.005, head: 8.75 }, { flow: 0.0075, head: 7.1875 }, { flow: 0.01, head: 5 }])
 * issues[0].code // => 'shut-off-extrapolated'
 * fit.warnings[0] // => 'shut-off head is extrapolated: the first point is not at zero flow'
 */
export function fitPumpCurveWithIssues(
  points: readonly PumpCurvePoint[],
  options: PumpCurveFitOptions = {},
): { fit: PumpCurveFit; issues: EngineIssue[] } {
  validatePumpCurvePoints(points);
  const issues: EngineIssue[] = [];
  const ordered = flowOrdered(points);
  if (ordered.reversed) issues.push({ code: 'points-reversed', params: {} });
  const peak = droopPeakIndex(ordered.points);
  if (peak > 0) {
    issues.push({
      code: 'drooping-curve',
      params: { peakFlow: ordered.points[peak].flow, peakHead: ordered.points[peak].head },
    });
  }
  return fitOrderedPoints(ordered.points.slice(peak), options, issues);
}

/** The fit of points checked, in increasing flow order, from the peak on. */
function fitOrderedPoints(
  points: readonly PumpCurvePoint[],
  options: PumpCurveFitOptions,
  issues: EngineIssue[],
): { fit: PumpCurveFit; issues: EngineIssue[] } {
  const drooping = issues.some((issue) => issue.code === 'drooping-curve');
  const flows = points.map((point) => point.flow);
  const heads = points.map((point) => point.head);
  const flowMin = flows[0];
  const flowMax = flows[flows.length - 1];
  const twoPoint = isTwoPointSheet(points);

  const { degree, headCoefficients, note } = twoPoint
    ? { degree: 2 as const, headCoefficients: estimatedTwoPointHead(heads[0], flowMax), note: null }
    : fitNonIncreasingHead(flows, heads);
  if (twoPoint) issues.push({ code: 'curve-estimated-from-two-points', params: {} });
  if (note) {
    issues.push(note);
  }
  const shutOffHead = headCoefficients[0];
  if (flowMin > 0 && !drooping) {
    issues.push({ code: 'shut-off-extrapolated', params: { flowMin } });
  }

  const residuals = points.map((point) => point.head - polynomialValue(headCoefficients, point.flow));
  let worstIndex = 0;
  residuals.forEach((residual, index) => {
    if (Math.abs(residual) > Math.abs(residuals[worstIndex])) {
      worstIndex = index;
    }
  });
  const statistics = {
    rmsHead: Math.sqrt(residuals.reduce((sum, residual) => sum + residual * residual, 0) / residuals.length),
    worstResidual: residuals[worstIndex],
    worstResidualFlow: flows[worstIndex],
    pointCount: points.length,
  };

  // Two points say nothing of efficiency between shut-off and open flow, where it is zero.
  const efficiencies = twoPoint ? null : pointEfficiencies(points);
  const efficiencyCoefficients = efficiencies
    ? leastSquaresPolynomial(flows, efficiencies, powersUpTo(degree, 1))
    : null;
  const powerCoefficients =
    points[0].power !== undefined
      ? leastSquaresPolynomial(
          flows,
          points.map((point) => point.power as number),
          powersUpTo(twoPoint ? 1 : degree, 0),
        )
      : null;
  const npshPoints = points.filter((point) => point.npshRequired !== undefined);
  const npshRequired: FittedRange | null =
    npshPoints.length >= 3
      ? {
          coefficients: leastSquaresPolynomial(
            npshPoints.map((point) => point.flow),
            npshPoints.map((point) => point.npshRequired as number),
            [0, 1, 2],
          ),
          flowMin: npshPoints[0].flow,
          flowMax: npshPoints[npshPoints.length - 1].flow,
        }
      : null;

  let allowableRegion: PumpCurveFit['allowableRegion'] = null;
  if (options.allowableRegion) {
    const { flowMin: aorMin, flowMax: aorMax } = options.allowableRegion;
    requireNonNegative(aorMin, '/allowableRegion/flowMin', 'allowable region minimum flow');
    requirePositive(aorMax, '/allowableRegion/flowMax', 'allowable region maximum flow');
    if (!(aorMax > aorMin)) {
      throw new HydraulicsInputError({
        code: 'allowable-region-reversed',
        params: {},
        pointer: '/allowableRegion/flowMax',
      });
    }
    allowableRegion = { flowMin: aorMin, flowMax: aorMax };
  }

  const fit: PumpCurveFit = {
    schemaVersion: 1,
    degree,
    headCoefficients,
    curveBasis: twoPoint ? 'estimated-from-two-points' : 'published',
    flowMin,
    flowMax,
    shutOffHead,
    efficiencyCoefficients,
    powerCoefficients,
    powerBasis: efficiencies || powerCoefficients ? (options.powerBasis ?? 'shaft') : null,
    npshRequired,
    ...locateBep(efficiencyCoefficients, headCoefficients, flowMin, flowMax),
    allowableRegion,
    statistics,
    warnings: issues.map((issue) => engineIssueText(issue)),
  };
  return { fit, issues };
}
