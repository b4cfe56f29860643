import { hash, verify } from '@node-rs/argon2';
import { commonPasswords } from './common-passwords';

export const passwordMinLength = 10;
export const passwordMaxLength = 200;

/**
 * argon2id (the library's default algorithm) with the OWASP Password Storage Cheat Sheet's
 * first recommended setting: 19 MiB of memory, 2 passes, 1 lane.
 */
const hashOptions = { memoryCost: 19_456, timeCost: 2, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, hashOptions);
}

/** A hash of nothing anyone knows, verified against when the e-mail is unknown so both answers take as long. */
const unknownUserHash = hash(`no user ${Math.random()}`, hashOptions);

/** Checks the password against the stored hash, or against a throwaway hash when there is no user. */
export async function verifyPassword(storedHash: string | undefined, password: string): Promise<boolean> {
  try {
    const matches = await verify(storedHash ?? (await unknownUserHash), password);
    return storedHash !== undefined && matches;
  } catch {
    return false;
  }
}

/** Why a new password is refused, in a sentence for the user; undefined when it is acceptable. */
export function passwordWeakness(password: string, email: string): string | undefined {
  if (password.length < passwordMinLength) return `must be at least ${passwordMinLength} characters long`;
  if (password.length > passwordMaxLength) return `must be at most ${passwordMaxLength} characters long`;
  const lower = password.toLowerCase();
  if (commonPasswords.has(lower)) return 'is one of the most common passwords; choose another';
  if (new Set(lower).size <= 2) return 'repeats too few characters; choose another';
  const mailbox = email.toLowerCase().split('@')[0];
  if (mailbox.length >= 4 && lower.includes(mailbox)) return 'must not contain your e-mail address';
  return undefined;
}
