import { convertDiameter, flowFromSI, flowToSI, volumeFromSI, type FlowUnit } from '../../../../shared/hydraulics';

/*
 * Rules of thumb that turn a filtration plan into a duty band. They are common practice of the
 * water-feature trade, not standards: the page says so beside each.
 */

export interface FlowBand {
  flowMin: number;
  flowMax: number;
}

/** Filter modules in parallel, each wanting a flow between a minimum and a maximum (the module maker's range). */
export function bandFromModules(moduleCount: number, perModuleMin: number, perModuleMax: number): FlowBand {
  return { flowMin: moduleCount * perModuleMin, flowMax: moduleCount * perModuleMax };
}

/**
 * Pond turnover: the whole volume passed through the filter `turnoversMin` to `turnoversMax`
 * times an hour (common practice: at least once an hour, two or three times for fish-heavy ponds).
 * @param volume in US gallons (`gal`) or cubic metres (`m3`)
 */
export function bandFromTurnover(
  volume: number,
  volumeUnit: 'gal' | 'm3',
  turnoversMin: number,
  turnoversMax: number,
  flowUnit: FlowUnit,
): FlowBand {
  const gallons = volumeUnit === 'gal' ? volume : volumeFromSI(volume, 'gal');
  const toUnit = (perHour: number) => flowFromSI(flowToSI(gallons * perHour, 'gph'), flowUnit);
  return { flowMin: toUnit(turnoversMin), flowMax: toUnit(turnoversMax) };
}

/** The sheets of water the trade names, in US gph per inch of weir width (common practice). */
export const weirSheets = [
  { id: 'light', label: 'Light sheet', gphPerInch: 50 },
  { id: 'average', label: 'Average sheet', gphPerInch: 100 },
  { id: 'heavy', label: 'Heavy sheet', gphPerInch: 150 },
  { id: 'very-heavy', label: 'Very heavy sheet', gphPerInch: 200 },
] as const;

/**
 * Waterfall or stream weir: width x flow per inch of width (common practice: about 100 gph per
 * inch for an average sheet, 50 light, 150-200 heavy).
 * @param width in inches (`in`) or millimetres (`mm`)
 */
export function bandFromWeir(
  width: number,
  widthUnit: 'in' | 'mm',
  gphPerInchMin: number,
  gphPerInchMax: number,
  flowUnit: FlowUnit,
): FlowBand {
  const inches = widthUnit === 'in' ? width : convertDiameter(width, 'mm', 'in');
  const toUnit = (gphPerInch: number) => flowFromSI(flowToSI(inches * gphPerInch, 'gph'), flowUnit);
  return { flowMin: toUnit(gphPerInchMin), flowMax: toUnit(gphPerInchMax) };
}
