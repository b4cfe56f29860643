import type { CalculationUnits } from '../../../shared/api/api-schemas';
import { DESIGN_UNITS } from '../../../shared/api/design-system';

/** The two ways a designer states numbers: the US trade's and metric. */
export type UnitSystem = 'us' | 'si';

export interface UnitSystemDefinition {
  label: string;
  units: Required<CalculationUnits>;
  /** Unit of pond volume in the flow planner. */
  volume: 'gal' | 'm3';
  /** Unit of weir width in the flow planner. */
  weirWidth: 'in' | 'mm';
}

export const unitSystems: Readonly<Record<UnitSystem, UnitSystemDefinition>> = {
  us: {
    label: 'US (gpm, ft, in)',
    units: DESIGN_UNITS.us,
    volume: 'gal',
    weirWidth: 'in',
  },
  si: {
    label: 'Metric (L/min, m, mm)',
    units: DESIGN_UNITS.si,
    volume: 'm3',
    weirWidth: 'mm',
  },
};
