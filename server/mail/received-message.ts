import { createHash } from 'node:crypto';
import { simpleParser } from 'mailparser';

export interface ReceivedAttachment {
  filename: string;
  contentType: string;
  /** Bytes once decoded from the transfer encoding. */
  size: number;
  /** sha-256 of the decoded bytes, hex. */
  sha256: string;
}

export interface ReceivedMessage {
  subject: string;
  /** The plain-text body (the text/plain part of a multipart message), without its final line break. */
  text: string;
  attachments: ReceivedAttachment[];
}

/** Decodes a received message (MIME, RFC 2045-2047) with mailparser: encoded-word subjects, quoted-printable and base64 bodies, multipart, attachments. */
export async function readReceivedMessage(raw: Buffer): Promise<ReceivedMessage> {
  const parsed = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true });
  return {
    subject: parsed.subject ?? '',
    text: (parsed.text ?? '').replace(/\r\n/g, '\n').replace(/\n+$/, ''),
    attachments: parsed.attachments.map((attachment) => ({
      filename: attachment.filename ?? '',
      contentType: attachment.contentType,
      size: attachment.content.length,
      sha256: createHash('sha256').update(attachment.content).digest('hex'),
    })),
  };
}
