import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import type { ProblemDetails } from '../../shared/api/api-schemas';

export type FieldProblem = { pointer: string; detail: string };

/** An error the client can act on, answered as RFC 9457 problem details. */
export class ProblemError extends Error {
  override readonly name = 'ProblemError';

  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail?: string,
    readonly fieldProblems: FieldProblem[] = [],
    /** A short slug for the problem `type`, e.g. `no-operating-point`. */
    readonly slug: string = slugOf(title),
    readonly extensions: Record<string, unknown> = {},
  ) {
    super(detail ? `${title}: ${detail}` : title);
  }

  toProblem(instance?: string): ProblemDetails & Record<string, unknown> {
    return {
      type: `/api/v1/problems/${this.slug}`,
      title: this.title,
      status: this.status,
      ...(this.detail ? { detail: this.detail } : {}),
      ...(instance ? { instance } : {}),
      ...(this.fieldProblems.length > 0 ? { pointer: this.fieldProblems[0].pointer, errors: this.fieldProblems } : {}),
      ...this.extensions,
    };
  }
}

function slugOf(title: string): string {
  return title
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
}

export const notFoundHandler: RequestHandler = (request, _response, next) => {
  next(
    new ProblemError(
      404,
      'Not found',
      `No API operation answers ${request.method} ${request.originalUrl.split('?')[0]}`,
    ),
  );
};

/** The one error handler: known problems as they are, malformed bodies as 400, the rest as a logged 500. */
export function createProblemHandler(logger: Logger): ErrorRequestHandler {
  return (error: unknown, request, response, next) => {
    if (response.headersSent) {
      next(error);
      return;
    }
    const problem = toProblemError(error);
    if (problem.status >= 500) logger.error({ err: error, url: request.originalUrl }, 'request failed');
    response.status(problem.status).type('application/problem+json').json(problem.toProblem(request.originalUrl));
  };
}

function toProblemError(error: unknown): ProblemError {
  if (error instanceof ProblemError) return error;
  const httpError = error as { status?: number; type?: string; message?: string };
  if (httpError?.type === 'entity.parse.failed') {
    return new ProblemError(400, 'Malformed JSON', 'The request body is not valid JSON', [
      { pointer: '/body', detail: httpError.message ?? 'not JSON' },
    ]);
  }
  if (httpError?.type === 'entity.too.large') {
    return new ProblemError(413, 'Request body too large', 'The request body is larger than the server accepts');
  }
  if (typeof httpError?.status === 'number' && httpError.status >= 400 && httpError.status < 500) {
    return new ProblemError(httpError.status, httpError.message ?? 'Bad request');
  }
  return new ProblemError(500, 'Internal error', 'The server could not complete the request; it has been logged');
}
