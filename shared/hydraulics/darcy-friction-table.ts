import { CubicHermiteTable } from './cubic-hermite-table';
import {
  LAMINAR_REYNOLDS_LIMIT,
  LAMINAR_STEP_START,
  frictionFactorColebrook,
  laminarStepFrictionFactor,
} from './friction';
import { STANDARD_GRAVITY } from './physical-constants';
import type { ResolvedSegment } from './system-input';

/*
 * Darcy-Weisbach friction is precomputed per segment as a table of the
 * Colebrook factor f over u = ln(Re) from Re = 2300 to 1e8 (the transition
 * band takes the turbulent value, friction.ts), with the exact derivative
 * df/du at each node, evaluated by cubic Hermite interpolation. Accuracy:
 * relative error of the friction head below 1e-8 against the exact Colebrook
 * solution over that range (the tests check it). Below Re 2300 the laminar
 * rule and the ramp up to the turbulent value (friction.ts) are evaluated
 * exactly; above 1e8 Colebrook is solved directly.
 */
const TABLE_LOG_RE_MIN = Math.log(LAMINAR_REYNOLDS_LIMIT);
const TABLE_REYNOLDS_MAX = 1e8;
const TABLE_LOG_RE_MAX = Math.log(TABLE_REYNOLDS_MAX);
const TABLE_INTERVALS = 160;

/** Colebrook f and df/d(ln Re) from the implicit derivative of x = 1/sqrt(f). */
function colebrookWithLogSlope(reynolds: number, relativeRoughness: number, out: Float64Array): void {
  const f = frictionFactorColebrook(reynolds, relativeRoughness);
  const x = 1 / Math.sqrt(f);
  const viscous = 2.51 / reynolds;
  const inner = relativeRoughness / 3.7 + viscous * x;
  const c = 2 / Math.LN10;
  const dxdu = (c * viscous * x) / inner / (1 + (c * viscous) / inner);
  out[0] = f;
  out[1] = -2 * f * (dxdu / x);
}

/** One segment's Darcy-Weisbach friction, ready for fast evaluation. */
export interface DarcySegmentTable {
  /** friction head = coefficient * f * Q^2 */
  coefficient: number;
  /** Re = reynoldsPerFlow * Q */
  reynoldsPerFlow: number;
  relativeRoughness: number;
  /** Colebrook f at Re 2300, the top of the ramp from laminar friction. */
  turbulentAt2300: number;
  /** Colebrook f over ln(Re) from Re 2300 to 1e8. */
  colebrook: CubicHermiteTable;
}

/**
 * Tabulates one resolved segment's friction at the water's kinematic viscosity: Colebrook f over
 * ln Re, 2300 to 1e8, 160 intervals of a cubic Hermite table with the exact slope df/d(ln Re)
 * from the implicit derivative of Colebrook's equation (Colebrook 1939, J. ICE 11(4); de Boor, A
 * Practical Guide to Splines, rev. ed., ch. IV for the error bound).
 * @param segment - a resolved segment (resolveSegment): length and bore (m), area (m2), roughness (m)
 * @param kinematicViscosity - kinematic viscosity of the water, m2/s
 * @returns the segment's table: friction head = coefficient x f x Q^2
 * @example
 * // 100 m of 3" Sch 40 steel, eps 0.045 mm, 20 C water: f at Re 162835 as python3-fluids Colebrook, 0.0195645
 * const segment = resolveSegment({ length: 100, insideDiameter: 0.0779272, roughness: 4.5e-5 }, 0, 'darcy-weisbach')
 * const table = buildDarcyTable(segment, 1.0034e-6)
 * table.colebrook.value(Math.log(table.reynoldsPerFlow * 0.01)) // => 0.0195645
 */
export function buildDarcyTable(segment: ResolvedSegment, kinematicViscosity: number): DarcySegmentTable {
  const relativeRoughness = segment.roughness / segment.insideDiameter;
  const colebrook = new CubicHermiteTable(TABLE_LOG_RE_MIN, TABLE_LOG_RE_MAX, TABLE_INTERVALS, (logReynolds, out) =>
    colebrookWithLogSlope(Math.exp(logReynolds), relativeRoughness, out),
  );
  return {
    coefficient: segment.length / (segment.insideDiameter * 2 * STANDARD_GRAVITY * segment.area * segment.area),
    reynoldsPerFlow: segment.insideDiameter / (segment.area * kinematicViscosity),
    relativeRoughness,
    turbulentAt2300: colebrook.value(TABLE_LOG_RE_MIN),
    colebrook,
  };
}

/** f and df/d(ln Re) of the current evaluation. */
const factorScratch = new Float64Array(2);

/**
 * Darcy-Weisbach friction head h_f = f (L/D) V^2 / 2g of one tabulated segment at `flow` and its
 * derivative dh_f/dQ = c Q (2 f + df/d(ln Re)), into out[0] and out[1]; the laminar rule and its
 * ramp exact (friction.ts), Colebrook from the table from Re 2300 (relative error below 1e-8), solved directly
 * above Re 1e8. No checks: the solver's inner loop.
 * @param table - the segment's table (buildDarcyTable)
 * @param flow - volumetric flow, m3/s (>= 0)
 * @param out - receives the friction head (m) and its slope (m per m3/s)
 * @returns nothing: the results are written into `out`
 * @example
 * // as headLossDarcyWeisbach's example: python3-fluids Colebrook gives 5.62719 m
 * const segment = resolveSegment({ length: 100, insideDiameter: 0.0779272, roughness: 4.5e-5 }, 0, 'darcy-weisbach')
 * const out = new Float64Array(2)
 * darcyFrictionWithSlope(buildDarcyTable(segment, 1.0034e-6), 0.01, out)
 * out[0] // => 5.62719
 */
export function darcyFrictionWithSlope(table: DarcySegmentTable, flow: number, out: Float64Array): void {
  const reynolds = table.reynoldsPerFlow * flow;
  if (reynolds < LAMINAR_STEP_START) {
    const linear = (table.coefficient * 64) / table.reynoldsPerFlow;
    out[0] = linear * flow;
    out[1] = linear;
    return;
  }
  if (reynolds < LAMINAR_REYNOLDS_LIMIT) {
    const [value, perReynolds] = laminarStepFrictionFactor(reynolds, table.turbulentAt2300);
    factorScratch[0] = value;
    factorScratch[1] = perReynolds * reynolds;
  } else if (reynolds >= TABLE_REYNOLDS_MAX) colebrookWithLogSlope(reynolds, table.relativeRoughness, factorScratch);
  else table.colebrook.valueAndSlope(Math.log(reynolds), factorScratch);
  const f = factorScratch[0];
  const dfdu = factorScratch[1];
  const q2c = table.coefficient * flow * flow;
  out[0] = q2c * f;
  out[1] = table.coefficient * flow * (2 * f + dfdu);
}
