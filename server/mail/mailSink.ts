import { simpleParser } from 'mailparser';
import { SMTPServer, type SMTPServerSession } from 'smtp-server';
import type { Db } from '../db/client';
import { mailMessages } from '../db/schema';
import { multipartDepth } from './multipartDepth';

export interface MailSink {
  port: number;
  close(): Promise<void>;
}

/** What mail_messages.raw (a TEXT column) holds: a larger message could not be kept, so it is refused. */
export const MAX_MESSAGE_BYTES = 65_535;

/**
 * Crestline's own messages nest two levels (mixed around alternative); forwarded mail a few more.
 * Thousands of levels are only ever an attack on the parser, which walks the tree level by level.
 */
export const MAX_MULTIPART_DEPTH = 20;

/** An error whose code smtp-server sends back as the reply to DATA. */
const reply = (responseCode: number, message: string) => Object.assign(new Error(message), { responseCode });

async function keep(db: Db, session: SMTPServerSession, raw: string): Promise<void> {
  // Only what is stored is parsed: no text made from HTML or HTML from text, no image links resolved.
  const parsed = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true, skipTextLinks: true });
  const recipients = session.envelope.rcptTo.map((r) => r.address).join(', ');
  await db.insert(mailMessages).values({
    recipients: recipients.slice(0, 1000),
    subject: (parsed.subject ?? '').slice(0, 500),
    text: parsed.text ?? '',
    html: parsed.html || '',
    raw,
  });
}

/**
 * A local SMTP server on 127.0.0.1 that accepts every message and keeps it in the database, so the
 * product and its tests send real mail with nothing leaving the machine. Used when SMTP_URL is unset.
 * A client that misbehaves loses its own message and nothing else: connection errors are logged, a
 * message over MAX_MESSAGE_BYTES is answered 552 and one nested deeper than MAX_MULTIPART_DEPTH 554.
 */
export async function startMailSink(db: Db, port: number): Promise<MailSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    // Advertised in EHLO and checked against MAIL FROM's SIZE=; the bytes themselves are counted below.
    size: MAX_MESSAGE_BYTES,
    // A stop waits this long for a client in the middle of a message, not smtp-server's 30 s.
    closeTimeout: 3000,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      // Past the limit the rest is read (the client waits for a reply to all of it) but not kept.
      stream.on('data', (chunk: Buffer) => {
        if (!stream.sizeExceeded) chunks.push(chunk);
      });
      stream.on('end', () => {
        if (stream.sizeExceeded) return callback(reply(552, `5.3.4 Message too big: the limit is ${MAX_MESSAGE_BYTES} bytes`));
        const raw = Buffer.concat(chunks).toString('utf8');
        if (multipartDepth(raw, MAX_MULTIPART_DEPTH) > MAX_MULTIPART_DEPTH) {
          return callback(reply(554, `5.6.0 Message refused: its MIME parts nest deeper than ${MAX_MULTIPART_DEPTH} levels`));
        }
        keep(db, session, raw).then(
          () => callback(),
          (err: Error) => {
            console.error('mail sink: a message could not be kept:', err.message);
            callback(reply(451, '4.3.0 The message could not be kept; try again later'));
          },
        );
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  // smtp-server re-emits every connection's error (a client gone in the middle of a message, a reset)
  // on the server object; without a listener the first one would end the whole process.
  server.on('error', (err: Error & { code?: string; remoteAddress?: string }) => {
    console.error(`mail sink: connection from ${err.remoteAddress ?? 'a client'} failed: ${err.code ?? ''} ${err.message}`.replace(/ {2,}/g, ' '));
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
