import type { Knex } from 'knex';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

/** A local SMTP server on a loopback port that keeps what it receives in `caught_mail`. */
export interface DemoMailServer {
  host: string;
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

/**
 * Real SMTP on 127.0.0.1 (a free port), so demo mode, development and tests send through the
 * same nodemailer path as production. No authentication and no TLS: it listens on loopback only.
 * A message is answered `250` only once it is stored, so a sender that got its answer finds it
 * in the table.
 */
export async function startDemoMailServer(db: Knex, now: () => Date): Promise<DemoMailServer> {
  const server = new SMTPServer({
    name: 'turnwise-demo-mail',
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', callback);
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error('Message too large for the demo mail server'), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks);
        store(db, raw, session.envelope, now()).then(() => callback(), callback);
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  if (!address || typeof address === 'string') throw new Error('The demo mail server has no port.');
  return {
    host: '127.0.0.1',
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

async function store(db: Knex, raw: Buffer, envelope: { mailFrom: false | { address: string }; rcptTo: { address: string }[] }, at: Date): Promise<void> {
  const parsed = await simpleParser(raw);
  await db('caught_mail').insert({
    received_at: at.toISOString(),
    envelope_from: envelope.mailFrom ? envelope.mailFrom.address : null,
    envelope_to: JSON.stringify(envelope.rcptTo.map((r) => r.address)),
    message_id: parsed.messageId ?? null,
    subject: parsed.subject ?? null,
    text: parsed.text ?? null,
    html: typeof parsed.html === 'string' ? parsed.html : null,
    raw: raw.toString('utf8'),
  });
}
