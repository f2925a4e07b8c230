import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { SMTPServer } from 'smtp-server';
import { readMessage } from './message-text';
import { insertMessage } from './repo';

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

const maxMessageBytes = 256 * 1024;

/**
 * A local SMTP relay on a loopback port that delivers nowhere: it stores each
 * message it accepts in the `outbox` table, and answers only after the row
 * is written, so a sender's promise resolving means the message is readable.
 */
export async function startFakeSmtp(db: Knex, options: { port?: number; now?: () => number } = {}): Promise<FakeSmtp> {
  const now = options.now ?? Date.now;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Hairline local mail fake',
    size: maxMessageBytes,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      let size = 0;
      stream.on('data', (c: Buffer) => {
        size += c.length;
        if (size <= maxMessageBytes) chunks.push(c);
      });
      stream.on('end', () => {
        if (stream.sizeExceeded) return callback(new Error('Message too large for the outbox'));
        const raw = Buffer.concat(chunks).toString('utf8');
        const { subject, text } = readMessage(raw);
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        insertMessage(db, {
          received_at_ms: now(),
          mail_from: from,
          rcpt_to: JSON.stringify(session.envelope.rcptTo.map((r) => r.address)),
          subject,
          text_body: text,
          raw,
        }).then(
          () => callback(),
          () => callback(new Error('The outbox could not store the message')),
        );
      });
    },
  });
  server.on('error', () => {
    /* a dropped client connection; the sender sees its own error */
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  const { port } = (server as unknown as { server: { address(): AddressInfo } }).server.address();
  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
