import { CubicHermiteTable } from './cubic-hermite-table';
import {
  LAMINAR_REYNOLDS_LIMIT,
  TURBULENT_REYNOLDS_LIMIT,
  frictionFactorColebrook,
  transitionFrictionFactor,
} from './friction';
import { STANDARD_GRAVITY } from './physical-constants';
import type { ResolvedSegment } from './system-input';

/*
 * Darcy-Weisbach friction is precomputed per segment as a table of the
 * Colebrook factor f over u = ln(Re) from Re = 4000 to 1e8, with the exact
 * derivative df/du at each node, evaluated by cubic Hermite interpolation.
 * Accuracy: relative error of the friction head below 1e-8 against the exact
 * Colebrook solution over that range (the tests check it). Below Re 4000 the
 * laminar and transition rules (friction.ts) are evaluated exactly; above
 * 1e8 Colebrook is solved directly.
 */
const TABLE_LOG_RE_MIN = Math.log(TURBULENT_REYNOLDS_LIMIT);
const TABLE_REYNOLDS_MAX = 1e8;
const TABLE_LOG_RE_MAX = Math.log(TABLE_REYNOLDS_MAX);
const TABLE_INTERVALS = 128;

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
  /** Colebrook f at Re 4000, the upper end of the transition blend. */
  turbulentAt4000: number;
  /** Colebrook f over ln(Re) from Re 4000 to 1e8. */
  colebrook: CubicHermiteTable;
}

/** Tabulates one resolved segment's friction at the water's kinematic viscosity (m2/s). */
export function buildDarcyTable(segment: ResolvedSegment, kinematicViscosity: number): DarcySegmentTable {
  const relativeRoughness = segment.roughness / segment.insideDiameter;
  const colebrook = new CubicHermiteTable(TABLE_LOG_RE_MIN, TABLE_LOG_RE_MAX, TABLE_INTERVALS, (logReynolds, out) =>
    colebrookWithLogSlope(Math.exp(logReynolds), relativeRoughness, out),
  );
  return {
    coefficient: segment.length / (segment.insideDiameter * 2 * STANDARD_GRAVITY * segment.area * segment.area),
    reynoldsPerFlow: segment.insideDiameter / (segment.area * kinematicViscosity),
    relativeRoughness,
    turbulentAt4000: colebrook.value(TABLE_LOG_RE_MIN),
    colebrook,
  };
}

/** f and df/d(ln Re) of the current evaluation. */
const factorScratch = new Float64Array(2);

/** Darcy-Weisbach friction head (m) of one tabulated segment at `flow` (m3/s) and its derivative, into out[0], out[1]. */
export function darcyFrictionWithSlope(table: DarcySegmentTable, flow: number, out: Float64Array): void {
  const reynolds = table.reynoldsPerFlow * flow;
  if (reynolds < LAMINAR_REYNOLDS_LIMIT) {
    const linear = (table.coefficient * 64) / table.reynoldsPerFlow;
    out[0] = linear * flow;
    out[1] = linear;
    return;
  }
  let f: number;
  let dfdu: number;
  if (reynolds < TURBULENT_REYNOLDS_LIMIT) {
    const [value, perReynolds] = transitionFrictionFactor(reynolds, table.turbulentAt4000);
    f = value;
    dfdu = perReynolds * reynolds;
  } else {
    if (reynolds >= TABLE_REYNOLDS_MAX) colebrookWithLogSlope(reynolds, table.relativeRoughness, factorScratch);
    else table.colebrook.valueAndSlope(Math.log(reynolds), factorScratch);
    f = factorScratch[0];
    dfdu = factorScratch[1];
  }
  const q2c = table.coefficient * flow * flow;
  out[0] = q2c * f;
  out[1] = table.coefficient * flow * (2 * f + dfdu);
}
