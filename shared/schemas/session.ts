import { z } from 'zod';

/** One of the signed-in user's own live sessions, as the account page lists them. */
export const SessionInfo = z.object({
  id: z.number().int(),
  /** A short description of the browser, e.g. "Firefox on Linux". */
  userAgent: z.string(),
  createdAt: z.string(),
  /** Updated at most once a minute. */
  lastSeenAt: z.string(),
  expiresAt: z.string(),
  /** The session this request came from. */
  current: z.boolean(),
});
export type SessionInfo = z.infer<typeof SessionInfo>;

export const SessionList = z.object({ items: z.array(SessionInfo) });
export type SessionList = z.infer<typeof SessionList>;
