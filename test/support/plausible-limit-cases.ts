import { limitInUnits, PLAUSIBLE_LIMITS, type PlausibleLimitName } from '../../shared/hydraulics';
import { unitSystems, type UnitSystem } from '../../src/app/design/unit-systems';

/*
 * One table of cases over every plausibility limit, read by the client's form check (Angular
 * spec) and by the API's (mocha): a value just outside each bound and one just inside, in both
 * unit systems of the forms, so both sides are held to the same inputs.
 */

export interface PlausibleLimitCase {
  limit: PlausibleLimitName;
  system: UnitSystem;
  units: (typeof unitSystems)[UnitSystem]['units'];
  side: 'max' | 'min';
  /** The bound in `units`. */
  edge: number;
  /** Just past the bound, in `units`: refused. */
  outside: number;
  /** Just short of the bound, in `units`: accepted. */
  inside: number;
}

/** A step of one part in a million of the bound (at least 1e-6): well clear of rounding, well inside any slip. */
function stepAt(edge: number): number {
  return Math.max(Math.abs(edge), 1) * 1e-6;
}

export const PLAUSIBLE_LIMIT_CASES: readonly PlausibleLimitCase[] = (
  Object.keys(PLAUSIBLE_LIMITS) as PlausibleLimitName[]
).flatMap((limit) => {
  const { min, max, quantity } = PLAUSIBLE_LIMITS[limit];
  return (['us', 'si'] as const).flatMap((system) => {
    const units = unitSystems[system].units;
    const bounds: Array<{ side: 'max' | 'min'; bound: number; outward: 1 | -1 }> = [
      { side: 'max', bound: max, outward: 1 },
    ];
    if (min !== null) bounds.push({ side: 'min', bound: min, outward: -1 });
    return bounds.map(({ side, bound, outward }) => {
      const edge = limitInUnits(quantity, bound, units);
      const step = stepAt(edge);
      return { limit, system, units, side, edge, outside: edge + outward * step, inside: edge - outward * step };
    });
  });
});
