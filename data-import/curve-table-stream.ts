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

/** Where a file's bytes stopped being text in its encoding. */
export interface UndecodableBytes {
  /** Offset of the first byte that cannot be decoded, from the file's start (0-based). */
  byte: number;
  /** The file's line (1-based) that byte is on. */
  line: number;
  reason: string;
}

export const acceptedEncodings = 'UTF-8 (with or without a byte-order mark), or UTF-16 LE or BE with a byte-order mark';

type FileEncoding = 'utf-8' | 'utf-16le' | 'utf-16be';

/**
 * The length of the well-formed UTF-8 sequence at `at`: 0 when it is ill-formed, -1 when the
 * bytes end inside it. Source: The Unicode Standard 15.0, section 3.9, Table 3-7 (Well-Formed
 * UTF-8 Byte Sequences).
 */
function utf8SequenceLength(bytes: Buffer, at: number): number {
  const lead = bytes[at];
  if (lead <= 0x7f) return 1;
  const [length, secondLow, secondHigh] =
    lead >= 0xc2 && lead <= 0xdf
      ? [2, 0x80, 0xbf]
      : lead === 0xe0
        ? [3, 0xa0, 0xbf]
        : lead === 0xed
          ? [3, 0x80, 0x9f]
          : lead >= 0xe1 && lead <= 0xef
            ? [3, 0x80, 0xbf]
            : lead === 0xf0
              ? [4, 0x90, 0xbf]
              : lead === 0xf4
                ? [4, 0x80, 0x8f]
                : lead >= 0xf1 && lead <= 0xf3
                  ? [4, 0x80, 0xbf]
                  : [0, 0, 0];
  if (length === 0) return 0;
  for (let index = 1; index < length; index += 1) {
    if (at + index >= bytes.length) return -1;
    const [low, high] = index === 1 ? [secondLow, secondHigh] : [0x80, 0xbf];
    if (bytes[at + index] < low || bytes[at + index] > high) return 0;
  }
  return length;
}

/**
 * How many leading bytes are whole, well-formed text, and whether the next byte is ill-formed
 * (`bad`) or only cut by the end of `bytes`. UTF-16 code units pair surrogates as The Unicode
 * Standard 15.0, section 3.9 (D91) defines.
 */
function wellFormedPrefix(bytes: Buffer, encoding: FileEncoding): { length: number; bad: boolean } {
  let at = 0;
  if (encoding === 'utf-8') {
    while (at < bytes.length) {
      const length = utf8SequenceLength(bytes, at);
      if (length <= 0) return { length: at, bad: length === 0 };
      at += length;
    }
    return { length: at, bad: false };
  }
  const unit = (offset: number) => (encoding === 'utf-16le' ? bytes.readUInt16LE(offset) : bytes.readUInt16BE(offset));
  while (at + 1 < bytes.length) {
    const code = unit(at);
    if (code >= 0xdc00 && code <= 0xdfff) return { length: at, bad: true };
    if (code >= 0xd800 && code <= 0xdbff) {
      if (at + 3 >= bytes.length) return { length: at, bad: false };
      const next = unit(at + 2);
      if (next < 0xdc00 || next > 0xdfff) return { length: at, bad: true };
      at += 4;
    } else at += 2;
  }
  return { length: at, bad: false };
}

function newlineCount(bytes: Buffer): number {
  let count = 0;
  for (let at = bytes.indexOf(0x0a); at >= 0; at = bytes.indexOf(0x0a, at + 1)) count += 1;
  return count;
}

/**
 * A curve table's bytes as UTF-8 for the reader: UTF-8 (a byte-order mark is left for the reader)
 * passes unchanged, UTF-16 with a byte-order mark is transcoded. At the first byte that is not
 * text in the file's encoding (Latin-1's lone 0xE9, a UTF-32 byte-order mark, a lone surrogate)
 * the output ends, the rest is drained unread, and `problem` says where.
 */
export class CurveTableDecoder extends Transform {
  problem: UndecodableBytes | null = null;
  private encoding: FileEncoding | null = null;
  private pending: Buffer = Buffer.alloc(0);
  /** File bytes before `pending`. */
  private consumed = 0;
  private lines = 0;

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    if (this.problem) return callback();
    this.pending = this.pending.length > 0 ? Buffer.concat([this.pending, chunk]) : chunk;
    if (this.encoding === null && this.pending.length < 4) return callback();
    this.decodePending(false);
    callback();
  }

  override _flush(callback: TransformCallback): void {
    if (!this.problem) this.decodePending(true);
    callback();
  }

  private decodePending(atEnd: boolean): void {
    if (this.encoding === null && !this.sniffEncoding()) return;
    const encoding = this.encoding!;
    const { length, bad } = wellFormedPrefix(this.pending, encoding);
    const whole = this.pending.subarray(0, length);
    const text =
      encoding === 'utf-8'
        ? whole
        : Buffer.from((encoding === 'utf-16le' ? whole : Buffer.from(whole).swap16()).toString('utf16le'), 'utf8');
    this.lines += newlineCount(text);
    if (text.length > 0) this.push(text);
    this.consumed += length;
    this.pending = this.pending.subarray(length);
    if (bad || (atEnd && this.pending.length > 0)) {
      const reason = bad
        ? this.illFormed(encoding)
        : `the file ends inside a ${encoding === 'utf-8' ? 'UTF-8 sequence' : 'UTF-16 character'}`;
      this.stop(reason);
    }
  }

  /** What is wrong with the ill-formed text at the start of `pending`. */
  private illFormed(encoding: FileEncoding): string {
    if (encoding === 'utf-8')
      return `byte 0x${this.pending[0].toString(16).toUpperCase().padStart(2, '0')} is not UTF-8 text here`;
    const unit = encoding === 'utf-16le' ? this.pending.readUInt16LE(0) : this.pending.readUInt16BE(0);
    return `the UTF-16 code unit 0x${unit.toString(16).toUpperCase()} is a surrogate without its pair`;
  }

  /** Reads the byte-order mark; false when the file is refused by it. */
  private sniffEncoding(): boolean {
    const start = this.pending;
    if (
      start.subarray(0, 4).equals(Buffer.from([0x00, 0x00, 0xfe, 0xff])) ||
      start.subarray(0, 4).equals(Buffer.from([0xff, 0xfe, 0x00, 0x00]))
    ) {
      this.stop('the file starts with a UTF-32 byte-order mark');
      return false;
    }
    const utf16 =
      start[0] === 0xff && start[1] === 0xfe ? 'utf-16le' : start[0] === 0xfe && start[1] === 0xff ? 'utf-16be' : null;
    this.encoding = utf16 ?? 'utf-8';
    if (utf16) {
      this.pending = start.subarray(2);
      this.consumed = 2;
    }
    return true;
  }

  private stop(reason: string): void {
    this.problem = { byte: this.consumed, line: this.lines + 1, reason };
    this.pending = Buffer.alloc(0);
    this.push(null);
  }
}
