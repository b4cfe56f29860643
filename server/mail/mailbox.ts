import { mkdirSync, readdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { DemoMailMessage } from '../../shared/api/api-schemas';

export type MailboxMessage = DemoMailMessage;

let sequence = 0;

/** Keeps one received message as a JSON file; written under a temporary name and renamed, so readers never see half of it. */
export function storeMailboxMessage(folder: string, message: Omit<MailboxMessage, 'id'>): MailboxMessage {
  mkdirSync(folder, { recursive: true });
  const id = `${Date.parse(message.receivedAt)}-${process.pid}-${++sequence}`;
  const stored = { id, ...message };
  const file = join(folder, `${id}.json`);
  writeFileSync(`${file}.part`, JSON.stringify(stored));
  renameSync(`${file}.part`, file);
  return stored;
}

/** Every message in the folder, newest first; an absent folder is an empty mailbox. */
export function readMailbox(folder: string): MailboxMessage[] {
  let names: string[];
  try {
    names = readdirSync(folder).filter((name) => name.endsWith('.json'));
  } catch {
    return [];
  }
  return (
    names
      .map((name) => JSON.parse(readFileSync(join(folder, name), 'utf8')) as MailboxMessage)
      // messages kept before attachments were listed had none
      .map((message) => ({ ...message, attachments: message.attachments ?? [] }))
      .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id))
  );
}
