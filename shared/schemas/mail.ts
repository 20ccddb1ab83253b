import { z } from 'zod';

export const MailSummary = z.object({ id: z.number().int(), recipients: z.string(), subject: z.string(), receivedAt: z.string() });
export type MailSummary = z.infer<typeof MailSummary>;
export const MailMessage = MailSummary.extend({ text: z.string(), html: z.string() });
export type MailMessage = z.infer<typeof MailMessage>;
