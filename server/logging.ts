import { Writable } from 'node:stream';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { pino, type DestinationStream, type Logger } from 'pino';
import type { Options as HttpLoggerOptions } from 'pino-http';

const levelNames: Record<number, string> = {
  10: 'trace',
  20: 'debug',
  30: 'info',
  40: 'warn',
  50: 'error',
  60: 'fatal',
};

/** One short line per log entry for a person at a terminal: time, level, message, then the request. */
export function formatLogLine(entry: Record<string, unknown>): string {
  const time = new Date(typeof entry.time === 'number' ? entry.time : Date.now()).toISOString().slice(11, 23);
  const level = (levelNames[entry.level as number] ?? String(entry.level)).toUpperCase().padEnd(5);
  const req = entry.req as { method?: string; path?: string; id?: unknown } | undefined;
  const res = entry.res as { statusCode?: number } | undefined;
  const request = req
    ? ` ${req.method} ${req.path} ${res?.statusCode ?? ''} ${entry.responseTime ?? '?'} ms #${req.id}`
    : '';
  const error = (entry.err as { stack?: string } | undefined)?.stack;
  return `${time} ${level} ${entry.msg ?? ''}${request}${error ? `\n${error}` : ''}\n`;
}

/** A destination that turns pino's JSON lines into `formatLogLine` lines on the given stream. */
export function lineDestination(output: NodeJS.WritableStream): DestinationStream {
  return new Writable({
    write(chunk: Buffer, _encoding, done) {
      for (const line of chunk.toString('utf8').split('\n')) {
        if (line.trim() === '') continue;
        try {
          output.write(formatLogLine(JSON.parse(line) as Record<string, unknown>));
        } catch {
          output.write(`${line}\n`);
        }
      }
      done();
    },
  });
}

/**
 * Logs on standard output (or the given stream): JSON for machines, one line per entry when
 * standard output is a terminal. The level comes from the configuration.
 */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = {
    level,
    base: { service: 'riffle' },
    redact: ['req.headers.authorization', 'req.headers.cookie', 'password', '*.password', 'token', '*.token'],
  };
  if (destination) return pino(options, destination);
  return process.stdout.isTTY ? pino(options, lineDestination(process.stdout)) : pino(options);
}

/**
 * What a request's log entry holds: method, path (no query: it may carry a link token), status,
 * time and id. Never headers, so never `authorization`, cookies or tokens.
 */
export const requestLogOptions: HttpLoggerOptions = {
  serializers: {
    req: (request: IncomingMessage & { id?: unknown }) => ({
      id: request.id,
      method: request.method,
      path: (request.url ?? '').split('?')[0],
    }),
    res: (response: ServerResponse) => ({ statusCode: response.statusCode }),
  },
  wrapSerializers: false,
};
