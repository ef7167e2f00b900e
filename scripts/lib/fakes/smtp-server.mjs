// A small SMTP server that accepts every message and stores it. Run detached by smtp.mjs.
// A recipient whose local part starts with "tempfail-once" is refused once with a 451 (try again
// later) and accepted on the next attempt, so tests can watch the queue retry.
import { appendFileSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { SMTPServer } from 'smtp-server';

const port = Number(process.env.FAKE_PORT);
const dir = process.env.FAKE_MAIL_DIR;
mkdirSync(dir, { recursive: true });
let sequence = readdirSync(dir).filter((f) => f.endsWith('.eml')).length;
const refusedOnce = new Set();

function headerValue(raw, name) {
  const head = raw.split(/\r?\n\r?\n/)[0] ?? '';
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  const match = unfolded.match(new RegExp(`^${name}:\\s*(.*)$`, 'im'));
  return match ? match[1].trim() : '';
}

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS', 'AUTH'],
  banner: 'Tickover local mail fake',
  size: 20 * 1024 * 1024,
  onRcptTo(address, _session, callback) {
    const local = address.address.split('@')[0] ?? '';
    if (local.startsWith('tempfail-once') && !refusedOnce.has(address.address)) {
      refusedOnce.add(address.address);
      const error = new Error('Mailbox busy, try again later');
      error.responseCode = 451;
      return callback(error);
    }
    return callback();
  },
  onData(stream, session, callback) {
    const chunks = [];
    stream.on('data', (c) => chunks.push(c));
    stream.on('end', () => {
      const raw = Buffer.concat(chunks).toString('utf8');
      sequence += 1;
      const id = randomUUID();
      const file = `${String(sequence).padStart(6, '0')}-${id}.eml`;
      writeFileSync(join(dir, file), raw);
      const entry = {
        id,
        file,
        receivedAt: new Date().toISOString(),
        from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
        to: session.envelope.rcptTo.map((r) => r.address),
        subject: headerValue(raw, 'Subject'),
        messageId: headerValue(raw, 'Message-ID'),
      };
      appendFileSync(join(dir, 'index.jsonl'), JSON.stringify(entry) + '\n');
      callback(null, `Stored as ${id}`);
    });
  },
});

server.on('error', (error) => console.error('[smtp fake]', error.message));
server.listen(port, '127.0.0.1', () => console.log(`[smtp fake] listening on 127.0.0.1:${port}, storing in ${dir}`));
for (const signal of ['SIGTERM', 'SIGINT']) process.on(signal, () => server.close(() => process.exit(0)));
