import type { Request } from 'express';
import type { Role } from '../../shared/vocabularies';
import { ProblemError } from '../api/problem-details';

/** Who is calling: set on the request by the bearer guard, from a session or a personal API token. */
export interface AuthenticatedUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  /** The supplier a supplier-admin is bound to; null for every other role. */
  supplierId: number | null;
  via: 'session' | 'api-token';
  /** The token's scopes when `via` is `api-token`. */
  scopes: string[];
}

/** The caller of a guarded operation; a handler reaching this without one is a wiring bug, answered as 401. */
export function currentUser(request: Request): AuthenticatedUser {
  const user = request.user as AuthenticatedUser | undefined;
  if (!user) throw new ProblemError(401, 'Sign-in required', 'This operation needs a session or an API token');
  return user;
}
