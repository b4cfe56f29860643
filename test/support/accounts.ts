import type { Sequelize } from 'sequelize';
import type { ApiScope, Role } from '../../shared/vocabularies';
import { hashPassword } from '../../server/accounts/passwords';
import { openSession } from '../../server/accounts/sessions';
import { newSecretToken } from '../../server/accounts/secret-tokens';
import { normaliseEmail } from '../../server/accounts/user-views';
import { ApiToken, User } from '../../server/database/models';
import { readMailbox, type MailboxMessage } from '../../server/mail/mailbox';

/** The password of every account these functions make. */
export const testPassword = 'gravel-bed-weir-42';

let accountCount = 0;
let testPasswordHash: Promise<string> | undefined;

/**
 * A user of the given role in the database the models are bound to (a scratch database), with
 * a live session token for `Authorization: Bearer`. A supplier-admin needs `supplierId`.
 */
export async function createUserWithSession(
  _sequelize: Sequelize,
  role: Role,
  options: { supplierId?: number; email?: string; name?: string } = {},
): Promise<{ user: User; token: string }> {
  if (role === 'supplier-admin' && options.supplierId === undefined)
    throw new Error('a supplier-admin needs options.supplierId');
  testPasswordHash ??= hashPassword(testPassword);
  const number = ++accountCount;
  const user = await User.create({
    email: normaliseEmail(options.email ?? `${role}-${process.pid}-${number}@accounts.test`),
    name: options.name ?? `Test ${role} ${number}`,
    role,
    supplierId: role === 'supplier-admin' ? options.supplierId! : null,
    passwordHash: await testPasswordHash,
  });
  const { token } = await openSession(user);
  return { user, token };
}

/** Another live session token for an existing user. */
export async function createSession(userId: number): Promise<string> {
  const user = await User.findByPk(userId, { rejectOnEmpty: true });
  return (await openSession(user)).token;
}

/** A personal API token of the user with these scopes; `expiresAt` may lie in the past to test expiry. */
export async function createApiToken(
  _sequelize: Sequelize,
  userId: number,
  scopes: readonly ApiScope[],
  options: { expiresAt?: Date | null; name?: string } = {},
): Promise<string> {
  const { token, hash, prefix } = newSecretToken('apiToken');
  await ApiToken.create({
    userId,
    name: options.name ?? 'test token',
    tokenPrefix: prefix,
    tokenHash: hash,
    scopes: [...scopes],
    expiresAt: options.expiresAt ?? null,
  });
  return token;
}

/** The folder where the fake SMTP server that `npm test` runs keeps received messages. */
export function testMailboxFolder(): string {
  const folder = process.env.RIFFLE_MAILBOX_FOLDER;
  if (!folder) throw new Error('these suites need the fake SMTP server that `npm test` starts: run them with npm test');
  return folder;
}

/** Waits for the first message to `to` that arrived after `since` (the fake server writes it before answering 250). */
export async function waitForMail(to: string, since: Date, timeoutMs = 10_000): Promise<MailboxMessage> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const message = readMailbox(testMailboxFolder()).find(
      (candidate) => candidate.to.includes(to) && candidate.receivedAt >= since.toISOString(),
    );
    if (message) return message;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  throw new Error(`no message to ${to} arrived within ${timeoutMs} ms`);
}

/** The single-use token in an e-mailed link. */
export function linkTokenIn(message: MailboxMessage): string {
  const token = /[?&]token=(rfl_[A-Za-z0-9_-]{43})(?![\w-])/.exec(message.text)?.[1];
  if (!token) throw new Error(`no link token in the message "${message.subject}"`);
  return token;
}

/** One checksum per table, to show that a refused request wrote nothing. */
export async function tableChecksums(
  sequelize: Sequelize,
  except: readonly string[] = [],
): Promise<Record<string, string>> {
  const [listed] = await sequelize.query('SHOW TABLES');
  const tables = (listed as Array<Record<string, string>>)
    .map((row) => Object.values(row)[0])
    .filter((table) => !except.includes(table) && table !== 'schema_migrations');
  const [rows] = await sequelize.query(`CHECKSUM TABLE ${tables.map((table) => `\`${table}\``).join(', ')} EXTENDED`);
  return Object.fromEntries(
    (rows as Array<{ Table: string; Checksum: string | number }>).map((row) => [
      row.Table.split('.').pop()!,
      String(row.Checksum),
    ]),
  );
}
