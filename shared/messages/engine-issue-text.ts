import type { EngineIssue, EngineIssueCode, EngineIssueParams } from '../hydraulics/engine-issues';

/** How a reader wants SI values written: each gives the number with its unit, e.g. `150 gpm`. */
export interface IssueValueText {
  /** A flow given in m3/s. */
  flow(flow: number): string;
  /** A velocity given in m/s. */
  velocity(velocity: number): string;
}

/** SI values written plainly: flows to three significant figures, velocities to 0.01 m/s. */
export const SI_VALUE_TEXT: IssueValueText = {
  flow: (flow) => `${Number(flow.toPrecision(3))} m3/s`,
  velocity: (velocity) => `${velocity.toFixed(2)} m/s`,
};

/** The one sentence of every engine issue, from its numbers and the reader's units. */
const ENGINE_ISSUE_TEXT: {
  [Code in EngineIssueCode]: (params: EngineIssueParams[Code], units: IssueValueText) => string;
} = {
  'hazen-williams-temperature': ({ temperature }) =>
    `Hazen-Williams is fitted to water at about 4-25 C; at ${temperature} C prefer Darcy-Weisbach`,
  'segment-velocity': ({ segment, flow, velocity, limit }, units) =>
    `at ${units.flow(flow)} segment ${segment}: velocity ${units.velocity(velocity)} exceeds ${units.velocity(limit)}, the common-practice limit for plastic pipe`,
};

/** The sentence a reader sees for one engine issue, with values written by `units`. */
export function engineIssueText(issue: EngineIssue, units: IssueValueText = SI_VALUE_TEXT): string {
  const text = ENGINE_ISSUE_TEXT[issue.code] as (params: EngineIssue['params'], units: IssueValueText) => string;
  return text(issue.params, units);
}
