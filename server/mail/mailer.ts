import nodemailer from 'nodemailer';
import type { MailConfig } from '../config';

export interface OutgoingAttachment {
  filename: string;
  contentType: string;
  content: Buffer;
}

export interface OutgoingMessage {
  to: string;
  subject: string;
  text: string;
  attachments?: readonly OutgoingAttachment[];
}

/** What the SMTP server accepted: the message's Message-ID header. */
export interface SentMessage {
  messageId: string;
}

/** Sends plain-text messages; resolves once the SMTP server has accepted the message, rejects when it refuses or cannot be reached. */
export interface Mailer {
  send(message: OutgoingMessage): Promise<SentMessage>;
}

/**
 * Mail over SMTP with nodemailer, to the loopback fake (no TLS, `ignoreTLS`) or to the relay the
 * configuration names, with its TLS mode and credentials.
 */
export function createSmtpMailer(config: MailConfig, port = config.port): Mailer {
  const transport = nodemailer.createTransport({
    host: config.host,
    port,
    secure: config.tls === 'implicit',
    requireTLS: config.tls === 'starttls',
    ignoreTLS: config.tls === 'none',
    auth: config.user ? { user: config.user, pass: config.password } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    send: async (message) => {
      if (port === 0) throw new Error('no SMTP port is configured (set RIFFLE_SMTP_PORT, or run the fake SMTP server)');
      const info = await transport.sendMail({
        from: config.from,
        ...message,
        attachments: message.attachments?.map((attachment) => ({ ...attachment })),
      });
      return { messageId: info.messageId };
    },
  };
}
