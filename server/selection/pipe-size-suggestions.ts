import type { PipeSizeSuggestion, PipeSystem } from '../../shared/api/api-schemas';
import {
  branchFlowsAt,
  PIPE_SERIES,
  pipeSizeById,
  smallestSizeForVelocity,
  VELOCITY_WARNING_LIMIT,
  type CompiledBranchedSystem,
} from '../../shared/hydraulics';
import type { AnswerUnits } from '../calculations/request-units';

/*
 * Where the pipe, not the pump, is the problem: each catalogue-sized segment whose velocity at the
 * top of the band is over the common-practice limit, with the smallest size of its own series that
 * keeps it under (smallestSizeForVelocity). A segment with a custom bore has no series to suggest from.
 */

type Segment = PipeSystem['segments'][number];

function sizeLabel(id: string): string {
  const size = pipeSizeById(id);
  const series = PIPE_SERIES.find((candidate) => candidate.id === size.series);
  return `${size.nominalLabel} ${series?.label ?? size.series}`;
}

function suggestionFor(segment: Segment, pointer: string, flow: number, to: AnswerUnits): PipeSizeSuggestion[] {
  if (segment.pipe === undefined || flow <= 0) return [];
  const present = pipeSizeById(segment.pipe, `${pointer}/pipe`);
  const velocity = flow / ((Math.PI * present.insideDiameter ** 2) / 4);
  if (velocity <= VELOCITY_WARNING_LIMIT) return [];
  const larger = smallestSizeForVelocity(present.series, flow);
  return [
    {
      segment: pointer,
      pipe: present.id,
      pipeLabel: sizeLabel(present.id),
      flow: to.flow(flow),
      velocity: to.length(velocity),
      suggestedPipe: larger?.id ?? null,
      suggestedLabel: larger ? sizeLabel(larger.id) : null,
    },
  ];
}

/**
 * The suggestions for a request's system at the band's top total flow (m3/s): the common run (or
 * the single route) carries the total, each branch the flow the split gives it there.
 */
export function pipeSizeSuggestions(
  system: PipeSystem,
  branched: CompiledBranchedSystem | null,
  totalFlow: number,
  to: AnswerUnits,
): PipeSizeSuggestion[] {
  const common = system.segments.flatMap((segment, index) =>
    suggestionFor(segment, `/body/system/segments/${index}`, totalFlow, to),
  );
  if (!branched || !system.branches) return common;
  const split = branchFlowsAt(branched, totalFlow);
  return common.concat(
    system.branches.flatMap((branch, branchIndex) =>
      branch.segments.flatMap((segment, index) =>
        suggestionFor(
          segment,
          `/body/system/branches/${branchIndex}/segments/${index}`,
          split.branches[branchIndex].flow,
          to,
        ),
      ),
    ),
  );
}
