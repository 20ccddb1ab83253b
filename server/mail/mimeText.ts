/** Subject, plain text and HTML of a MIME message as nodemailer writes it (multipart/alternative, QP or base64). */
export interface MailParts {
  subject: string;
  text: string;
  html: string;
}

function splitHead(raw: string): { head: string; body: string } {
  const at = raw.search(/\r?\n\r?\n/);
  if (at < 0) return { head: raw, body: '' };
  return { head: raw.slice(0, at), body: raw.slice(at).replace(/^\r?\n\r?\n/, '') };
}

function header(head: string, name: string): string {
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  const m = new RegExp(`^${name}:\\s*(.*)$`, 'im').exec(unfolded);
  return m ? m[1].trim() : '';
}

/** RFC 2047 encoded words: =?UTF-8?B?...?= and =?UTF-8?Q?...?=. */
function decodeWords(s: string): string {
  return s.replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=\s*/g, (_m, _charset, enc: string, text: string) =>
    enc.toUpperCase() === 'B' ? Buffer.from(text, 'base64').toString('utf8') : Buffer.from(qpBytes(text.replace(/_/g, ' '))).toString('utf8'),
  );
}

function qpBytes(s: string): number[] {
  const out: number[] = [];
  for (let i = 0; i < s.length; i++) {
    if (s[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(s.slice(i + 1, i + 3))) {
      out.push(parseInt(s.slice(i + 1, i + 3), 16));
      i += 2;
    } else out.push(...Buffer.from(s[i], 'utf8'));
  }
  return out;
}

function decodeBody(head: string, body: string): string {
  const enc = header(head, 'Content-Transfer-Encoding').toLowerCase();
  if (enc === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (enc === 'quoted-printable') return Buffer.from(qpBytes(body.replace(/=\r?\n/g, ''))).toString('utf8');
  return body;
}

export function mimeText(raw: string): MailParts {
  const { head, body } = splitHead(raw);
  const parts: MailParts = { subject: decodeWords(header(head, 'Subject')), text: '', html: '' };
  const walk = (h: string, b: string) => {
    const type = header(h, 'Content-Type').toLowerCase();
    const boundary = /boundary="?([^";]+)"?/i.exec(header(h, 'Content-Type'))?.[1];
    if (type.startsWith('multipart/') && boundary) {
      for (const chunk of b.split(`--${boundary}`).slice(1)) {
        if (chunk.startsWith('--')) break;
        const p = splitHead(chunk.replace(/^\r?\n/, ''));
        walk(p.head, p.body.replace(/\r?\n$/, ''));
      }
    } else if (type.startsWith('text/html')) parts.html ||= decodeBody(h, b);
    else if (type.startsWith('text/plain') || type === '') parts.text ||= decodeBody(h, b);
  };
  walk(head, body);
  return parts;
}
