import { closeSync, fstatSync, mkdirSync, openSync, renameSync, writeSync } from 'node:fs';
import { dirname } from 'node:path';
import { Writable } from 'node:stream';
import type { IncomingMessage, ServerResponse } from 'node:http';
import {
  destination as fileDescriptor,
  multistream,
  pino,
  type DestinationStream,
  type Level,
  type Logger,
} from 'pino';
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

/** The log file's bound: each of the file and its one older copy (`.1`) holds at most this. */
export const logFileMaxBytes = 10 * 1024 * 1024;

/**
 * JSON lines appended to `path`, capped: when a line would take the file past `maxBytes`, the
 * file becomes `path.1` (replacing the older copy) and a new file starts, so the two together
 * stay within 2 x `maxBytes` (a single line longer than `maxBytes` still goes whole into a new
 * file). Written synchronously, so no line is split between the files or lost at exit.
 */
export function cappedLogFile(path: string, maxBytes = logFileMaxBytes): DestinationStream & { close(): void } {
  mkdirSync(dirname(path), { recursive: true });
  let descriptor = openSync(path, 'a');
  let size = fstatSync(descriptor).size;
  return {
    write(line: string) {
      const bytes = Buffer.byteLength(line);
      if (size > 0 && size + bytes > maxBytes) {
        closeSync(descriptor);
        renameSync(path, `${path}.1`);
        descriptor = openSync(path, 'a');
        size = 0;
      }
      writeSync(descriptor, line);
      size += bytes;
    },
    close() {
      closeSync(descriptor);
    },
  };
}

/**
 * Logs on standard output (or the given stream): JSON for machines, one line per entry when
 * standard output is a terminal; and, when given, the same JSON lines to `file` as well (the
 * capped log under var/). The level comes from the configuration.
 */
export function createLogger(level: string, destination?: DestinationStream, file?: DestinationStream): Logger {
  const options = {
    level,
    base: { service: 'riffle' },
    redact: ['req.headers.authorization', 'req.headers.cookie', 'password', '*.password', 'token', '*.token'],
  };
  const screen = destination ?? (process.stdout.isTTY ? lineDestination(process.stdout) : fileDescriptor({ fd: 1 }));
  if (!file) return pino(options, screen);
  // each stream of a multistream has its own level, 'info' unless told: give both the logger's
  // (a silent logger writes nothing, whatever its streams' levels)
  const streamLevel = (level === 'silent' ? 'fatal' : level) as Level;
  return pino(options, multistream([screen, file].map((stream) => ({ level: streamLevel, stream }))));
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
