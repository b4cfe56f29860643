import { HttpErrorResponse } from '@angular/common/http';
import type { ProblemDetails } from '../../../shared/api/api-schemas';

function isProblemDetails(body: unknown): body is ProblemDetails {
  return typeof body === 'object' && body !== null && 'title' in body && 'status' in body;
}

/** One sentence for the user: the problem's title and detail, and the field it names. */
export function describeHttpError(error: HttpErrorResponse): string {
  if (isProblemDetails(error.error)) {
    const problem = error.error;
    const field = problem.pointer ? ` (${problem.pointer})` : '';
    return problem.detail ? `${problem.title}: ${problem.detail}${field}` : `${problem.title}${field}`;
  }
  if (error.status === 0) return 'The Riffle server cannot be reached. Check your connection and try again.';
  return `The server answered ${error.status} ${error.statusText}.`;
}
