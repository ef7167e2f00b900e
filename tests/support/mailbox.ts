// Reads what the local SMTP fake stored (SMTP_FAKE_DIR, set by `npm test`): one .eml per message
// and an index line each. Tests find their own messages by recipient, since runs share the fake.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';

type IndexEntry = { id: string; file: string; receivedAt: string; to: string[]; subject: string; messageId: string };

function mailDir(): string {
  const dir = process.env.SMTP_FAKE_DIR;
  if (!dir) throw new Error('SMTP_FAKE_DIR is not set: run the tests with `npm test`, which starts the mail fake.');
  return dir;
}

export function mailIndex(): IndexEntry[] {
  const file = join(mailDir(), 'index.jsonl');
  if (!existsSync(file)) return [];
  return readFileSync(file, 'utf8')
    .split('\n')
    .filter(Boolean)
    .map((line) => JSON.parse(line) as IndexEntry);
}

export function messagesTo(address: string): IndexEntry[] {
  return mailIndex().filter((m) => m.to.some((t) => t.toLowerCase() === address.toLowerCase()));
}

export async function readMail(entry: IndexEntry): Promise<ParsedMail> {
  return simpleParser(readFileSync(join(mailDir(), entry.file)));
}

/**
 * Waits until `count` messages have reached `address` (the worker polls the queue, so mail takes a
 * moment). The deadline only bounds a broken run; no test depends on how fast mail arrives.
 */
export async function waitForMail(address: string, count = 1, timeoutMs = 20_000): Promise<IndexEntry[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = messagesTo(address);
    if (found.length >= count) return found;
    if (Date.now() > deadline) throw new Error(`expected ${count} message(s) to ${address}, found ${found.length}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
