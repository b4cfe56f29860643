import { fittingK } from './fittings-catalogue';
import {
  HAZEN_WILLIAMS_FLOW_EXPONENT,
  LAMINAR_REYNOLDS_LIMIT,
  TURBULENT_REYNOLDS_LIMIT,
  frictionFactorColebrook,
  hazenWilliamsResistance,
  headLossDarcyWeisbach,
  transitionFrictionFactor,
} from './friction';
import { HydraulicsInputError, requireInRange, requirePositive } from './hydraulics-error';
import { MATERIAL_DEFAULTS, PIPE_MATERIALS, type PipeMaterial, pipeSizeById } from './pipe-catalogue';
import { STANDARD_GRAVITY } from './physical-constants';
import { waterKinematicViscosity } from './water-properties';

/*
 * The system curve: head the pipework needs at a flow,
 *   H(Q) = H_static + H_outlet + sum_i h_f,i(Q) + sum_i K_i V_i^2 / 2g,
 * i.e. the total dynamic head (TDH) for a pump lifting between two open
 * water surfaces (the velocity head at the outlet is counted by the exit K,
 * Crane TP-410 A-29, so it is not added again). Segments are in series and
 * carry the same flow. Inputs in SI: m, m3/s, C.
 */

export type FrictionMethod = 'hazen-williams' | 'darcy-weisbach';
export const FRICTION_METHODS: readonly FrictionMethod[] = ['hazen-williams', 'darcy-weisbach'];

/**
 * Ranges the engine accepts for a system (wide of any water feature or small
 * pump station, and narrow enough that no result overflows): lengths up to
 * 100 km, bores 1 mm to 5 m, heads within +-10 km, K up to 1e6, C 1-200,
 * roughness up to 50 mm.
 */
export const SYSTEM_INPUT_LIMITS = Object.freeze({
  maxLength: 1e5,
  minInsideDiameter: 1e-3,
  maxInsideDiameter: 5,
  maxAbsoluteHead: 1e4,
  maxK: 1e6,
  minHazenWilliamsC: 1,
  maxHazenWilliamsC: 200,
  maxRoughness: 0.05,
});

/** Velocity above which plastic pipe risks water hammer: 5 ft/s (common practice for plastic pipe). */
export const VELOCITY_WARNING_LIMIT = 1.524;

export interface FittingCount {
  kind: string;
  count: number;
}

export interface PipeSegmentInput {
  /** Pipe length, m (> 0). */
  length: number;
  /** Catalogue size id (e.g. `pvc-sch40-3`); or give insideDiameter. */
  pipeSizeId?: string;
  /** Inside diameter, m; or give pipeSizeId. */
  insideDiameter?: number;
  /** Material whose defaults apply when insideDiameter is given without C or roughness. */
  material?: PipeMaterial;
  /** Overrides the default Hazen-Williams C. */
  hazenWilliamsC?: number;
  /** Overrides the default absolute roughness, m. */
  roughness?: number;
  fittings?: readonly FittingCount[];
  /** Additional resistance coefficient (e.g. a filter module or manifold), dimensionless. */
  extraK?: number;
}

export interface SystemCurveInput {
  /** Elevation of the discharge surface or outlet above the intake water surface, m. */
  staticHead: number;
  /** Pressure head wanted at the outlet (spray nozzle, pressurised filter), m; default 0. */
  outletPressureHead?: number;
  segments: readonly PipeSegmentInput[];
  /** Water temperature, C (0-40); default 20. */
  temperature?: number;
  frictionMethod: FrictionMethod;
}

/** A segment with every value resolved to SI numbers. */
export interface ResolvedSegment {
  length: number;
  insideDiameter: number;
  /** Flow area, m2. */
  area: number;
  hazenWilliamsC: number;
  roughness: number;
  /** Sum of all K of the segment's fittings and extraK. */
  totalK: number;
}

export interface SegmentBreakdown {
  index: number;
  /** m/s */
  velocity: number;
  /** V^2/2g, m */
  velocityHead: number;
  /** Reynolds number (Darcy-Weisbach only, else null). */
  reynolds: number | null;
  frictionHead: number;
  minorHead: number;
  totalK: number;
}

export interface SystemBreakdown {
  flow: number;
  /** TDH = staticHead + outletPressureHead + frictionHead + minorHead, m */
  totalHead: number;
  /** Static lift, m */
  staticHead: number;
  outletPressureHead: number;
  frictionHead: number;
  minorHead: number;
  segments: SegmentBreakdown[];
  warnings: string[];
}

/**
 * The system curve prepared for fast evaluation.
 * `evaluate(q)` is total head (m) at flow q (m3/s, >= 0) and `slope(q)` its
 * derivative dH/dQ (m per m3/s); `headAndSlope` gives both for the cost of
 * one. Each costs a handful of arithmetic operations per segment and, being
 * the hot path, does not validate q.
 */
export interface CompiledSystemCurve {
  readonly frictionMethod: FrictionMethod;
  /** Static head plus outlet pressure head, m: the head the system needs at zero flow. */
  readonly staticHead: number;
  /** The static lift alone (input staticHead), m. */
  readonly staticLift: number;
  /** The outlet pressure head alone, m. */
  readonly outletPressureHead: number;
  /** Hazen-Williams only: H = staticHead + a Q^1.852 + b Q^2 (a, b in SI); null for Darcy-Weisbach. */
  readonly hazenWilliams: { readonly a: number; readonly b: number } | null;
  /** Minor-loss coefficient b = sum K / (2 g A^2), s2/m5. */
  readonly minorCoefficient: number;
  evaluate(flow: number): number;
  slope(flow: number): number;
  /** Head into out[0] and slope into out[1] in one pass (the solver's inner loop). */
  headAndSlope(flow: number, out: Float64Array): void;
  readonly segments: readonly ResolvedSegment[];
  readonly temperature: number;
  readonly kinematicViscosity: number;
}

function resolveSegment(segment: PipeSegmentInput, index: number, method: FrictionMethod): ResolvedSegment {
  const field = `/segments/${index}`;
  requirePositive(segment.length, `${field}/length`, 'segment length');
  requireInRange(segment.length, 0, SYSTEM_INPUT_LIMITS.maxLength, `${field}/length`, 'segment length (m)');
  let insideDiameter: number;
  let defaults: { hazenWilliamsC: number; roughness: number } | null = null;
  if (segment.pipeSizeId !== undefined) {
    if (segment.insideDiameter !== undefined) {
      throw new HydraulicsInputError(`${field}/insideDiameter`, 'give either pipeSizeId or insideDiameter, not both');
    }
    const size = pipeSizeById(segment.pipeSizeId, `${field}/pipeSizeId`);
    insideDiameter = size.insideDiameter;
    defaults = size;
  } else if (segment.insideDiameter !== undefined) {
    insideDiameter = requireInRange(
      segment.insideDiameter,
      SYSTEM_INPUT_LIMITS.minInsideDiameter,
      SYSTEM_INPUT_LIMITS.maxInsideDiameter,
      `${field}/insideDiameter`,
      'inside diameter (m)',
    );
    if (segment.material !== undefined) {
      if (!PIPE_MATERIALS.includes(segment.material)) {
        throw new HydraulicsInputError(
          `${field}/material`,
          `unknown material '${segment.material}'; valid materials: ${PIPE_MATERIALS.join(', ')}`,
        );
      }
      defaults = MATERIAL_DEFAULTS[segment.material];
    }
  } else {
    throw new HydraulicsInputError(`${field}/insideDiameter`, 'a segment needs pipeSizeId or insideDiameter');
  }
  const hazenWilliamsC =
    segment.hazenWilliamsC !== undefined
      ? requireInRange(
          segment.hazenWilliamsC,
          SYSTEM_INPUT_LIMITS.minHazenWilliamsC,
          SYSTEM_INPUT_LIMITS.maxHazenWilliamsC,
          `${field}/hazenWilliamsC`,
          'Hazen-Williams C',
        )
      : (defaults?.hazenWilliamsC ?? Number.NaN);
  const roughness =
    segment.roughness !== undefined
      ? requireInRange(segment.roughness, 0, SYSTEM_INPUT_LIMITS.maxRoughness, `${field}/roughness`, 'roughness (m)')
      : (defaults?.roughness ?? Number.NaN);
  if (method === 'hazen-williams' && Number.isNaN(hazenWilliamsC)) {
    throw new HydraulicsInputError(`${field}/hazenWilliamsC`, 'give hazenWilliamsC, a material or a pipeSizeId');
  }
  if (method === 'darcy-weisbach' && Number.isNaN(roughness)) {
    throw new HydraulicsInputError(`${field}/roughness`, 'give roughness, a material or a pipeSizeId');
  }
  let totalK =
    segment.extraK === undefined
      ? 0
      : requireInRange(segment.extraK, 0, SYSTEM_INPUT_LIMITS.maxK, `${field}/extraK`, 'extra K');
  (segment.fittings ?? []).forEach((fitting, fittingIndex) => {
    const fittingField = `${field}/fittings/${fittingIndex}`;
    requireInRange(fitting.count, 0, 1000, `${fittingField}/count`, 'fitting count');
    if (!Number.isInteger(fitting.count)) {
      throw new HydraulicsInputError(
        `${fittingField}/count`,
        `fitting count must be a whole number, got ${fitting.count}`,
      );
    }
    totalK += fitting.count * fittingK(fitting.kind, insideDiameter, `${fittingField}/kind`);
  });
  return {
    length: segment.length,
    insideDiameter,
    area: (Math.PI * insideDiameter * insideDiameter) / 4,
    hazenWilliamsC,
    roughness,
    totalK,
  };
}

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
const TABLE_STEP = (TABLE_LOG_RE_MAX - TABLE_LOG_RE_MIN) / TABLE_INTERVALS;

/** Colebrook f and df/d(ln Re) from the implicit derivative of x = 1/sqrt(f). */
function colebrookWithLogSlope(reynolds: number, relativeRoughness: number): [number, number] {
  const f = frictionFactorColebrook(reynolds, relativeRoughness);
  const x = 1 / Math.sqrt(f);
  const viscous = 2.51 / reynolds;
  const inner = relativeRoughness / 3.7 + viscous * x;
  const c = 2 / Math.LN10;
  const dxdu = (c * viscous * x) / inner / (1 + (c * viscous) / inner);
  return [f, -2 * f * (dxdu / x)];
}

interface DarcySegmentTable {
  /** friction head = coefficient * f * Q^2 */
  coefficient: number;
  /** Re = reynoldsPerFlow * Q */
  reynoldsPerFlow: number;
  relativeRoughness: number;
  /** Colebrook f at Re 4000, the upper end of the transition blend. */
  turbulentAt4000: number;
  values: Float64Array;
  slopes: Float64Array;
}

function buildDarcyTable(segment: ResolvedSegment, kinematicViscosity: number): DarcySegmentTable {
  const relativeRoughness = segment.roughness / segment.insideDiameter;
  const values = new Float64Array(TABLE_INTERVALS + 1);
  const slopes = new Float64Array(TABLE_INTERVALS + 1);
  for (let node = 0; node <= TABLE_INTERVALS; node += 1) {
    const [f, dfdu] = colebrookWithLogSlope(Math.exp(TABLE_LOG_RE_MIN + node * TABLE_STEP), relativeRoughness);
    values[node] = f;
    slopes[node] = dfdu * TABLE_STEP;
  }
  return {
    coefficient: segment.length / (segment.insideDiameter * 2 * STANDARD_GRAVITY * segment.area * segment.area),
    reynoldsPerFlow: segment.insideDiameter / (segment.area * kinematicViscosity),
    relativeRoughness,
    turbulentAt4000: values[0],
    values,
    slopes,
  };
}

/** Darcy-Weisbach friction head of one tabulated segment and its derivative, written into out[0], out[1]. */
function darcyFrictionWithSlope(table: DarcySegmentTable, flow: number, out: Float64Array): void {
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
  } else if (reynolds >= TABLE_REYNOLDS_MAX) {
    [f, dfdu] = colebrookWithLogSlope(reynolds, table.relativeRoughness);
  } else {
    const position = (Math.log(reynolds) - TABLE_LOG_RE_MIN) / TABLE_STEP;
    const node = Math.floor(position);
    const t = position - node;
    const f0 = table.values[node];
    const f1 = table.values[node + 1];
    const m0 = table.slopes[node];
    const m1 = table.slopes[node + 1];
    const t2 = t * t;
    const t3 = t2 * t;
    f = (2 * t3 - 3 * t2 + 1) * f0 + (t3 - 2 * t2 + t) * m0 + (-2 * t3 + 3 * t2) * f1 + (t3 - t2) * m1;
    dfdu =
      ((6 * t2 - 6 * t) * f0 + (3 * t2 - 4 * t + 1) * m0 + (-6 * t2 + 6 * t) * f1 + (3 * t2 - 2 * t) * m1) / TABLE_STEP;
  }
  const q2c = table.coefficient * flow * flow;
  out[0] = q2c * f;
  out[1] = table.coefficient * flow * (2 * f + dfdu);
}

function checkFlow(flow: number): void {
  if (!(flow >= 0) || flow === Number.POSITIVE_INFINITY) {
    throw new HydraulicsInputError('/flow', `flow must be a finite number >= 0, got ${flow}`);
  }
}

/**
 * Prepares a system curve for fast evaluation (see CompiledSystemCurve).
 * Hazen-Williams: H(Q) = Hs + a Q^1.852 + b Q^2 with a = sum 10.67 L/(C^1.852 D^4.8704)
 * and b = sum K/(2 g A^2). Darcy-Weisbach: Hs + sum c_i f_i(Re_i) Q^2 + b Q^2 with
 * f_i from the precomputed Colebrook table described above.
 * Throws HydraulicsInputError (with the field path) for invalid input.
 */
export function compileSystemCurve(input: SystemCurveInput): CompiledSystemCurve {
  const maxHead = SYSTEM_INPUT_LIMITS.maxAbsoluteHead;
  requireInRange(input.staticHead, -maxHead, maxHead, '/staticHead', 'static head (m)');
  const outletPressureHead =
    input.outletPressureHead === undefined
      ? 0
      : requireInRange(input.outletPressureHead, -maxHead, maxHead, '/outletPressureHead', 'outlet pressure head (m)');
  if (!FRICTION_METHODS.includes(input.frictionMethod)) {
    throw new HydraulicsInputError(
      '/frictionMethod',
      `unknown friction method '${String(input.frictionMethod)}'; valid methods: ${FRICTION_METHODS.join(', ')}`,
    );
  }
  if (!Array.isArray(input.segments) || input.segments.length === 0) {
    throw new HydraulicsInputError('/segments', 'a system needs at least one pipe segment');
  }
  const temperature = input.temperature ?? 20;
  const kinematicViscosity = waterKinematicViscosity(temperature, '/temperature');
  const segments = input.segments.map((segment, index) => resolveSegment(segment, index, input.frictionMethod));
  const staticHead = input.staticHead + outletPressureHead;
  const minorCoefficient = segments.reduce(
    (sum, segment) => sum + segment.totalK / (2 * STANDARD_GRAVITY * segment.area * segment.area),
    0,
  );
  const common = {
    staticHead,
    staticLift: input.staticHead,
    outletPressureHead,
    minorCoefficient,
    segments,
    temperature,
    kinematicViscosity,
  };

  if (input.frictionMethod === 'hazen-williams') {
    const a = segments.reduce(
      (sum, segment, index) =>
        sum +
        hazenWilliamsResistance(segment.length, segment.insideDiameter, segment.hazenWilliamsC, `/segments/${index}`),
      0,
    );
    const b = minorCoefficient;
    const slopeExponent = HAZEN_WILLIAMS_FLOW_EXPONENT - 1;
    return {
      ...common,
      frictionMethod: 'hazen-williams',
      hazenWilliams: { a, b },
      evaluate: (flow) => staticHead + a * Math.pow(flow, HAZEN_WILLIAMS_FLOW_EXPONENT) + b * flow * flow,
      slope: (flow) => HAZEN_WILLIAMS_FLOW_EXPONENT * a * Math.pow(flow, slopeExponent) + 2 * b * flow,
      headAndSlope(flow, out) {
        const friction = a * Math.pow(flow, slopeExponent);
        out[0] = staticHead + (friction + b * flow) * flow;
        out[1] = HAZEN_WILLIAMS_FLOW_EXPONENT * friction + 2 * b * flow;
      },
    };
  }

  const tables = segments.map((segment) => buildDarcyTable(segment, kinematicViscosity));
  const segmentScratch = new Float64Array(2);
  const headAndSlope = (flow: number, out: Float64Array): void => {
    if (flow <= 0) {
      out[0] = staticHead;
      out[1] = 0;
      return;
    }
    let head = staticHead + minorCoefficient * flow * flow;
    let slope = 2 * minorCoefficient * flow;
    for (const table of tables) {
      darcyFrictionWithSlope(table, flow, segmentScratch);
      head += segmentScratch[0];
      slope += segmentScratch[1];
    }
    out[0] = head;
    out[1] = slope;
  };
  const scratch = new Float64Array(2);
  return {
    ...common,
    frictionMethod: 'darcy-weisbach',
    hazenWilliams: null,
    headAndSlope,
    evaluate(flow) {
      headAndSlope(flow, scratch);
      return scratch[0];
    },
    slope(flow) {
      headAndSlope(flow, scratch);
      return scratch[1];
    },
  };
}

/**
 * Head breakdown at one flow, computed exactly (Colebrook solved, not
 * tabulated): static, outlet pressure, friction and minor head, and per
 * segment velocity, velocity head and a warning above 5 ft/s.
 * @param flow m3/s (>= 0)
 */
export function systemBreakdown(system: CompiledSystemCurve, flow: number): SystemBreakdown {
  checkFlow(flow);
  const warnings: string[] = [];
  if (system.frictionMethod === 'hazen-williams' && (system.temperature < 4 || system.temperature > 25)) {
    warnings.push(
      `Hazen-Williams is fitted to water at about 4-25 C; at ${system.temperature} C prefer Darcy-Weisbach`,
    );
  }
  const segments = system.segments.map((segment, index): SegmentBreakdown => {
    const velocity = flow / segment.area;
    const velocityHead = (velocity * velocity) / (2 * STANDARD_GRAVITY);
    const isHazenWilliams = system.frictionMethod === 'hazen-williams';
    const frictionHead = isHazenWilliams
      ? hazenWilliamsResistance(segment.length, segment.insideDiameter, segment.hazenWilliamsC) *
        Math.pow(flow, HAZEN_WILLIAMS_FLOW_EXPONENT)
      : headLossDarcyWeisbach(
          segment.length,
          flow,
          segment.insideDiameter,
          segment.roughness,
          system.kinematicViscosity,
        );
    if (velocity > VELOCITY_WARNING_LIMIT) {
      warnings.push(
        `segment ${index}: velocity ${velocity.toFixed(2)} m/s exceeds 1.52 m/s (5 ft/s), the common-practice limit for plastic pipe`,
      );
    }
    return {
      index,
      velocity,
      velocityHead,
      reynolds: isHazenWilliams ? null : (velocity * segment.insideDiameter) / system.kinematicViscosity,
      frictionHead,
      minorHead: segment.totalK * velocityHead,
      totalK: segment.totalK,
    };
  });
  const frictionHead = segments.reduce((sum, segment) => sum + segment.frictionHead, 0);
  const minorHead = segments.reduce((sum, segment) => sum + segment.minorHead, 0);
  return {
    flow,
    totalHead: system.staticHead + frictionHead + minorHead,
    staticHead: system.staticLift,
    outletPressureHead: system.outletPressureHead,
    frictionHead,
    minorHead,
    segments,
    warnings,
  };
}
