import type { OutgoingMail } from './mailer';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);

const SAFETY =
  'Measuring mains and other high-energy circuits is work for qualified persons with instruments rated for the measurement category; follow local codes and licensed practice.';

function layout(title: string, paragraphs: string[], link: { href: string; label: string }, footer: string): { text: string; html: string } {
  const text = [...paragraphs, '', `${link.label}: ${link.href}`, '', footer, '', SAFETY].join('\n');
  const html = `<!doctype html><html><body style="font-family:Inter,Arial,sans-serif;color:#25231f;max-width:36rem">
<h2 style="color:#1d5a56">${esc(title)}</h2>
${paragraphs.map((p) => `<p>${esc(p)}</p>`).join('\n')}
<p><a href="${esc(link.href)}" style="background:#1d5a56;color:#fff;padding:0.5rem 1rem;border-radius:6px;text-decoration:none">${esc(link.label)}</a></p>
<p style="color:#686357;font-size:0.85rem">${esc(footer)}</p>
<p style="color:#686357;font-size:0.8rem">${esc(SAFETY)}</p>
</body></html>`;
  return { text, html };
}

export function shareMail(to: string, by: string, what: string, url: string, expires: Date, message?: string): OutgoingMail {
  const paragraphs = [`${by} shared ${what} from Crestline with you: waveforms, true RMS figures, meter readings and harmonics, read-only.`];
  if (message) paragraphs.push(`${by} wrote: “${message}”`);
  return {
    to,
    subject: `${by} shared ${what} with you`,
    ...layout('A capture was shared with you', paragraphs, { href: url, label: 'Open the shared view' }, `The link works without an account until ${expires.toUTCString()}, unless it is revoked earlier.`),
  };
}

export function inviteMail(to: string, by: string, url: string, expires: Date): OutgoingMail {
  return {
    to,
    subject: 'You are invited to Crestline',
    ...layout('Welcome to Crestline', [`${by} invited you to the team's Crestline workspace for waveform captures.`, 'Choose your password to sign in.'], { href: url, label: 'Set your password' }, `This link works once, until ${expires.toUTCString()}.`),
  };
}

export function resetMail(to: string, url: string, expires: Date): OutgoingMail {
  return {
    to,
    subject: 'Reset your Crestline password',
    ...layout('Password reset', ['Someone (we hope you) asked to reset the password of this Crestline account. If it was not you, ignore this message: nothing changes.'], { href: url, label: 'Choose a new password' }, `This link works once, until ${expires.toUTCString()}.`),
  };
}
