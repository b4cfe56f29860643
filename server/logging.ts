import { pino, type DestinationStream, type Logger } from 'pino';

/** Structured JSON logs on standard output (or the given stream); the level comes from the configuration. */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = {
    level,
    base: { service: 'riffle' },
    redact: ['req.headers.authorization', 'password', '*.password', 'token', '*.token'],
  };
  return destination ? pino(options, destination) : pino(options);
}
