import { requireNonNegative, requirePositive } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';

/*
 * Pipe friction. Lengths and diameters in m, flow in m3/s, head in m.
 *
 * Flow-regime rule used everywhere in Riffle: laminar f = 64/Re below
 * Re = 2300; the turbulent correlation (Colebrook-White by default) from
 * there on, the transition band 2300-4000 included. Real flow in that band
 * is intermittent and no correlation predicts it; the turbulent value is the
 * upper one, so a system curve never runs low there, where a straight line
 * from 64/2300 to the turbulent value at 4000 would run 17-40 % low
 * (Colebrook 1939 extended into the band, as the Moody chart's dashed
 * curves do; Moody 1944). The step up at Re 2300 is taken as a steep straight
 * ramp over the last 1 % below it (Re 2277-2300, LAMINAR_STEP_START), so the
 * system curve stays continuous and a pump curve that crosses it always has
 * an exact operating point; the ramp only raises friction, so it errs on the
 * safe side too. The answer warns of flow in the band (system-breakdown).
 */

/** Reynolds number below which flow is taken as laminar: ~2300, the usual engineering value (White, Fluid Mechanics, 7th ed., ch. 6). */
export const LAMINAR_REYNOLDS_LIMIT = 2300;
/** Reynolds number from which flow is fully turbulent: 4000, where the Moody chart's turbulent curves begin (Moody 1944); below it the answer warns. */
export const TURBULENT_REYNOLDS_LIMIT = 4000;
/** Reynolds number where the ramp from 64/Re up to the turbulent value at 2300 begins: 1 % below it (Riffle's own rule, above). */
export const LAMINAR_STEP_START = 0.99 * LAMINAR_REYNOLDS_LIMIT;

export type FrictionFactorMethod = 'colebrook' | 'swamee-jain';

/** Exponent of flow in the SI Hazen-Williams formula (see hazenWilliamsResistance for the source). */
export const HAZEN_WILLIAMS_FLOW_EXPONENT = 1.852;
/** Exponent of diameter in the SI Hazen-Williams formula. */
const HAZEN_WILLIAMS_DIAMETER_EXPONENT = 4.8704;
const HAZEN_WILLIAMS_SI_CONSTANT = 10.67;

/**
 * Hazen-Williams resistance coefficient r such that h_f = r Q^1.852.
 *   r = 10.67 L / (C^1.852 D^4.8704)
 * (SI form; L and D in m, Q in m3/s, h_f in m). This is the form Riffle uses.
 * The US form h_f = 10.44 L Q^1.85 / (C^1.85 d^4.8655) (ft, gpm, in) differs
 * from it because of the rounded exponents: the SI form is 0.6 % lower at
 * 100 gpm in 3" pipe, and the two part by up to ~1.7 % at the extremes of
 * 5-3000 gpm in 1/2"-8" pipe (the tests pin these figures).
 *
 * Source: A. Hazen, G. S. Williams, "Hydraulic Tables" (1905, 3rd ed. 1920); SI constant as in
 * USDA NRCS National Engineering Handbook Part 623 ch. 3 and most hydraulics texts.
 * Validity: water at ~4-25 C in turbulent flow (the formula has no viscosity term); C 1-200
 * accepted, 120-150 for the pipes of the catalogue (see pipe-catalogue).
 *
 * @param length - pipe length, m (>= 0)
 * @param insideDiameter - inside diameter, m (> 0)
 * @param hazenWilliamsC - Hazen-Williams C, dimensionless (> 0)
 * @param field - JSON pointer of the segment, prefixed to the field named by a rejected input
 * @returns resistance r, m per (m3/s)^1.852
 * @example
 * // 100 m of 3" Schedule 40 PVC (bore 3.068 in, ASTM D1785), C 150; checked by hand:
 * // 10.67 * 100 / (150^1.852 * 0.0779272^4.8704) in python3 gives 2.48863e4
 * hazenWilliamsResistance(100, 0.0779272, 150) // => 2.48863e4
 */
export function hazenWilliamsResistance(
  length: number,
  insideDiameter: number,
  hazenWilliamsC: number,
  field = '',
): number {
  requireNonNegative(length, `${field}/length`, 'length');
  requirePositive(insideDiameter, `${field}/insideDiameter`, 'inside diameter');
  requirePositive(hazenWilliamsC, `${field}/hazenWilliamsC`, 'Hazen-Williams C');
  return (
    (HAZEN_WILLIAMS_SI_CONSTANT * length) /
    (Math.pow(hazenWilliamsC, HAZEN_WILLIAMS_FLOW_EXPONENT) *
      Math.pow(insideDiameter, HAZEN_WILLIAMS_DIAMETER_EXPONENT))
  );
}

/**
 * Hazen-Williams head loss, SI form: h_f = 10.67 L Q^1.852 / (C^1.852 D^4.8704), m, i.e.
 * hazenWilliamsResistance times Q^1.852. Source and validity (water ~4-25 C, turbulent flow) as
 * hazenWilliamsResistance: Hazen & Williams, "Hydraulic Tables" (3rd ed. 1920); SI constant of
 * USDA NRCS NEH Part 623 ch. 3.
 * @param length - pipe length, m (>= 0)
 * @param flow - volumetric flow, m3/s (>= 0)
 * @param insideDiameter - inside diameter, m (> 0)
 * @param hazenWilliamsC - Hazen-Williams C, dimensionless (> 0)
 * @param field - JSON pointer of the segment, prefixed to the field named by a rejected input
 * @returns friction head loss, m
 * @example
 * // 100 m of 3" Schedule 40 PVC, C 150, at 10 L/s (158.5 gpm); checked by hand in python3
 * // with the same formula: 10.67 * 100 * 0.01^1.852 / (150^1.852 * 0.0779272^4.8704) = 4.9200 m
 * headLossHazenWilliams(100, 0.01, 0.0779272, 150) // => 4.9200
 */
export function headLossHazenWilliams(
  length: number,
  flow: number,
  insideDiameter: number,
  hazenWilliamsC: number,
  field = '',
): number {
  requireNonNegative(flow, `${field}/flow`, 'flow');
  return (
    hazenWilliamsResistance(length, insideDiameter, hazenWilliamsC, field) *
    Math.pow(flow, HAZEN_WILLIAMS_FLOW_EXPONENT)
  );
}

/**
 * Reynolds number Re = |V| D / nu, the ratio of inertial to viscous forces in pipe flow
 * (definition; O. Reynolds, Phil. Trans. R. Soc. 174 (1883); White, Fluid Mechanics, 7th ed.,
 * ch. 6). Valid for any Newtonian fluid; no checks (it sits on the friction hot path).
 * @param velocity - mean velocity, m/s (its sign is ignored)
 * @param insideDiameter - inside diameter, m
 * @param kinematicViscosity - kinematic viscosity, m2/s
 * @returns Reynolds number, dimensionless
 * @example
 * // 1 m/s in a 50 mm bore, nu 1e-6 m2/s (water near 20 C): exact by the definition
 * reynoldsNumber(1, 0.05, 1e-6) // => 50000
 */
export function reynoldsNumber(velocity: number, insideDiameter: number, kinematicViscosity: number): number {
  return (Math.abs(velocity) * insideDiameter) / kinematicViscosity;
}

/**
 * Laminar Darcy friction factor f = 64/Re, from the Hagen-Poiseuille solution for fully developed
 * laminar flow in a round pipe (White, Fluid Mechanics, 7th ed., ch. 6). Valid for
 * Re < ~2300, independent of roughness.
 * @param reynolds - Reynolds number, dimensionless (> 0)
 * @returns Darcy friction factor, dimensionless
 * @example
 * // exact: 64 / 2000
 * frictionFactorLaminar(2000) // => 0.032
 */
export function frictionFactorLaminar(reynolds: number): number {
  requirePositive(reynolds, '/reynolds', 'Reynolds number');
  return 64 / reynolds;
}

/**
 * Swamee-Jain explicit approximation of Colebrook-White:
 *   f = 0.25 / [log10(eps/(3.7 D) + 5.74 / Re^0.9)]^2
 * Source: P. K. Swamee, A. K. Jain, "Explicit equations for pipe-flow
 * problems", J. Hydraulics Div. ASCE 102(HY5), 657-664 (1976). Within about
 * 1 % of Colebrook for 5e3 <= Re <= 1e8 and 1e-6 <= eps/D <= 1e-2 (the range the
 * authors state); outside it the error grows.
 * @param reynolds - Reynolds number, dimensionless (> 0; turbulent, see above)
 * @param relativeRoughness - relative roughness eps/D, dimensionless (>= 0)
 * @returns Darcy friction factor, dimensionless
 * @example
 * // python3-fluids 1.0.22 Swamee_Jain_1976(1e5, 1e-4) gives 0.0184524 (Colebrook: 0.0185139)
 * frictionFactorSwameeJain(1e5, 1e-4) // => 0.0184524
 */
export function frictionFactorSwameeJain(reynolds: number, relativeRoughness: number): number {
  requirePositive(reynolds, '/reynolds', 'Reynolds number');
  requireNonNegative(relativeRoughness, '/relativeRoughness', 'relative roughness');
  const logTerm = Math.log10(relativeRoughness / 3.7 + 5.74 / Math.pow(reynolds, 0.9));
  return 0.25 / (logTerm * logTerm);
}

const LN10 = Math.LN10;

/**
 * Colebrook-White friction factor, solved to machine precision:
 *   1/sqrt(f) = -2 log10(eps/(3.7 D) + 2.51 / (Re sqrt(f)))
 * Newton's method on x = 1/sqrt(f), F(x) = x + 2 log10(eps/3.7D + 2.51 x/Re),
 * started from Swamee-Jain and stopped when the step is below 1e-15 relative
 * (F is increasing and concave, so Newton converges from any start; it takes
 * 2-4 steps here). Source: C. F. Colebrook, "Turbulent flow in pipes, with
 * particular reference to the transition region between the smooth and rough
 * pipe laws", J. Inst. Civil Eng. 11(4), 133-156 (1939). Valid for turbulent
 * flow, Re >= ~4000 (Riffle's tables go to 1e8), any eps/D (0 for a smooth pipe).
 * @param reynolds - Reynolds number, dimensionless (> 0)
 * @param relativeRoughness - relative roughness eps/D, dimensionless (>= 0)
 * @returns Darcy friction factor, dimensionless
 * @example
 * // python3-fluids 1.0.22 Colebrook(1e5, 1e-4) gives 0.0185139; Colebrook(1e6, 1e-3) 0.0199435
 * frictionFactorColebrook(1e5, 1e-4) // => 0.0185139
 * frictionFactorColebrook(1e6, 1e-3) // => 0.0199435
 */
export function frictionFactorColebrook(reynolds: number, relativeRoughness: number): number {
  let x = 1 / Math.sqrt(frictionFactorSwameeJain(reynolds, relativeRoughness));
  const roughTerm = relativeRoughness / 3.7;
  const viscousTerm = 2.51 / reynolds;
  for (let iteration = 0; iteration < 50; iteration += 1) {
    const inner = roughTerm + viscousTerm * x;
    const residual = x + (2 * Math.log(inner)) / LN10;
    const slope = 1 + (2 * viscousTerm) / (LN10 * inner);
    const step = residual / slope;
    x -= step;
    if (Math.abs(step) <= 1e-15 * x) {
      break;
    }
  }
  return 1 / (x * x);
}

/**
 * Friction factor on the ramp that closes the step from laminar to turbulent friction: a straight
 * line in Re through (2277, 64/2277) and (2300, turbulentAt2300). Riffle's own rule (the top of
 * this file), not a published correlation; it keeps the curve continuous and raises friction
 * only. Valid for 2277 <= Re <= 2300.
 * @param reynolds - Reynolds number, dimensionless
 * @param turbulentAt2300 - the turbulent correlation's friction factor at Re 2300, dimensionless
 * @returns [Darcy friction factor, its slope d f / d Re], both dimensionless
 * @example
 * // at the ramp's ends: 64/2277 and the turbulent value; halfway between them (checked by hand)
 * laminarStepFrictionFactor(2277, 0.05)[0] // => 0.0281072
 * laminarStepFrictionFactor(2288.5, 0.05)[0] // => 0.0390536
 * laminarStepFrictionFactor(2300, 0.05)[0] // => 0.05
 */
export function laminarStepFrictionFactor(reynolds: number, turbulentAt2300: number): [number, number] {
  const laminarAtStart = 64 / LAMINAR_STEP_START;
  const slope = (turbulentAt2300 - laminarAtStart) / (LAMINAR_REYNOLDS_LIMIT - LAMINAR_STEP_START);
  return [laminarAtStart + slope * (reynolds - LAMINAR_STEP_START), slope];
}

/**
 * Darcy friction factor with Riffle's regime rule (top of this file): 64/Re
 * below Re 2277, Colebrook-White (default) or Swamee-Jain from 2300, the
 * transition band 2300-4000 taking the turbulent value, a straight ramp between 2277 and 2300. Sources as frictionFactorLaminar, frictionFactorColebrook
 * (Colebrook 1939, J. ICE 11(4)) and frictionFactorSwameeJain (J. Hydraulics Div. 102(HY5)).
 * @param reynolds - Reynolds number, dimensionless (> 0)
 * @param relativeRoughness - relative roughness eps/D, dimensionless (>= 0)
 * @param method - turbulent correlation: 'colebrook' (default) or 'swamee-jain'
 * @returns Darcy friction factor, dimensionless
 * @example
 * // laminar, exact 64/1000; turbulent as python3-fluids Colebrook(1e5, 1e-4) = 0.0185139;
 * // transitional as python3-fluids 1.0.22 friction_factor(3000, 1e-4) = 0.0436091
 * darcyFrictionFactor(1000, 1e-4) // => 0.064
 * darcyFrictionFactor(3000, 1e-4) // => 0.0436091
 * darcyFrictionFactor(1e5, 1e-4) // => 0.0185139
 * darcyFrictionFactor(1e5, 1e-4, 'swamee-jain') // => 0.0184524
 */
export function darcyFrictionFactor(
  reynolds: number,
  relativeRoughness: number,
  method: FrictionFactorMethod = 'colebrook',
): number {
  if (reynolds < LAMINAR_STEP_START) {
    return frictionFactorLaminar(reynolds);
  }
  const turbulent = method === 'colebrook' ? frictionFactorColebrook : frictionFactorSwameeJain;
  if (reynolds >= LAMINAR_REYNOLDS_LIMIT) {
    return turbulent(reynolds, relativeRoughness);
  }
  return laminarStepFrictionFactor(reynolds, turbulent(LAMINAR_REYNOLDS_LIMIT, relativeRoughness))[0];
}

/**
 * Darcy-Weisbach head loss h_f = f (L/D) V^2 / 2g, m, with V = 4Q / (pi D^2) and f from
 * darcyFrictionFactor (its regime rule). Source: H. Darcy (1857), J. Weisbach (1845); White,
 * Fluid Mechanics, 7th ed., ch. 6 (head loss and the friction factor). Valid for any Newtonian
 * liquid in full pipes at any Reynolds number (Colebrook's range above 4000, see
 * frictionFactorColebrook).
 * @param length - pipe length, m (>= 0)
 * @param flow - volumetric flow, m3/s (>= 0)
 * @param insideDiameter - inside diameter, m (> 0)
 * @param roughness - absolute roughness eps, m (>= 0)
 * @param kinematicViscosity - kinematic viscosity of the liquid, m2/s (> 0)
 * @param method - turbulent correlation: 'colebrook' (default) or 'swamee-jain'
 * @param field - JSON pointer of the segment, prefixed to the field named by a rejected input
 * @returns friction head loss, m
 * @example
 * // 100 m of 3" Schedule 40 steel (bore 0.0779272 m), eps 0.045 mm, 10 L/s, water at 20 C;
 * // python3-fluids 1.0.22 Colebrook at the same Re (162835) gives f = 0.0195645 and 5.62719 m
 * headLossDarcyWeisbach(100, 0.01, 0.0779272, 4.5e-5, 1.0034e-6) // => 5.62719
 */
export function headLossDarcyWeisbach(
  length: number,
  flow: number,
  insideDiameter: number,
  roughness: number,
  kinematicViscosity: number,
  method: FrictionFactorMethod = 'colebrook',
  field = '',
): number {
  requireNonNegative(length, `${field}/length`, 'length');
  requireNonNegative(flow, `${field}/flow`, 'flow');
  requirePositive(insideDiameter, `${field}/insideDiameter`, 'inside diameter');
  requireNonNegative(roughness, `${field}/roughness`, 'roughness');
  requirePositive(kinematicViscosity, `${field}/kinematicViscosity`, 'kinematic viscosity');
  if (flow === 0) {
    return 0;
  }
  const area = (Math.PI * insideDiameter * insideDiameter) / 4;
  const velocity = flow / area;
  const f = darcyFrictionFactor(
    reynoldsNumber(velocity, insideDiameter, kinematicViscosity),
    roughness / insideDiameter,
    method,
  );
  return (f * length * velocity * velocity) / (insideDiameter * 2 * STANDARD_GRAVITY);
}
