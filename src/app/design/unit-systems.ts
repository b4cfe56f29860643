import type { CalculationUnits } from '../../../shared/api/api-schemas';

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
    units: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' },
    volume: 'gal',
    weirWidth: 'in',
  },
  si: {
    label: 'Metric (L/min, m, mm)',
    units: { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm', power: 'kW' },
    volume: 'm3',
    weirWidth: 'mm',
  },
};
