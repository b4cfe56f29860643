import type { CalculationUnits, DutyBand, PipeSystem, SelectionCandidate } from '../../../../shared/api/api-schemas';
import { convertFlow, convertHead, flowFromSI, flowToSI, headFromSI } from '../../../../shared/hydraulics';
import { candidateKey } from '../selection-draft';
import { compileDraft } from '../system-draft';
import type { ChartCandidate, ChartModel, ChartPoint } from './comparison-chart';

const systemCurveSteps = 60;

/** A candidate's short name on charts and in tables: the model, how many run, and a standby. */
export function candidateLabel(candidate: SelectionCandidate): string {
  const { running, installed } = candidate.arrangement;
  const speed = candidate.speed ? ` at ${Math.round(candidate.speed.rpm)} rpm` : '';
  return `${candidate.model}${running > 1 ? ` x${running}` : ''}${installed > running ? ' + standby' : ''}${speed}`;
}

/** The design as the comparison needs it: the system and band in the design's units. */
export interface ComparedDesign {
  system: PipeSystem;
  band: DutyBand;
  units: CalculationUnits;
}

/** Converts flows and heads from the design's units to the shown ones. */
export function unitConverter(from: CalculationUnits, to: CalculationUnits) {
  return {
    flow: (value: number) => convertFlow(value, from.flow, to.flow),
    head: (value: number) => convertHead(value, from.head, to.head),
  };
}

/** What the comparison chart draws, in the shown units; null with no candidate. */
export function comparisonModel(
  design: ComparedDesign,
  candidates: readonly SelectionCandidate[],
  shown: CalculationUnits,
): ChartModel | null {
  if (candidates.length === 0) return null;
  const convert = unitConverter(design.units, shown);
  const point = (value: ChartPoint): ChartPoint => ({ flow: convert.flow(value.flow), head: convert.head(value.head) });
  const system = compileDraft(design.system, design.units);
  const topFlow = flowToSI(
    Math.max(
      design.band.flowMax * 1.3,
      ...candidates.flatMap((candidate) => candidate.curve.map((sample) => sample.flow)),
    ),
    design.units.flow,
  );
  const systemCurve = Array.from({ length: systemCurveSteps + 1 }, (_, step) => {
    const flow = (topFlow * step) / systemCurveSteps;
    return { flow: flowFromSI(flow, shown.flow), head: headFromSI(system.evaluate(flow), shown.head) };
  });
  return {
    systemCurve,
    band: { flowMin: convert.flow(design.band.flowMin), flowMax: convert.flow(design.band.flowMax) },
    flowUnit: shown.flow,
    headUnit: shown.head,
    candidates: candidates.map((candidate): ChartCandidate => ({
      key: candidateKey(candidate),
      label: candidateLabel(candidate),
      speedRatio: candidate.speed?.ratio ?? null,
      curve: candidate.curve.map(point),
      preferredRange: candidate.preferredRange
        ? {
            flowMin: convert.flow(candidate.preferredRange.flowMin),
            flowMax: convert.flow(candidate.preferredRange.flowMax),
          }
        : null,
      operatingPoint: point(candidate.operatingPoint),
      oneFailed: candidate.oneFailed ? point(candidate.oneFailed) : null,
    })),
  };
}
