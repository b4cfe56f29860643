import { figure, type NumberTable } from '../../shared/chart-numbers';
import type { ChartModel, ChartPoint } from './comparison-chart';

/** Rows of the head-at-flow table: the chart's flow axis in this many even steps from zero. */
const flowSteps = 8;

/**
 * The head of a drawn curve at `flow`, read off its samples by straight lines between them (the
 * samples are as close as the chart draws them); null outside the curve's flows.
 */
export function headOnCurve(curve: readonly ChartPoint[], flow: number): number | null {
  for (let index = 1; index < curve.length; index++) {
    const [left, right] = [curve[index - 1], curve[index]];
    if (flow >= left.flow && flow <= right.flow) {
      const share = right.flow === left.flow ? 0 : (flow - left.flow) / (right.flow - left.flow);
      return left.head + share * (right.head - left.head);
    }
  }
  return null;
}

/** The comparison chart's numbers: each candidate's points, and every curve's head over the flow axis. */
export function comparisonNumbers(model: ChartModel): NumberTable[] {
  const { flowUnit, headUnit } = model;
  const points: NumberTable = {
    caption: 'Operating points',
    headers: [
      'Candidate',
      `Flow (${flowUnit})`,
      `Head (${headUnit})`,
      `One failed, flow (${flowUnit})`,
      `One failed, head (${headUnit})`,
      `Preferred region (${flowUnit})`,
    ],
    rows: model.candidates.map((candidate) => [
      candidate.label,
      figure(candidate.operatingPoint.flow),
      figure(candidate.operatingPoint.head),
      figure(candidate.oneFailed?.flow),
      figure(candidate.oneFailed?.head),
      candidate.preferredRange
        ? `${figure(candidate.preferredRange.flowMin)} to ${figure(candidate.preferredRange.flowMax)}`
        : '–',
    ]),
  };
  const topFlow = model.systemCurve.at(-1)?.flow ?? model.band.flowMax;
  const flows = Array.from({ length: flowSteps + 1 }, (_, step) => (topFlow * step) / flowSteps);
  const curves: NumberTable = {
    caption: `Head at each flow (duty band ${figure(model.band.flowMin)} to ${figure(model.band.flowMax)} ${flowUnit})`,
    headers: [
      `Flow (${flowUnit})`,
      `System curve (${headUnit})`,
      ...model.candidates.map((candidate) => `${candidate.label} (${headUnit})`),
    ],
    rows: flows.map((flow) => [
      figure(flow),
      figure(headOnCurve(model.systemCurve, flow)),
      ...model.candidates.map((candidate) => figure(headOnCurve(candidate.curve, flow))),
    ]),
  };
  return [points, curves];
}
