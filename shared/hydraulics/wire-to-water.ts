import { DEFAULT_MOTOR_EFFICIENCY_BY_KIND } from './power-and-energy';
import type { PumpCurveFit } from './pump-curve-fit';

/*
 * Every energy figure is wire-to-water: a curve that gives electrical power is taken as it is; one
 * that gives shaft power (or efficiency only) is divided by the motor's efficiency, the catalog's own
 * figure for the pump when it has one, else the designer's, else the pump kind's assumed value
 * (DEFAULT_MOTOR_EFFICIENCY_BY_KIND). So no two bases are ranked together.
 */

export type MotorEfficiencySource = 'curve-is-electrical' | 'catalog' | 'designer' | 'kind-default';

export interface MotorEfficiencyUsed {
  /** 0-1; 1 when the curve's power already is electrical. */
  value: number;
  source: MotorEfficiencySource;
}

/** What the rule reads of a pump: its curve's power basis, its kind and the catalog's motor efficiency (0-1). */
export interface MotorEfficiencyFacts {
  fit: Pick<PumpCurveFit, 'powerBasis'>;
  kind: string;
  motorEfficiency: number | null;
}

/**
 * The motor efficiency to divide a pump's curve power by (see the note at the top; the kind's
 * defaults are common practice, from memory, as DEFAULT_MOTOR_EFFICIENCY_BY_KIND says).
 * @param pump - its curve's power basis, its kind, the catalog's motor efficiency (0-1) or null
 * @param designer - the designer's motor efficiency, 0-1, or null
 * @returns the efficiency used, 0-1, and where it came from
 * @example
 * motorEfficiencyFor({ fit: { powerBasis: 'electrical' }, kind: 'submersible', motorEfficiency: null }, 0.8).value // => 1
 * motorEfficiencyFor({ fit: {}, kind: 'submersible', motorEfficiency: null }, null).value // => 0.7
 * motorEfficiencyFor({ fit: {}, kind: 'submersible', motorEfficiency: null }, 0.78).source // => 'designer'
 * motorEfficiencyFor({ fit: {}, kind: 'submersible', motorEfficiency: 0.82 }, 0.78).value // => 0.82
 */
export function motorEfficiencyFor(pump: MotorEfficiencyFacts, designer: number | null): MotorEfficiencyUsed {
  // an electrical curve's efficiency is wire-to-water too (PumpCurveFit.powerBasis)
  if (pump.fit.powerBasis === 'electrical') return { value: 1, source: 'curve-is-electrical' };
  if (pump.motorEfficiency !== null) return { value: pump.motorEfficiency, source: 'catalog' };
  if (designer !== null) return { value: designer, source: 'designer' };
  return { value: DEFAULT_MOTOR_EFFICIENCY_BY_KIND[pump.kind] ?? 1, source: 'kind-default' };
}
