import { desc } from 'drizzle-orm';
import { mailMessages } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';

/** The newest message the local sink received for an address, waiting for it to arrive. */
export async function lastMailTo(app: RunningServer, address: string, timeoutMs = 5000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const rows = await app.ctx.db.select().from(mailMessages).orderBy(desc(mailMessages.id)).limit(50);
    const hit = rows.find((r) => r.recipients.includes(address));
    if (hit) return hit;
    if (Date.now() > until) throw new Error(`no mail for ${address} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

export const linkIn = (text: string, path: string) => {
  const m = new RegExp(`https?://[^\\s"<>]*${path}[^\\s"<>]*`).exec(text);
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[0];
};
