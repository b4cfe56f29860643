import { flowFromSI, headFromSI, type FlowUnit, type HeadUnit } from '../../../shared/hydraulics';

/** The unit pairs the catalog pages offer; conversions are the engine's (shared/hydraulics/units.ts). */
export interface DisplayUnits {
  label: string;
  flow: FlowUnit;
  head: HeadUnit;
}

export const displayUnitChoices: readonly DisplayUnits[] = [
  { label: 'm3/h and m', flow: 'm3/h', head: 'm' },
  { label: 'L/min and m', flow: 'L/min', head: 'm' },
  { label: 'L/h and m', flow: 'L/h', head: 'm' },
  { label: 'US gpm and ft', flow: 'gpm', head: 'ft' },
  { label: 'US gph and ft', flow: 'gph', head: 'ft' },
];

/** A flow in m3/s shown in `unit`, three significant figures. */
export function showFlow(flow: number | null, unit: FlowUnit): string {
  return flow === null ? '-' : `${Number(flowFromSI(flow, unit).toPrecision(3))}`;
}

/** A head in m shown in `unit`, three significant figures. */
export function showHead(head: number | null, unit: HeadUnit): string {
  return head === null ? '-' : `${Number(headFromSI(head, unit).toPrecision(3))}`;
}

export const kindLabels: Record<string, string> = {
  submersible: 'Submersible',
  'external-centrifugal': 'External centrifugal',
  'mixed-flow': 'Mixed-flow',
};
