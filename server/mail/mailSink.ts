import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client';
import { mailMessages } from '../db/schema';
import { mimeText } from './mimeText';

export interface MailSink {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

/**
 * A local SMTP server on 127.0.0.1 that accepts every message and keeps it in the database, so the
 * product and its tests send real mail with nothing leaving the machine. Used when SMTP_URL is unset.
 */
export async function startMailSink(db: Db, port: number): Promise<MailSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const parts = mimeText(raw);
        const recipients = session.envelope.rcptTo.map((r) => r.address).join(', ');
        db.insert(mailMessages)
          .values({ recipients: recipients.slice(0, 1000), subject: parts.subject.slice(0, 500), text: parts.text, html: parts.html, raw })
          .then(() => callback(), (err: Error) => callback(err));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
