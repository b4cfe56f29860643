import { isIP } from 'node:net';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The project's root folder, from which var/, dist/ and openapi.yaml are found. */
export const projectRoot = fileURLToPath(new URL('..', import.meta.url));

export type RuntimeMode = 'development' | 'production' | 'test';

export interface RiffleConfig {
  mode: RuntimeMode;
  /** Demo mode seeds and shows invented data and accounts; never in production. */
  demo: boolean;
  httpHost: string;
  httpPort: number;
  database: {
    host: string;
    port: number;
    name: string;
    user: string;
    password: string;
  };
  /** Where the private MariaDB keeps its files when Riffle runs it itself. */
  varDir: string;
  logLevel: string;
  /** Where links in e-mails point: the address users reach Riffle at. */
  publicUrl: string;
  mail: MailConfig;
  /**
   * Proxies whose `X-Forwarded-For` is believed (addresses, CIDRs, or `loopback`, `linklocal`,
   * `uniquelocal`); empty by default, so the client address is the connection's own and no caller
   * can forge it for the audit log or the rate limits.
   */
  trustedProxies: string[];
}

/**
 * Outgoing mail. Without `RIFFLE_SMTP_HOST` mail goes to Riffle's own fake SMTP server on
 * loopback (which `npm start` and `npm test` run), and it keeps what it receives in
 * `mailboxFolder`; with it, mail goes to that relay unchanged.
 */
export interface MailConfig {
  /** True when mail goes to the loopback fake SMTP server rather than a real relay. */
  fake: boolean;
  host: string;
  /** 0 lets the fake server take any free loopback port. */
  port: number;
  /** `none` for the loopback fake; `starttls` or `implicit` for a real relay. */
  tls: 'none' | 'starttls' | 'implicit';
  user: string;
  password: string;
  from: string;
  /** Where the fake SMTP server keeps received messages (one JSON file each). */
  mailboxFolder: string;
}

/** A configuration value that cannot be used; the message says what to do. */
export class ConfigError extends Error {
  override readonly name = 'ConfigError';
}

const logLevels = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'];

function readPort(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!/^\d+$/.test(raw) || port < 1 || port > 65535) {
    throw new ConfigError(`${name} must be a port number from 1 to 65535, not "${raw}"`);
  }
  return port;
}

function readChoice<T extends string>(env: NodeJS.ProcessEnv, name: string, choices: readonly T[], fallback: T): T {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  if (!(choices as readonly string[]).includes(raw)) {
    throw new ConfigError(`${name} must be one of ${choices.join(', ')}, not "${raw}"`);
  }
  return raw as T;
}

function readMail(env: NodeJS.ProcessEnv, varDir: string): MailConfig {
  const relayHost = env.RIFFLE_SMTP_HOST || '';
  const fake = relayHost === '';
  return {
    fake,
    host: relayHost || '127.0.0.1',
    port: readPort(env, 'RIFFLE_SMTP_PORT', fake ? 0 : 587),
    tls: fake ? 'none' : readChoice(env, 'RIFFLE_SMTP_TLS', ['none', 'starttls', 'implicit'] as const, 'starttls'),
    user: env.RIFFLE_SMTP_USER || '',
    password: env.RIFFLE_SMTP_PASSWORD ?? '',
    from: env.RIFFLE_MAIL_FROM || 'Riffle <no-reply@riffle.test>',
    mailboxFolder: env.RIFFLE_MAILBOX_FOLDER || join(varDir, 'mailbox'),
  };
}

const proxyNames = ['loopback', 'linklocal', 'uniquelocal'];

function readTrustedProxies(env: NodeJS.ProcessEnv): string[] {
  const entries = (env.RIFFLE_TRUSTED_PROXIES ?? '')
    .split(',')
    .map((entry) => entry.trim())
    .filter((entry) => entry !== '');
  for (const entry of entries) {
    const [address, bits, extra] = entry.split('/');
    const family = isIP(address);
    const maxBits = family === 6 ? 128 : 32;
    const bitsValid = bits === undefined || (/^\d{1,3}$/.test(bits) && Number(bits) <= maxBits);
    if (!proxyNames.includes(entry) && (family === 0 || !bitsValid || extra !== undefined)) {
      throw new ConfigError(
        `RIFFLE_TRUSTED_PROXIES must list addresses, CIDRs (10.0.0.0/8) or ${proxyNames.join(', ')}, separated by commas; "${entry}" is none of these`,
      );
    }
  }
  return entries;
}

/** Reads and checks the environment once; every unusable value is a ConfigError naming the variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): RiffleConfig {
  const mode = readChoice(env, 'NODE_ENV', ['development', 'production', 'test'] as const, 'development');
  const demo = readChoice(env, 'RIFFLE_DEMO', ['yes', 'no'] as const, mode === 'production' ? 'no' : 'yes') === 'yes';
  if (demo && mode === 'production') {
    throw new ConfigError(
      'RIFFLE_DEMO=yes is refused when NODE_ENV=production: demo accounts must never reach production',
    );
  }
  const httpHost = env.RIFFLE_HTTP_HOST || '127.0.0.1';
  const httpPort = readPort(env, 'PORT', 8080);
  const varDir = env.RIFFLE_VAR_DIR || join(projectRoot, 'var');
  return {
    mode,
    demo,
    httpHost,
    httpPort,
    database: {
      host: env.RIFFLE_DB_HOST || '127.0.0.1',
      port: readPort(env, 'RIFFLE_DB_PORT', 3307),
      name: env.RIFFLE_DB_NAME || 'riffle',
      user: env.RIFFLE_DB_USER || 'root',
      password: env.RIFFLE_DB_PASSWORD ?? '',
    },
    varDir,
    logLevel: readChoice(env, 'RIFFLE_LOG_LEVEL', logLevels, mode === 'test' ? 'silent' : 'info'),
    publicUrl: (env.RIFFLE_PUBLIC_URL || `http://${httpHost}:${httpPort}`).replace(/\/+$/, ''),
    mail: readMail(env, varDir),
    trustedProxies: readTrustedProxies(env),
  };
}
