import type { RiffleConfig } from '../config';
import { createSmtpMailer, type Mailer } from '../mail/mailer';
import type { RateLimitSettings } from './rate-limits';

/** What the account routes need from outside: mail, the address links point to, limits. */
export interface AccountsDependencies {
  mailer: Mailer;
  /** Where links in e-mails point, without a trailing slash. */
  publicUrl: string;
  /** The fake SMTP server's mailbox, listed to admins in demo mode; absent otherwise. */
  demoMailboxFolder?: string;
  /** Limits that differ from `defaultRateLimits`. */
  rateLimits: Partial<RateLimitSettings>;
}

export const lifetimes = {
  sessionMs: 12 * 3600_000,
  invitationMs: 7 * 24 * 3600_000,
  resetLinkMs: 3600_000,
};

export function accountsDependenciesFrom(
  config: RiffleConfig,
  given: Partial<AccountsDependencies> = {},
): AccountsDependencies {
  return {
    mailer: given.mailer ?? createSmtpMailer(config.mail),
    publicUrl: given.publicUrl ?? config.publicUrl,
    demoMailboxFolder:
      'demoMailboxFolder' in given
        ? given.demoMailboxFolder
        : config.demo && config.mail.fake
          ? config.mail.mailboxFolder
          : undefined,
    rateLimits: given.rateLimits ?? {},
  };
}
