import { z } from 'zod';

/** What a person may add to a report they download: a title, a summary, their name and company. */
export const ReportOptions = z.object({
  title: z.string().trim().max(200).optional(),
  summary: z.string().trim().max(4000).optional(),
  preparedBy: z.string().trim().max(120).optional(),
  company: z.string().trim().max(160).optional(),
});
export type ReportOptions = z.infer<typeof ReportOptions>;
