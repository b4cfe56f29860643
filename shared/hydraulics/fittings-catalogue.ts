import { HydraulicsInputError, requireInRange, requirePositive } from './hydraulics-error';
import { diameterToSI } from './units';

/*
 * Resistance coefficients of fittings and valves, K in h_m = K V^2 / 2g.
 *
 * Crane method (Crane Co., Technical Paper No. 410, "Flow of Fluids Through
 * Valves, Fittings, and Pipe", Appendix ): K = n f_T, with f_T the
 * fully turbulent Darcy friction factor of clean commercial steel pipe of the
 * fitting's bore,
 *   f_T = 0.25 / [log10((eps/D) / 3.7)]^2,  eps = 0.0018 in (45.72 um).
 * Multipliers n are Crane's, for full-bore valves (beta = 1). Entrance and
 * exit coefficients are fixed K (Crane TP-410, A-29). Reducers and expansions
 * take Crane's formulas in the diameter ratio, the tee through its
 * branch Crane's diverging-branch formula (2009 edition, ch. 2); a union and a
 * bulkhead fitting, which Crane does not tabulate, common-practice values.
 */

/** Crane's roughness of clean commercial steel, 0.0018 in, in m. */
const CRANE_STEEL_ROUGHNESS = diameterToSI(0.0018, 'in');

/** Every fitting kind the catalogue knows, the ids a segment's fittings name. */
export const FITTING_KINDS = [
  'elbow-90-standard',
  'elbow-90-long-radius',
  'elbow-45-standard',
  'bend-180-return',
  'tee-run',
  'tee-branch',
  'valve-gate',
  'valve-ball',
  'valve-globe',
  'valve-butterfly',
  'check-valve-swing',
  'check-valve-swing-clearway',
  'check-valve-spring',
  'foot-valve-poppet',
  'foot-valve-hinged',
  'entrance-sharp',
  'entrance-inward-projecting',
  'exit',
  'reducer',
  'expansion',
  'union',
  'bulkhead',
  'valve-three-way-run',
  'valve-three-way-branch',
] as const;

export type FittingKind = (typeof FITTING_KINDS)[number];

/**
 * How a fitting's K is found: a multiple of f_T (Crane), a fixed value, or Crane's formula in the
 * diameter ratio and angle of a reducer (contraction) or expansion (enlargement).
 */
export type FittingResistance =
  | { method: 'crane'; multiplier: number }
  | { method: 'fixed'; k: number }
  | { method: 'diameter-ratio'; change: 'contraction' | 'enlargement' };

/** A fitting as a segment names it; reducers and expansions also give their diameter ratio and angle. */
export interface FittingGeometry {
  kind: string;
  /** Reducer and expansion: this segment's bore over the larger bore, 0 < beta < 1. */
  diameterRatio?: number;
  /** Reducer and expansion: included cone angle, degrees (0, 180]; default 180, a sudden change. */
  angle?: number;
}

export interface FittingDefinition {
  kind: FittingKind;
  label: string;
  resistance: FittingResistance;
  source: string;
}

const CRANE = 'Crane TP-410, Appendix A-29';

function crane(kind: FittingKind, label: string, multiplier: number, note = ''): FittingDefinition {
  return { kind, label, resistance: { method: 'crane', multiplier }, source: `${CRANE}: K = ${multiplier} f_T${note}` };
}

function fixed(kind: FittingKind, label: string, k: number, source = `${CRANE}: K = ${k}`): FittingDefinition {
  return { kind, label, resistance: { method: 'fixed', k }, source };
}

function diameterRatio(
  kind: FittingKind,
  label: string,
  change: 'contraction' | 'enlargement',
  source: string,
): FittingDefinition {
  return { kind, label, resistance: { method: 'diameter-ratio', change }, source };
}

/**
 * A standard tee with all the flow turning through its branch, by Crane's diverging-branch
 * formula K = G [1 + H (q/beta^2)^2 - J (q/beta^2) cos theta] (Crane TP-410, 2009 edition, ch. 2,
 * with its errata): branch bore equal to the run's (beta = 1), theta = 90 degrees, q = Q_branch /
 * Q_combined = 1, so H = 0.3, J = 0, G = 1 + 0.3 q^2 = 1.3 and K = 1.3 x 1.3 = 1.69, referred to
 * the inlet, which is this segment's bore.
 */
const TEE_AS_ELBOW_K = 1.3 * (1 + 0.3);

/**
 * The catalogue, in the order of FITTING_KINDS, each entry with its source: Crane TP-410 (Appendix
 * A-29 multipliers n of K = n f_T, fixed K for entrances and the exit, A-26 formulas for reducers
 * and expansions, the 2009 diverging-branch formula for a tee through its branch) or common
 * practice where Crane tabulates nothing (union, bulkhead fitting).
 * @example
 * FITTINGS.length // => 24
 * FITTINGS[0].kind // => 'elbow-90-standard'
 */
export const FITTINGS: readonly FittingDefinition[] = Object.freeze([
  crane('elbow-90-standard', '90-degree standard elbow', 30),
  crane(
    'elbow-90-long-radius',
    '90-degree long-radius elbow',
    14,
    " (Crane's 90-degree bend at its real radius, r/d = 1.5 as ASME B16.9 makes a long-radius elbow)",
  ),
  crane('elbow-45-standard', '45-degree standard elbow', 16),
  crane('bend-180-return', '180-degree close-pattern return bend', 50),
  crane('tee-run', 'Standard tee, flow through run', 20, " (older editions' fixed value)"),
  fixed(
    'tee-branch',
    'Standard tee used as an elbow, all flow through the branch',
    TEE_AS_ELBOW_K,
    "Crane TP-410 (2009), diverging-branch formula with all the flow through a branch of the run's bore at 90 degrees: K = 1.3 x (1 + 0.3) = 1.69",
  ),
  crane('valve-gate', 'Gate valve, full bore, open', 8),
  crane('valve-ball', 'Ball valve, full bore, open', 3),
  crane('valve-globe', 'Globe valve, full bore, open', 340),
  crane('valve-butterfly', 'Butterfly valve, open', 45, ' (Crane tabulates 45 f_T for 2" to 8")'),
  crane('check-valve-swing', 'Swing check valve, conventional', 100),
  crane('check-valve-swing-clearway', 'Swing check valve, clearway', 50),
  crane(
    'check-valve-spring',
    'Spring (in-line) check valve',
    600,
    " (the lift check valve, in-line pattern, which a spring check resembles: the flow lifts a disc off its seat; give the maker's loss at a flow as equipment when known)",
  ),
  crane('foot-valve-poppet', 'Foot valve with strainer, poppet disc', 420),
  crane('foot-valve-hinged', 'Foot valve with strainer, hinged disc', 75),
  fixed('entrance-sharp', 'Pipe entrance, flush sharp-edged', 0.5),
  fixed('entrance-inward-projecting', 'Pipe entrance, inward projecting', 0.78),
  fixed('exit', 'Pipe exit into a tank or pond (count once)', 1.0),
  diameterRatio(
    'reducer',
    'Reducer into this segment from a larger pipe (diameter ratio and angle)',
    'contraction',
    'Crane TP-410, A-26: K = 0.8 sin(theta/2) (1 - beta^2) for theta <= 45 degrees, 0.5 (1 - beta^2) sqrt(sin(theta/2)) above, referred to this (smaller) bore',
  ),
  diameterRatio(
    'expansion',
    'Expansion out of this segment into a larger pipe (diameter ratio and angle)',
    'enlargement',
    'Crane TP-410, A-26: K = 2.6 sin(theta/2) (1 - beta^2)^2 for theta <= 45 degrees, (1 - beta^2)^2 above (Borda-Carnot), referred to this (smaller) bore',
  ),
  fixed(
    'union',
    'Union (or coupling)',
    0.08,
    'Common practice: K = 0.08, the value the loss tables of the trade give a threaded union (Crane TP-410 tabulates none)',
  ),
  fixed(
    'bulkhead',
    'Bulkhead (tank or liner wall) fitting',
    0.5,
    "Common practice: K = 0.5 for a fitting whose bore narrows and widens again through the wall (Crane TP-410 tabulates none; give the maker's loss at a flow as equipment when known). The pipe's entrance or exit is counted apart",
  ),
  crane('valve-three-way-run', 'Three-way valve, flow straight through', 30, ' (three-way plug valve)'),
  crane('valve-three-way-branch', 'Three-way valve, flow through the branch', 90, ' (three-way plug valve)'),
]);

const FITTINGS_BY_KIND: ReadonlyMap<string, FittingDefinition> = new Map(FITTINGS.map((f) => [f.kind, f]));

/**
 * Fully turbulent friction factor of clean commercial steel pipe, Crane's f_T.
 *   f_T = 0.25 / [log10((eps/D)/3.7)]^2, eps = 0.0018 in.
 * Source: Crane TP-410, Appendix A-26 (the rough-pipe limit of Colebrook's
 * equation). Valid for the bores of Crane's tables (1/2" to 24").
 * @param insideDiameter - inside diameter of the fitting's pipe, m (> 0)
 * @param field - JSON pointer named when the diameter is rejected
 * @returns fully turbulent Darcy friction factor f_T, dimensionless
 * @example
 * // 2" and 3" Schedule 40 bores (2.067 in, 3.068 in); by hand with the formula above. python3-fluids
 * // 1.0.22 ft_Crane, which solves Colebrook at a high Reynolds number instead, gives 0.017213 for 3"
 * craneFullyTurbulentFrictionFactor(0.0525018) // => 0.018991
 * craneFullyTurbulentFrictionFactor(0.0779272) // => 0.017315
 */
export function craneFullyTurbulentFrictionFactor(insideDiameter: number, field = '/insideDiameter'): number {
  requirePositive(insideDiameter, field, 'inside diameter');
  const logTerm = Math.log10(CRANE_STEEL_ROUGHNESS / insideDiameter / 3.7);
  return 0.25 / (logTerm * logTerm);
}

/**
 * The catalogue entry for `kind`; unknown kind -> HydraulicsInputError naming the valid kinds.
 * @param kind - one of FITTING_KINDS
 * @param field - JSON pointer named when the kind is unknown
 * @returns the fitting's label, resistance rule and source
 * @example
 * fittingByKind('check-valve-swing').resistance.multiplier // => 100
 */
export function fittingByKind(kind: string, field = '/kind'): FittingDefinition {
  const fitting = FITTINGS_BY_KIND.get(kind);
  if (!fitting) {
    throw new HydraulicsInputError({
      code: 'unknown-fitting-kind',
      params: { value: kind, accepted: [...FITTING_KINDS] },
      pointer: field,
    });
  }
  return fitting;
}

/**
 * K of a reducer (contraction into this bore) or expansion (enlargement out of it), referred to
 * this, the smaller, bore, beta = d_small / d_large, theta the included cone angle:
 *   contraction: K = 0.8 sin(theta/2) (1 - beta^2) for theta <= 45 degrees, else 0.5 (1 - beta^2) sqrt(sin(theta/2));
 *   enlargement: K = 2.6 sin(theta/2) (1 - beta^2)^2 for theta <= 45 degrees, else (1 - beta^2)^2.
 * Source: Crane TP-410, Appendix A-26 (formulas 1 to 4, the K_1 of the small bore). Valid for
 * turbulent flow; theta = 180 degrees is the sudden change.
 * @param change - 'contraction' (reducer) or 'enlargement' (expansion)
 * @param ratio - diameter ratio beta, 0 < beta < 1
 * @param angle - included angle theta, degrees (0, 180]
 * @returns resistance coefficient K, dimensionless
 * @example
 * // sudden, beta 0.5: 0.5 x 0.75 and 0.75^2; python3-fluids 1.0.22 contraction_sharp(method='Crane') gives 0.375
 * diameterChangeK('contraction', 0.5, 180) // => 0.375
 * diameterChangeK('enlargement', 0.5, 180) // => 0.5625
 */
export function diameterChangeK(change: 'contraction' | 'enlargement', ratio: number, angle: number): number {
  const area = 1 - ratio * ratio;
  const halfAngleSine = Math.sin((angle * Math.PI) / 360);
  const gradual = angle <= 45;
  if (change === 'contraction') return gradual ? 0.8 * halfAngleSine * area : 0.5 * area * Math.sqrt(halfAngleSine);
  return gradual ? 2.6 * halfAngleSine * area * area : area * area;
}

/**
 * Resistance coefficient K of one fitting in a pipe of `insideDiameter` (m), for h_m = K V^2 / 2g.
 * Crane fittings: K = n f_T(D); entrances, exit, tee through its branch, union and bulkhead: fixed
 * K; reducer and expansion: diameterChangeK of their ratio and angle (which they must give).
 * Source per entry (FITTINGS). Valid for full-bore fittings in turbulent flow, Crane's bores 1/2"
 * to 24".
 * @param fitting - its kind (one of FITTING_KINDS) and, for a reducer or expansion, diameter ratio and angle
 * @param insideDiameter - inside diameter, m (> 0)
 * @param field - JSON pointer of the fitting (its kind, ratio and angle are named under it)
 * @returns resistance coefficient K, dimensionless
 * @example
 * // 90-degree standard elbow in 3" Schedule 40: 30 f_T = 30 x 0.017315 by hand; the exit is K = 1
 * fittingK({ kind: 'elbow-90-standard' }, 0.0779272) // => 0.51945
 * fittingK({ kind: 'exit' }, 0.0779272) // => 1
 * fittingK({ kind: 'expansion', diameterRatio: 0.5 }, 0.0779272) // => 0.5625
 */
export function fittingK(fitting: FittingGeometry, insideDiameter: number, field = ''): number {
  const { resistance } = fittingByKind(fitting.kind, `${field}/kind`);
  if (resistance.method === 'fixed') {
    return resistance.k;
  }
  if (resistance.method === 'diameter-ratio') {
    if (fitting.diameterRatio === undefined) {
      throw new HydraulicsInputError({
        code: 'no-diameter-ratio',
        params: { kind: fitting.kind },
        pointer: `${field}/diameterRatio`,
      });
    }
    const ratio = requireInRange(fitting.diameterRatio, 0.05, 0.99, `${field}/diameterRatio`, 'diameter ratio');
    const angle = requireInRange(fitting.angle ?? 180, 1, 180, `${field}/angle`, 'angle (degrees)');
    return diameterChangeK(resistance.change, ratio, angle);
  }
  return resistance.multiplier * craneFullyTurbulentFrictionFactor(insideDiameter, `${field}/insideDiameter`);
}
