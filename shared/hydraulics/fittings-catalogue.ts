import { HydraulicsInputError, requirePositive } from './hydraulics-error';
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
 * exit coefficients are fixed K (Crane TP-410, A-29).
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
  'foot-valve-poppet',
  'foot-valve-hinged',
  'entrance-sharp',
  'entrance-inward-projecting',
  'exit',
] as const;

export type FittingKind = (typeof FITTING_KINDS)[number];

/** How a fitting's K is found: a multiple of f_T (Crane) or a fixed value. */
export type FittingResistance = { method: 'crane'; multiplier: number } | { method: 'fixed'; k: number };

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

function fixed(kind: FittingKind, label: string, k: number): FittingDefinition {
  return { kind, label, resistance: { method: 'fixed', k }, source: `${CRANE}: K = ${k}` };
}

/**
 * The catalogue, in the order of FITTING_KINDS, each entry with its Crane TP-410 source (Appendix
 * A-29 multipliers n of K = n f_T, or fixed K for entrances and the exit).
 * @example
 * FITTINGS.length // => 17
 * FITTINGS[0].kind // => 'elbow-90-standard'
 */
export const FITTINGS: readonly FittingDefinition[] = Object.freeze([
  crane('elbow-90-standard', '90-degree standard elbow', 30),
  crane(
    'elbow-90-long-radius',
    '90-degree long-radius elbow',
    20,
    " (Crane's 90-degree bend at r/d = 1; at r/d = 1.5 Crane gives 14 f_T, so 20 is the conservative value)",
  ),
  crane('elbow-45-standard', '45-degree standard elbow', 16),
  crane('bend-180-return', '180-degree close-pattern return bend', 50),
  crane('tee-run', 'Standard tee, flow through run', 20, " (older editions' fixed value)"),
  crane('tee-branch', 'Standard tee, flow through branch', 60, " (older editions' fixed value)"),
  crane('valve-gate', 'Gate valve, full bore, open', 8),
  crane('valve-ball', 'Ball valve, full bore, open', 3),
  crane('valve-globe', 'Globe valve, full bore, open', 340),
  crane('valve-butterfly', 'Butterfly valve, open', 45, ' (Crane tabulates 45 f_T for 2" to 8")'),
  crane('check-valve-swing', 'Swing check valve, conventional', 100),
  crane('check-valve-swing-clearway', 'Swing check valve, clearway', 50),
  crane('foot-valve-poppet', 'Foot valve with strainer, poppet disc', 420),
  crane('foot-valve-hinged', 'Foot valve with strainer, hinged disc', 75),
  fixed('entrance-sharp', 'Pipe entrance, flush sharp-edged', 0.5),
  fixed('entrance-inward-projecting', 'Pipe entrance, inward projecting', 0.78),
  fixed('exit', 'Pipe exit into a tank or pond (count once)', 1.0),
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
 * Resistance coefficient K of one fitting in a pipe of `insideDiameter` (m), for h_m = K V^2 / 2g.
 * Crane fittings: K = n f_T(D); entrances and exit: fixed K. Source per entry (Crane TP-410,
 * Appendix A-29). Valid for full-bore fittings in turbulent flow, Crane's bores 1/2" to 24".
 * @param kind - one of FITTING_KINDS
 * @param insideDiameter - inside diameter, m (> 0)
 * @param field - JSON pointer named when the kind is unknown
 * @returns resistance coefficient K, dimensionless
 * @example
 * // 90-degree standard elbow in 3" Schedule 40: 30 f_T = 30 x 0.017315 by hand; the exit is K = 1
 * fittingK('elbow-90-standard', 0.0779272) // => 0.51945
 * fittingK('exit', 0.0779272) // => 1
 */
export function fittingK(kind: string, insideDiameter: number, field = '/kind'): number {
  const { resistance } = fittingByKind(kind, field);
  if (resistance.method === 'fixed') {
    return resistance.k;
  }
  return resistance.multiplier * craneFullyTurbulentFrictionFactor(insideDiameter);
}
