import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { storeMailboxMessage } from './mailbox';
import { readReceivedMessage } from './received-message';

export interface FakeSmtpServer {
  port: number;
  stop: () => Promise<void>;
}

/** Room for a proposal PDF (base64 takes a third more) besides the invitation and reset messages. */
const maxMessageBytes = 20_000_000;

/**
 * An SMTP server on loopback that accepts every message and keeps it in `mailboxFolder`, so the
 * invitation and reset flows can be followed without a real mailbox. No TLS and no AUTH: it
 * never listens beyond 127.0.0.1.
 */
export async function startFakeSmtpServer(options: { port: number; mailboxFolder: string }): Promise<FakeSmtpServer> {
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    size: maxMessageBytes,
    banner: 'Riffle demo mail (messages stay on this machine)',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', callback);
      stream.on('end', () => {
        readReceivedMessage(Buffer.concat(chunks))
          .then((message) => {
            storeMailboxMessage(options.mailboxFolder, {
              receivedAt: new Date().toISOString(),
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              to: session.envelope.rcptTo.map((recipient) => recipient.address),
              subject: message.subject,
              text: message.text,
              attachments: message.attachments,
            });
            callback();
          })
          .catch((error: Error) => callback(error));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  const { port } = server.server.address() as AddressInfo;
  return { port, stop: () => new Promise((resolve) => server.close(() => resolve())) };
}
