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

/** Reads and checks the environment once; every unusable value is a ConfigError naming the variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): RiffleConfig {
  const mode = readChoice(env, 'NODE_ENV', ['development', 'production', 'test'] as const, 'development');
  const demo = readChoice(env, 'RIFFLE_DEMO', ['yes', 'no'] as const, mode === 'production' ? 'no' : 'yes') === 'yes';
  if (demo && mode === 'production') {
    throw new ConfigError('RIFFLE_DEMO=yes is refused when NODE_ENV=production: demo accounts must never reach production');
  }
  return {
    mode,
    demo,
    httpHost: env.RIFFLE_HTTP_HOST || '127.0.0.1',
    httpPort: readPort(env, 'PORT', 8080),
    database: {
      host: env.RIFFLE_DB_HOST || '127.0.0.1',
      port: readPort(env, 'RIFFLE_DB_PORT', 3307),
      name: env.RIFFLE_DB_NAME || 'riffle',
      user: env.RIFFLE_DB_USER || 'root',
      password: env.RIFFLE_DB_PASSWORD ?? '',
    },
    varDir: env.RIFFLE_VAR_DIR || join(projectRoot, 'var'),
    logLevel: readChoice(env, 'RIFFLE_LOG_LEVEL', logLevels, mode === 'test' ? 'silent' : 'info'),
  };
}
