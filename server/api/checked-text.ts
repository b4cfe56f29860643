import { visibleTextProblem } from '../../shared/text-rules';
import { ProblemError } from './problem-details';

/** The name trimmed, or a 422 naming the field when it breaks the shared text rule. */
export function checkedName(text: string, pointer: string): string {
  const problem = visibleTextProblem(text);
  if (problem) throw new ProblemError(422, 'Invalid name', `${pointer} ${problem}`, [{ pointer, detail: problem }]);
  return text.trim();
}
