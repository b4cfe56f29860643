import type { RequestHandler } from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import type { Sequelize } from 'sequelize';
import type { ApiOperation } from '../api/openapi-document';
import { createAccessGuards } from './access-guard';
import type { AccountsDependencies } from './accounts-dependencies';
import { createAdminHandlers } from './admin-handlers';
import { createApiTokenHandlers } from './api-token-handlers';
import { createAuthHandlers } from './auth-handlers';
import { createPreferenceHandlers } from './preference-handlers';
import type { RateLimitSettings } from './rate-limits';
import { createRateLimiters, perUserRateLimits, rateLimitNameOf } from './rate-limits';

export function createAccountHandlers(
  sequelize: Sequelize,
  dependencies: AccountsDependencies,
): Record<string, RequestHandler> {
  return {
    ...createAuthHandlers(sequelize, dependencies),
    ...createApiTokenHandlers(sequelize),
    ...createAdminHandlers(sequelize, dependencies),
    ...createPreferenceHandlers(),
  };
}

/**
 * `guardFor` of the route table: each operation's rate limit (`x-riffle-rate-limit`), then its
 * access guard (`security` and `x-riffle-access`), both read from the contract.
 */
export function createOperationGuards(
  document: OpenAPIV3_1.Document,
  rateLimits: Partial<RateLimitSettings>,
): (operation: ApiOperation) => RequestHandler | undefined {
  const limiterFor = createRateLimiters(rateLimits);
  const accessGuardFor = createAccessGuards(document.security);
  return (operation) => {
    const limiter = limiterFor(operation);
    const name = rateLimitNameOf(operation);
    // a per-user limit needs the caller the access guard finds; a per-address one runs before it
    const ordered =
      name && perUserRateLimits.has(name) ? [accessGuardFor(operation), limiter] : [limiter, accessGuardFor(operation)];
    const chain = ordered.filter((handler): handler is RequestHandler => handler !== undefined);
    if (chain.length <= 1) return chain[0];
    return (request, response, next) => {
      chain[0](request, response, (error?: unknown) => (error ? next(error) : chain[1](request, response, next)));
    };
  };
}
