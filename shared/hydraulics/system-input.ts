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
  /** Reducer and expansion: this segment's bore over the larger bore, 0 < beta < 1. */
  diameterRatio?: number;
  /** Reducer and expansion: included cone angle, degrees; default 180, a sudden change. */
  angle?: number;
}

/** A filter, UV clarifier, skimmer, spray bar or heat exchanger, as its maker rates it: a head loss at a flow. */
export interface EquipmentInput {
  name: string;
  /** Head loss at the rated flow, m (>= 0). */
  headLoss: number;
  /** The rated flow, m3/s (> 0). */
  atFlow: number;
}

/** Equipment resolved to its loss coefficient: head loss = coefficient x Q^2. */
export interface ResolvedEquipment {
  name: string;
  /** headLoss / atFlow^2, m per (m3/s)^2. */
  coefficient: number;
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
  /** Equipment rated by a head loss at a flow, scaled as (Q / Q_rated)^2. */
  equipment?: readonly EquipmentInput[];
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
  /** The segment's equipment, each with its head loss = coefficient x Q^2. */
  equipment: readonly ResolvedEquipment[];
}

/**
 * Equipment's loss coefficient from its maker's rating: h = h_r (Q / Q_r)^2, so h = c Q^2 with
 * c = h_r / Q_r^2. The square law holds for fully turbulent flow, where K is constant (Crane
 * TP-410, ch. 2: resistance coefficient independent of Reynolds number in fully turbulent flow);
 * a rating taken far from the working flow carries that assumption. Zero rated flow is refused.
 * @param equipment - name, head loss (m) at the rated flow (m3/s)
 * @param field - JSON pointer of the equipment entry
 * @returns its name and coefficient, m per (m3/s)^2
 * @example
 * // 2 m at 5 L/s: 2 / 0.005^2
 * resolveEquipment({ name: 'bead filter', headLoss: 2, atFlow: 0.005 }, '/segments/0/equipment/0').coefficient // => 80000
 */
export function resolveEquipment(equipment: EquipmentInput, field: string): ResolvedEquipment {
  const headLoss = requireInRange(
    equipment.headLoss,
    0,
    SYSTEM_INPUT_LIMITS.maxAbsoluteHead,
    `${field}/headLoss`,
    'equipment head loss (m)',
  );
  requirePositive(equipment.atFlow, `${field}/atFlow`, 'equipment rated flow');
  const atFlow = requireInRange(equipment.atFlow, 1e-6, 100, `${field}/atFlow`, 'equipment rated flow (m3/s)');
  return { name: equipment.name, coefficient: headLoss / (atFlow * atFlow) };
}

/**
 * Resolves one segment to SI numbers; throws HydraulicsInputError naming the field. The bore comes
 * from the catalogue size or is given; C and roughness are given or the size's or material's
 * defaults (pipe-catalogue); total K = extraK + sum count x K of each fitting (Crane TP-410 K = n
 * f_T, fittings-catalogue); equipment as resolveEquipment; flow area A = pi D^2 / 4.
 * @param segment - length (m), a catalogue size id or a bore (m), optional material, C, roughness (m), fittings, extra K, equipment
 * @param index - the segment's position, for the JSON pointer of an error (`/segments/<index>`)
 * @param method - the friction method, which decides whether C or roughness must be known
 * @returns the segment in SI: length and bore (m), area (m2), C, roughness (m), total K, equipment coefficients
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
    totalK += fitting.count * fittingK(fitting, insideDiameter, fittingField);
  });
  const equipment = (segment.equipment ?? []).map((entry, entryIndex) =>
    resolveEquipment(entry, `${field}/equipment/${entryIndex}`),
  );
  return {
    length: segment.length,
    insideDiameter,
    area: (Math.PI * insideDiameter * insideDiameter) / 4,
    hazenWilliamsC,
    roughness,
    totalK,
    equipment,
  };
}
