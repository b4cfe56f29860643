import { createHash, randomBytes } from 'node:crypto';

/** What a bearer or e-mailed secret is for; the prefix tells them apart at a glance and in logs' redaction. */
export const secretTokenKinds = { session: 'rfs_', apiToken: 'rft_', emailLink: 'rfl_', clientLink: 'rfc_' } as const;
export type SecretTokenKind = keyof typeof secretTokenKinds;

/** 32 random bytes in base64url: 43 characters. */
const randomPartPattern = /^[A-Za-z0-9_-]{43}$/;
/** How many leading characters of an API token are kept in clear so its owner can recognise it. */
const shownPrefixLength = 10;

export interface SecretToken {
  /** Handed to the user once; never stored. */
  token: string;
  /** SHA-256 of the token in hex: the only form the database holds. */
  hash: string;
  /** The first characters, safe to show in a list. */
  prefix: string;
}

/** SHA-256 suffices for tokens of 256 random bits: there is nothing to guess, so no slow hash is needed. */
export function hashSecretToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function newSecretToken(kind: SecretTokenKind): SecretToken {
  const token = secretTokenKinds[kind] + randomBytes(32).toString('base64url');
  return { token, hash: hashSecretToken(token), prefix: token.slice(0, shownPrefixLength) };
}

/** The kind of a well-formed token, or undefined for anything else (checked before any database look-up). */
export function secretTokenKindOf(token: string): SecretTokenKind | undefined {
  for (const [kind, prefix] of Object.entries(secretTokenKinds) as Array<[SecretTokenKind, string]>) {
    if (token.startsWith(prefix) && randomPartPattern.test(token.slice(prefix.length))) return kind;
  }
  return undefined;
}
