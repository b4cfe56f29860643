import type { Request, RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { ApiOperation } from '../api/openapi-document';
import { ProblemError } from '../api/problem-details';

/** The limits an operation may name with `x-riffle-rate-limit` in openapi.yaml. */
export const rateLimitNames = ['sign-in', 'email-link', 'invitation', 'proposal-mail', 'client-link'] as const;
export type RateLimitName = (typeof rateLimitNames)[number];
export type RateLimitSettings = Record<RateLimitName, { limit: number; windowMs: number }>;

const minute = 60_000;

/**
 * Per client address, but for `proposal-mail`, which counts per signed-in user. Sign-in counts
 * only failures, so a team behind one address can still sign in; the e-mail routes count every
 * request, since each may send a message; `client-link` counts every opening of a client's
 * read-only page, so a token cannot be guessed at speed.
 */
export const defaultRateLimits: RateLimitSettings = {
  'sign-in': { limit: 10, windowMs: 15 * minute },
  'email-link': { limit: 10, windowMs: 15 * minute },
  invitation: { limit: 30, windowMs: 60 * minute },
  'proposal-mail': { limit: 20, windowMs: 60 * minute },
  'client-link': { limit: 60, windowMs: minute },
};

/** Limits counted per user: their operations' guard runs first, so the user is known. */
export const perUserRateLimits: ReadonlySet<RateLimitName> = new Set(['proposal-mail']);

export function rateLimitNameOf(operation: ApiOperation): RateLimitName | undefined {
  const name = (operation.definition as { 'x-riffle-rate-limit'?: unknown })['x-riffle-rate-limit'];
  if (name === undefined) return undefined;
  if (!(rateLimitNames as readonly unknown[]).includes(name)) {
    throw new Error(
      `${operation.operationId} in openapi.yaml: x-riffle-rate-limit must be one of ${rateLimitNames.join(', ')}`,
    );
  }
  return name as RateLimitName;
}

/** One limiter (and one counter store) per named limit, shared by the operations that name it; `overrides` replace defaults. */
export function createRateLimiters(
  overrides: Partial<RateLimitSettings> = {},
): (operation: ApiOperation) => RequestHandler | undefined {
  const settings: RateLimitSettings = { ...defaultRateLimits, ...overrides };
  const limiters = new Map<RateLimitName, RequestHandler>();
  const limiterFor = (name: RateLimitName): RequestHandler => {
    const { limit, windowMs } = settings[name];
    const limiter = rateLimit({
      windowMs,
      limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      skipSuccessfulRequests: name === 'sign-in',
      ...(perUserRateLimits.has(name)
        ? { keyGenerator: (request: Request) => `user-${(request.user as { id?: number } | undefined)?.id ?? 'none'}` }
        : {}),
      handler: (_request, response, next) => {
        const retryAfter = response.getHeader('Retry-After');
        next(
          new ProblemError(
            429,
            'Too many attempts',
            `Too many attempts from ${perUserRateLimits.has(name) ? 'this account' : 'this address'}; try again in ${retryAfter ?? Math.ceil(windowMs / 1000)} seconds`,
            [],
            'too-many-attempts',
            { limit: name },
          ),
        );
      },
    });
    limiters.set(name, limiter);
    return limiter;
  };
  return (operation) => {
    const name = rateLimitNameOf(operation);
    return name ? (limiters.get(name) ?? limiterFor(name)) : undefined;
  };
}
