import { createHash } from 'node:crypto';
import { pipeline, Readable, Transform, type TransformCallback } from 'node:stream';
import { parse, CsvError } from 'csv-parse';
import { curveTableLimits } from './curve-table-format';

/*
 * The byte side of reading a curve table: counting and hashing the bytes, finding the header and
 * the delimiter, and csv-parse's records. Nothing here knows the columns.
 */

export class FileTooLargeError extends Error {}

/** Counts and hashes the bytes going through, and stops the stream past the size limit. */
export class CountingHash extends Transform {
  readonly hash = createHash('sha256');
  bytes = 0;

  constructor(
    private readonly limit: number,
    private readonly onBytes?: (bytesRead: number) => void,
  ) {
    super();
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    this.bytes += chunk.length;
    if (this.bytes > this.limit) {
      callback(
        new FileTooLargeError(
          `the file is larger than ${Math.round(this.limit / 1024 / 1024)} MiB; split it into smaller files`,
        ),
      );
      return;
    }
    this.hash.update(chunk);
    this.onBytes?.(this.bytes);
    callback(null, chunk);
  }
}

/** The delimiter of the format line: `;` when it comes before any `,`, else `,`. */
export function detectDelimiter(start: string): ';' | ',' {
  const firstLine =
    start
      .replace(/^\uFEFF/, '')
      .split(/\r?\n/)
      .find((line) => line.trim() !== '' && !line.trimStart().startsWith('#')) ?? '';
  const semicolon = firstLine.indexOf(';');
  const comma = firstLine.indexOf(',');
  return semicolon >= 0 && (comma < 0 || semicolon < comma) ? ';' : ',';
}

/** How far the reader looks for the header row before it treats the whole file as one part. */
const preambleSearchBytes = 64 * 1024;

export interface SplitFile {
  delimiter: ';' | ',';
  /** The format and unit lines, up to the header row. */
  preamble: Buffer;
  /** From the header row on: what was read of it so far. */
  rest: Buffer;
  /** Lines in the preamble, to number the rest's lines as the file's. */
  preambleLines: number;
}

/**
 * Reads until the header row (a line starting with model_code) and splits there. The two parts
 * are parsed apart so that csv-parse sees the header as its first record and every point row
 * of the same length, the case its column checks are fast for.
 */
export async function splitAtHeader(source: AsyncIterator<Buffer>): Promise<SplitFile> {
  let buffer = Buffer.alloc(0);
  let headerAt = -1;
  for (;;) {
    // latin1 keeps one character per byte, so positions in the text are byte offsets.
    const text = buffer.toString('latin1');
    const match = /(^|\n)(\xEF\xBB\xBF)?[ \t]*"?model_code/.exec(text);
    if (match) {
      headerAt = match.index + match[1].length;
      break;
    }
    if (buffer.length > preambleSearchBytes) break;
    const next = await source.next();
    if (next.done) break;
    buffer = Buffer.concat([buffer, next.value]);
  }
  const preamble = headerAt >= 0 ? buffer.subarray(0, headerAt) : buffer;
  const rest = headerAt >= 0 ? buffer.subarray(headerAt) : Buffer.alloc(0);
  const preambleText = preamble.toString('utf8');
  return {
    delimiter: detectDelimiter(headerAt >= 0 ? preambleText : buffer.toString('utf8')),
    preamble,
    rest,
    preambleLines: headerAt >= 0 ? (preambleText.match(/\n/g) ?? []).length : 0,
  };
}

export function csvParser(delimiter: ';' | ',') {
  return parse({
    bom: true,
    delimiter,
    relax_column_count: true,
    skip_empty_lines: true,
    skip_records_with_empty_values: true,
    trim: true,
    comment: '#',
    comment_no_infix: true,
    info: true,
    max_record_size: curveTableLimits.maxRecordCharacters,
  });
}

/** The records of a byte stream with the file's line numbers. */
export async function* csvRecords(
  chunks: AsyncIterable<Buffer>,
  delimiter: ';' | ',',
  lineOffset: number,
): AsyncGenerator<{ record: string[]; line: number }> {
  const parser = pipeline(Readable.from(chunks), csvParser(delimiter), () => undefined);
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      yield { record, line: info.lines + lineOffset };
    }
  } catch (error) {
    if (error instanceof CsvError)
      Object.assign(error, { lines: ((error as CsvError & { lines?: number }).lines ?? 0) + lineOffset });
    throw error;
  }
}

export function csvProblem(error: CsvError): string {
  switch (error.code) {
    case 'CSV_QUOTE_NOT_CLOSED':
      return 'a quoted field is never closed';
    case 'CSV_INVALID_CLOSING_QUOTE':
    case 'CSV_NON_TRIMABLE_CHAR_AFTER_CLOSING_QUOTE':
      return 'a quote closes a field but other characters follow it';
    case 'CSV_MAX_RECORD_SIZE':
      return 'one record is longer than 64 KiB';
    default:
      return error.message;
  }
}

/** The reader's progress through the file: format line, unit lines, header, point rows. */
