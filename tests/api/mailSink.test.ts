import { connect, type Socket } from 'node:net';
import { eq } from 'drizzle-orm';
import nodemailer, { type SendMailOptions } from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { mailMessages } from '../../server/db/schema';
import { MAX_MESSAGE_BYTES, MAX_MULTIPART_DEPTH } from '../../server/mail/mailSink';
import { multipartDepth } from '../../server/mail/multipartDepth';
import type { RunningServer } from '../../server/server';
import { lastMailTo } from '../helpers/mailbox';
import { resetDatabase, startTestServer } from '../helpers/testServer';

let app: RunningServer;
beforeAll(async () => {
  app = await startTestServer();
  await resetDatabase(app);
});
afterAll(async () => {
  await app?.stop();
});

/** A bare SMTP client: one command, one reply, each within a few seconds. */
async function smtpClient(port: number) {
  const socket: Socket = connect(port, '127.0.0.1');
  let buffered = '';
  let waiting: (() => void) | null = null;
  socket.setEncoding('utf8');
  socket.on('data', (text: string) => {
    buffered += text;
    waiting?.();
  });
  socket.on('error', () => undefined);
  /** The code of the next complete reply (the last line of a multi-line one is "NNN text"). */
  const reply = async (): Promise<number> => {
    const until = Date.now() + 5000;
    for (;;) {
      const m = /^(\d{3}) .*\r\n/m.exec(buffered);
      if (m) {
        buffered = buffered.slice(m.index + m[0].length);
        return Number(m[1]);
      }
      if (Date.now() > until) throw new Error(`no SMTP reply; got so far: ${buffered}`);
      await new Promise<void>((resolve) => {
        waiting = resolve;
        setTimeout(resolve, 100);
      });
    }
  };
  const command = async (line: string) => {
    socket.write(`${line}\r\n`);
    return reply();
  };
  expect(await reply()).toBe(220);
  return { socket, reply, command };
}

/** Opens a transaction up to the message body, as a client about to send one. */
async function startMessage(port: number, to: string) {
  const client = await smtpClient(port);
  expect(await client.command('EHLO tests.example')).toBe(250);
  expect(await client.command('MAIL FROM:<sender@test.example>')).toBe(250);
  expect(await client.command(`RCPT TO:<${to}>`)).toBe(250);
  expect(await client.command('DATA')).toBe(354);
  return client;
}

/** `levels` multiparts each inside the previous one, as compact as MIME allows. */
function nested(levels: number): string {
  let open = 'Subject: deep\r\n';
  let close = '';
  for (let i = 0; i < levels; i++) {
    open += `Content-Type: multipart/mixed; boundary=${i}\r\n\r\n--${i}\r\n`;
    close = `\r\n--${i}--${close}`;
  }
  return `${open}Content-Type: text/plain\r\n\r\nhello${close}\r\n`;
}

async function storedFor(address: string) {
  return app.ctx.db.select().from(mailMessages).where(eq(mailMessages.recipients, address));
}

describe('the local mail sink', () => {
  it('stays up when two clients drop their connection in the middle of a message, and keeps the next one', async () => {
    const port = app.mailSinkPort as number;
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    for (const attempt of [1, 2]) {
      const client = await startMessage(port, `dropped-${attempt}@test.example`);
      await new Promise<void>((resolve) => client.socket.write('Subject: cut short\r\n\r\nhalf a mess', () => resolve()));
      await new Promise((r) => setTimeout(r, 50));
      // A reset rather than a polite close: the sink sees ECONNRESET in the middle of the transaction.
      client.socket.resetAndDestroy();
      await new Promise((r) => setTimeout(r, 100));
    }
    const resets = logged.mock.calls.filter(([line]) => String(line).includes('ECONNRESET'));
    logged.mockRestore();
    // Both drops reached the sink as errors (the second is the one that used to end the process).
    expect(resets).toHaveLength(2);
    await app.ctx.mailer.send({ to: 'after-drops@test.example', subject: 'Still here', text: 'The sink kept going.', html: '<p>The sink kept going.</p>' });
    const mail = await lastMailTo(app, 'after-drops@test.example');
    expect(mail.subject).toBe('Still here');
    expect(mail.text.trim()).toBe('The sink kept going.');
    expect(mail.html).toBe('<p>The sink kept going.</p>');
    expect(await storedFor('dropped-1@test.example')).toEqual([]);
  });

  it(`refuses a message nested 1,000 levels deep with 554, stores nothing and keeps serving`, async () => {
    const raw = nested(1000);
    expect(raw.length).toBeLessThan(MAX_MESSAGE_BYTES);
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: app.mailSinkPort as number, secure: false, ignoreTLS: true });
    await expect(transport.sendMail({ envelope: { from: 'sender@test.example', to: ['deep@test.example'] }, raw })).rejects.toMatchObject({ responseCode: 554 });
    expect(await storedFor('deep@test.example')).toEqual([]);

    // Nesting up to the limit is still accepted.
    await transport.sendMail({ envelope: { from: 'sender@test.example', to: ['nested-ok@test.example'] }, raw: nested(MAX_MULTIPART_DEPTH) });
    expect((await lastMailTo(app, 'nested-ok@test.example')).text.trim()).toBe('hello');
  });

  it('refuses a message over the size limit with 552 even when the client declared no size', async () => {
    const client = await startMessage(app.mailSinkPort as number, 'oversize@test.example');
    const line = `${'x'.repeat(998)}\r\n`;
    client.socket.write(`Subject: too big\r\n\r\n${line.repeat(Math.ceil(MAX_MESSAGE_BYTES / line.length) + 1)}`);
    expect(await client.command('.')).toBe(552);
    // The connection serves another transaction afterwards.
    expect(await client.command('MAIL FROM:<sender@test.example>')).toBe(250);
    client.socket.destroy();
    expect(await storedFor('oversize@test.example')).toEqual([]);
  });

  it('keeps subject, text, HTML and recipients of a message written by nodemailer', async () => {
    await app.ctx.mailer.send({ to: 'shape@test.example', subject: 'Grüße: “RMS” ✓', text: 'Plain line one\nline two = 3', html: '<p>Grüße, <b>Crestline</b></p>' });
    const mail = await lastMailTo(app, 'shape@test.example');
    expect(mail.recipients).toBe('shape@test.example');
    expect(mail.subject).toBe('Grüße: “RMS” ✓');
    expect(mail.text.trim()).toBe('Plain line one\nline two = 3');
    expect(mail.html).toBe('<p>Grüße, <b>Crestline</b></p>');
    expect(mail.raw).toContain('Content-Type: multipart/alternative');
  });
});

describe('multipartDepth', () => {
  const compose = async (mail: SendMailOptions) => {
    const transport = nodemailer.createTransport({ streamTransport: true, buffer: true });
    return (await transport.sendMail({ from: 'a@test.example', to: 'b@test.example', ...mail })).message.toString();
  };

  it('counts a plain text message as 0 levels', async () => {
    expect(multipartDepth(await compose({ subject: 's', text: 'hello' }), 20)).toBe(0);
  });

  it('counts text and HTML with an attachment as 2 levels (mixed around alternative)', async () => {
    const raw = await compose({ subject: 's', text: 'hello', html: '<p>hello</p>', attachments: [{ filename: 'a.csv', content: 't,v\n0,1\n' }] });
    expect(multipartDepth(raw, 20)).toBe(2);
  });

  it('counts siblings once: thirty alternatives side by side in one mixed are 2 levels', () => {
    let raw = 'Content-Type: multipart/mixed; boundary="outer"\r\n\r\n';
    for (let i = 0; i < 30; i++) raw += `--outer\r\nContent-Type: multipart/alternative;\r\n\tboundary="inner${i}"\r\n\r\n--inner${i}\r\nContent-Type: text/plain\r\n\r\nx\r\n--inner${i}--\r\n`;
    raw += '--outer--\r\n';
    expect(multipartDepth(raw, 20)).toBe(2);
  });

  it('stops counting just past the limit on a 1,000-level message', () => {
    expect(multipartDepth(nested(1000), 20)).toBe(21);
    expect(multipartDepth(nested(1000), 2000)).toBe(1000);
  });
});
