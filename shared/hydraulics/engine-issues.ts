/*
 * What the engine has to say about a result, as data: a code, its numbers (SI) and, where one
 * input is to blame, a JSON pointer into the engine's input. Sentences are made at the edge from
 * one table (shared/messages/engine-issue-text.ts), in the units the reader asked for.
 */

/** The numbers each engine issue carries, by code (SI: m3/s, m/s, C). */
export interface EngineIssueParams {
  /** Hazen-Williams used outside the water temperatures it was fitted to. */
  'hazen-williams-temperature': { temperature: number };
  /** A segment's velocity above the common-practice limit for plastic pipe. */
  'segment-velocity': { segment: number; flow: number; velocity: number; limit: number };
}

export type EngineIssueCode = keyof EngineIssueParams;

/** One engine issue; `pointer` names the input it concerns (e.g. `/segments/0`). */
export type EngineIssue = {
  [Code in EngineIssueCode]: { code: Code; params: EngineIssueParams[Code]; pointer?: string };
}[EngineIssueCode];
