/**
 * Just enough MIME (RFC 2045-2047) to read the plain-text messages Riffle sends: unfolded
 * headers, quoted-printable or base64 bodies, encoded-word subjects, and the text/plain part of
 * a multipart message.
 */

export interface PlainMessage {
  headers: Map<string, string>;
  text: string;
}

function splitHeadersAndBody(raw: string): { headerText: string; body: string } {
  const normalised = raw.replace(/\r\n/g, '\n');
  const end = normalised.indexOf('\n\n');
  return end < 0
    ? { headerText: normalised, body: '' }
    : { headerText: normalised.slice(0, end), body: normalised.slice(end + 2) };
}

function parseHeaders(headerText: string): Map<string, string> {
  const headers = new Map<string, string>();
  for (const line of headerText.replace(/\n[ \t]+/g, ' ').split('\n')) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return headers;
}

function decodeQuotedPrintable(body: string): string {
  const joined = body.replace(/=\n/g, '');
  const bytes: number[] = [];
  for (let index = 0; index < joined.length; index++) {
    const hex = joined.slice(index + 1, index + 3);
    if (joined[index] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      index += 2;
    } else {
      bytes.push(...Buffer.from(joined[index], 'utf8'));
    }
  }
  return Buffer.from(bytes).toString('utf8');
}

function decodeBody(body: string, transferEncoding: string | undefined): string {
  switch (transferEncoding?.toLowerCase()) {
    case 'quoted-printable':
      return decodeQuotedPrintable(body);
    case 'base64':
      return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
    default:
      return body;
  }
}

/** `=?UTF-8?Q?...?=` and `=?UTF-8?B?...?=` words in a header. */
export function decodeEncodedWords(value: string): string {
  return value.replace(
    /=\?([^?]+)\?([QqBb])\?([^?]*)\?=\s*/g,
    (_word, _charset: string, encoding: string, text: string) =>
      encoding.toUpperCase() === 'B'
        ? Buffer.from(text, 'base64').toString('utf8')
        : decodeQuotedPrintable(text.replace(/_/g, ' ')),
  );
}

export function parsePlainMessage(raw: string): PlainMessage {
  const { headerText, body } = splitHeadersAndBody(raw);
  const headers = parseHeaders(headerText);
  const contentType = headers.get('content-type') ?? 'text/plain';
  const boundary = /boundary="?([^";]+)"?/i.exec(contentType)?.[1];
  if (contentType.toLowerCase().startsWith('multipart/') && boundary) {
    const parts = body
      .split(`--${boundary}`)
      .slice(1, -1)
      .map((part) => parsePlainMessage(part.replace(/^\n/, '')));
    const textPart =
      parts.find((part) => (part.headers.get('content-type') ?? 'text/plain').toLowerCase().startsWith('text/plain')) ??
      parts[0];
    return { headers, text: textPart?.text ?? '' };
  }
  return { headers, text: decodeBody(body, headers.get('content-transfer-encoding')).replace(/\n$/, '') };
}
