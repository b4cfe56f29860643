import { simpleParser } from 'mailparser';

export interface ReceivedMessage {
  subject: string;
  /** The plain-text body (the text/plain part of a multipart message), without its final line break. */
  text: string;
}

/** Decodes a received message (MIME, RFC 2045-2047) with mailparser: encoded-word subjects, quoted-printable and base64 bodies, multipart. */
export async function readReceivedMessage(raw: Buffer): Promise<ReceivedMessage> {
  const parsed = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true });
  return { subject: parsed.subject ?? '', text: (parsed.text ?? '').replace(/\r\n/g, '\n').replace(/\n+$/, '') };
}
