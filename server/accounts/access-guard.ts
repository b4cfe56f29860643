import type { RequestHandler } from 'express';
import { Passport } from 'passport';
import { Strategy as BearerStrategy } from 'passport-http-bearer';
import type { ApiOperation } from '../api/openapi-document';
import { ProblemError } from '../api/problem-details';
import { readAccessDeclaration, type AccessDeclaration } from './access-declaration';
import type { AuthenticatedUser } from './authenticated-user';
import { userForBearerToken } from './bearer-credentials';

const challenge = 'Bearer realm="riffle"';

function unauthorized(detail: string, slug: string): ProblemError {
  return new ProblemError(401, 'Sign-in required', detail, [], slug, {});
}

/** Why this caller may not use an operation it is signed in for; undefined when it may. */
function refusal(user: AuthenticatedUser, access: Extract<AccessDeclaration, { public: false }>): string | undefined {
  if (!access.roles.includes(user.role))
    return `The ${user.role} role may not use this operation; it is open to: ${access.roles.join(', ')}`;
  if (user.via !== 'api-token') return undefined;
  if (access.scopes.length === 0) return 'This operation is not open to API tokens; sign in to use it';
  if (!access.scopes.some((scope) => user.scopes.includes(scope)))
    return `This API token needs one of the scopes: ${access.scopes.join(', ')}`;
  return undefined;
}

/**
 * The one place that enforces who may call what: each operation's guard is built from its own
 * declaration in openapi.yaml. Bearer tokens (sessions and personal API tokens) go through
 * passport's bearer strategy; no route checks roles itself.
 */
export function createAccessGuards(
  documentSecurity?: unknown[],
): (operation: ApiOperation) => RequestHandler | undefined {
  const passport = new Passport();
  passport.use(
    new BearerStrategy((token, done) => {
      userForBearerToken(token).then((user) => done(null, user ?? false), done);
    }),
  );

  return (operation) => {
    const access = readAccessDeclaration(operation, documentSecurity);
    if (access.public) return undefined;
    return (request, response, next) => {
      if ((request.query as Record<string, unknown>).access_token !== undefined) {
        next(
          new ProblemError(
            400,
            'Token in the address',
            'Send the token in the Authorization header, never in the address',
            [{ pointer: '/query/access_token', detail: 'is not accepted' }],
            'token-in-address',
          ),
        );
        return;
      }
      const authenticate = passport.authenticate(
        'bearer',
        { session: false },
        (error: unknown, user: AuthenticatedUser | false, info: unknown) => {
          if (error) {
            next(error);
            return;
          }
          if (!user) {
            response.set('WWW-Authenticate', challenge);
            const presented = typeof info === 'string' && info.includes('invalid_token');
            next(
              request.headers.authorization === undefined
                ? unauthorized(
                    'This operation needs a session or an API token in the Authorization header',
                    'sign-in-required',
                  )
                : presented
                  ? unauthorized('The token is unknown, expired or revoked', 'invalid-token')
                  : unauthorized('The Authorization header must read "Bearer <token>"', 'invalid-token'),
            );
            return;
          }
          const reason = refusal(user, access);
          if (reason) {
            next(new ProblemError(403, 'Not allowed', reason, [], 'not-allowed'));
            return;
          }
          request.user = user;
          next();
        },
      ) as RequestHandler;
      authenticate(request, response, next);
    };
  };
}
