import { fittingK } from './fittings-catalogue';
import { HydraulicsInputError, requireInRange, requirePositive } from './hydraulics-error';
import { MATERIAL_DEFAULTS, PIPE_MATERIALS, type PipeMaterial, pipeSizeById } from './pipe-catalogue';

/*
 * What a system is made of, as a caller describes it (segments by catalogue size or bore,
 * fittings, static and outlet heads), and its resolution to SI numbers with every value checked.
 */

export type FrictionMethod = 'hazen-williams' | 'darcy-weisbach';
/** Which side of the pump a segment is on: the suction pipe from the intake, or the discharge pipe after the pump. */
export type SegmentSide = 'suction' | 'discharge';
/** The friction methods a system may name: Hazen-Williams (SI form) or Darcy-Weisbach with Colebrook. */
export const FRICTION_METHODS: readonly FrictionMethod[] = ['hazen-williams', 'darcy-weisbach'];

/**
 * Ranges the engine accepts for a system (wide of any water feature or small
 * pump station, and narrow enough that no result overflows): lengths up to
 * 100 km, bores 1 mm to 5 m, heads within +-10 km, K up to 1e6, C 1-200,
 * roughness up to 50 mm. Our own bounds, SI.
 * @example
 * SYSTEM_INPUT_LIMITS.maxLength // => 100000
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
  /** Suction segments come first, from the intake to the pump; default discharge. */
  side?: SegmentSide;
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
  /** Site elevation above mean sea level, m: sets the atmospheric pressure on the intake surface (NPSH). */
  siteElevation?: number;
  /** Pump impeller eye above the intake water surface, m; negative for a flooded suction (NPSH). */
  pumpElevation?: number;
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

/**
 * Resolves one segment to SI numbers; throws HydraulicsInputError naming the field. The bore comes
 * from the catalogue size or is given; C and roughness are given or the size's or material's
 * defaults (pipe-catalogue); total K = extraK + sum count x K of each fitting (Crane TP-410 K = n
 * f_T, fittings-catalogue); flow area A = pi D^2 / 4.
 * @param segment - length (m), a catalogue size id or a bore (m), optional material, C, roughness (m), fittings, extra K
 * @param index - the segment's position, for the JSON pointer of an error (`/segments/<index>`)
 * @param method - the friction method, which decides whether C or roughness must be known
 * @returns the segment in SI: length and bore (m), area (m2), C, roughness (m), total K
 * @example
 * // 3" Schedule 40 PVC (bore 3.068 in) with two standard elbows: K = 2 x 30 f_T, f_T = 0.017315 by Crane's formula
 * const segment = resolveSegment({ length: 12, pipeSizeId: 'pvc-sch40-3', fittings: [{ kind: 'elbow-90-standard', count: 2 }] }, 0, 'hazen-williams')
 * segment.totalK // => 1.0389
 * segment.area // => 4.7694e-3
 */
export function resolveSegment(segment: PipeSegmentInput, index: number, method: FrictionMethod): ResolvedSegment {
  const field = `/segments/${index}`;
  requirePositive(segment.length, `${field}/length`, 'segment length');
  requireInRange(segment.length, 0, SYSTEM_INPUT_LIMITS.maxLength, `${field}/length`, 'segment length (m)');
  let insideDiameter: number;
  let defaults: { hazenWilliamsC: number; roughness: number } | null = null;
  if (segment.pipeSizeId !== undefined) {
    if (segment.insideDiameter !== undefined) {
      throw new HydraulicsInputError({
        code: 'pipe-size-and-diameter',
        params: {},
        pointer: `${field}/insideDiameter`,
      });
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
        throw new HydraulicsInputError({
          code: 'unknown-material',
          params: { value: segment.material, accepted: [...PIPE_MATERIALS] },
          pointer: `${field}/material`,
        });
      }
      defaults = MATERIAL_DEFAULTS[segment.material];
    }
  } else {
    throw new HydraulicsInputError({ code: 'no-diameter', params: {}, pointer: `${field}/insideDiameter` });
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
    throw new HydraulicsInputError({ code: 'no-hazen-williams-c', params: {}, pointer: `${field}/hazenWilliamsC` });
  }
  if (method === 'darcy-weisbach' && Number.isNaN(roughness)) {
    throw new HydraulicsInputError({ code: 'no-roughness', params: {}, pointer: `${field}/roughness` });
  }
  let totalK =
    segment.extraK === undefined
      ? 0
      : requireInRange(segment.extraK, 0, SYSTEM_INPUT_LIMITS.maxK, `${field}/extraK`, 'extra K');
  (segment.fittings ?? []).forEach((fitting, fittingIndex) => {
    const fittingField = `${field}/fittings/${fittingIndex}`;
    requireInRange(fitting.count, 0, 1000, `${fittingField}/count`, 'fitting count');
    if (!Number.isInteger(fitting.count)) {
      throw new HydraulicsInputError({
        code: 'not-whole-number',
        params: { what: 'fitting count', value: fitting.count, min: 0 },
        pointer: `${fittingField}/count`,
      });
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
