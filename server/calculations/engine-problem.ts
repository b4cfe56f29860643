import { HydraulicsInputError } from '../../shared/hydraulics';
import { engineInputErrorText, type IssueValueText } from '../../shared/messages/engine-issue-text';
import { ProblemError } from '../api/problem-details';

/** Turns a field path of the engine's input (`/segments/0/extraK`) into a pointer into the request. */
export type PointerTranslator = (engineField: string) => string;

/**
 * A translator that prefixes the engine's path with where that input sits in the request and
 * renames the engine's words for the contract's (`extraK` -> `minorLossK`).
 */
export function pointerInto(prefix: string, renames: Readonly<Record<string, string>> = {}): PointerTranslator {
  return (engineField) =>
    prefix +
    engineField
      .split('/')
      .map((part) => renames[part] ?? part)
      .join('/');
}

/** A 422 for input the contract lets through but that cannot be computed. */
export function unprocessable(pointer: string, detail: string): ProblemError {
  return new ProblemError(
    422,
    'Input cannot be computed',
    `${pointer} ${detail}`,
    [{ pointer, detail }],
    'input-cannot-be-computed',
  );
}

/**
 * Runs engine code; a HydraulicsInputError becomes a 422 problem whose pointer names the
 * request field the engine rejected, so a client never sees the engine's own paths.
 */
export function withRequestPointers<T>(compute: () => T, translate: PointerTranslator, units?: IssueValueText): T {
  try {
    return compute();
  } catch (error) {
    // The detail is made again from the error's code, in the request's units when they are known.
    if (error instanceof HydraulicsInputError)
      throw unprocessable(translate(error.field), engineInputErrorText(error.issue, units));
    throw error;
  }
}
