import type { ApiOperation } from '../api/openapi-document';
import { apiScopes, roles, type ApiScope, type Role } from '../../shared/vocabularies';

/** Who may call an operation, as its `security` and `x-riffle-access` in openapi.yaml declare. */
export type AccessDeclaration =
  | { public: true }
  | {
      public: false;
      /** Signed-in users (by session or token) must have one of these roles. */
      roles: readonly Role[];
      /** API tokens must carry one of these; an empty list keeps API tokens out entirely. */
      scopes: readonly ApiScope[];
    };

interface RawAccess {
  roles?: unknown;
  scopes?: unknown;
}

function listOf<T extends string>(value: unknown, known: readonly T[], what: string, operationId: string): T[] {
  if (value === undefined) return [];
  if (!Array.isArray(value) || value.some((item) => !(known as readonly unknown[]).includes(item))) {
    throw new Error(`${operationId} in openapi.yaml: x-riffle-access.${what} must list only ${known.join(', ')}`);
  }
  return value as T[];
}

/**
 * Reads an operation's access declaration and refuses, at start-up, one that is missing or names
 * an unknown role or scope: an operation must never be open by omission.
 */
export function readAccessDeclaration(operation: ApiOperation, documentSecurity?: unknown[]): AccessDeclaration {
  const security = operation.definition.security ?? documentSecurity;
  const { operationId } = operation;
  if (!Array.isArray(security)) throw new Error(`${operationId} in openapi.yaml declares no security`);
  if (security.length === 0) return { public: true };
  if (!security.every((requirement) => Object.keys(requirement as object).join() === 'bearer')) {
    throw new Error(`${operationId} in openapi.yaml: the only security scheme is bearer`);
  }
  const access = (operation.definition as { 'x-riffle-access'?: RawAccess })['x-riffle-access'];
  if (!access)
    throw new Error(`${operationId} in openapi.yaml needs x-riffle-access naming the roles that may call it`);
  const allowedRoles = listOf(access.roles, roles, 'roles', operationId);
  if (allowedRoles.length === 0)
    throw new Error(`${operationId} in openapi.yaml: x-riffle-access.roles must name at least one role`);
  return { public: false, roles: allowedRoles, scopes: listOf(access.scopes, apiScopes, 'scopes', operationId) };
}
