/**
 * The one rule for names people type (user, project, supplier and token names, file names):
 * something visible, no angle brackets, no control characters, and no bidirectional embedding,
 * override or isolate controls (U+202A-U+202E, U+2066-U+2069), which make a name read other
 * than it is.
 */
const refused = '<>\\p{Cc}\\u202A-\\u202E\\u2066-\\u2069';

/** The rule as a pattern, for form validators. */
export const visibleTextPattern = new RegExp(`^[^${refused}]*[^\\s${refused}][^${refused}]*$`, 'u');

/** Why the text breaks the rule, or undefined when it keeps it. */
export function visibleTextProblem(text: string): string | undefined {
  if (/[\u202A-\u202E\u2066-\u2069]/u.test(text)) return 'must not contain bidirectional control characters';
  if (/\p{Cc}/u.test(text)) return 'must not contain control characters';
  if (/[<>]/.test(text)) return 'must not contain angle brackets';
  if (text.trim() === '') return 'must contain something visible';
  return undefined;
}
