import { desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { mailMessages } from '../db/schema';
import { AppError, notFound } from '../errors';
import { allow } from '../middleware/auth';

/** The local sink's messages, for admins; only while no real SMTP server is configured. */
export function adminMailRoutes(ctx: AppContext): Router {
  const localOnly = () => {
    if (!ctx.mailer.local) throw new AppError(404, 'not_local', 'Mail goes to the SMTP server set in SMTP_URL; nothing is kept here');
  };
  return Router()
    .use('/admin/mail', allow('admin'))
    .get('/admin/mail', async (_req, res) => {
      localOnly();
      const rows = await ctx.db.select({ id: mailMessages.id, recipients: mailMessages.recipients, subject: mailMessages.subject, receivedAt: mailMessages.receivedAt }).from(mailMessages).orderBy(desc(mailMessages.id)).limit(500);
      res.json({ items: rows.map((r) => ({ ...r, receivedAt: r.receivedAt.toISOString() })) });
    })
    .get('/admin/mail/:id', async (req, res) => {
      localOnly();
      const [row] = await ctx.db.select().from(mailMessages).where(eq(mailMessages.id, IdParam.parse(req.params).id));
      if (!row) throw notFound('Message');
      res.json({ id: row.id, recipients: row.recipients, subject: row.subject, receivedAt: row.receivedAt.toISOString(), text: row.text, html: row.html });
    });
}
