import { pino, type Logger } from 'pino';

/** Structured JSON logs on standard output; the level comes from the configuration. */
export function createLogger(level: string): Logger {
  return pino({ level, base: { service: 'riffle' }, redact: ['req.headers.authorization', 'password', '*.password', 'token', '*.token'] });
}
