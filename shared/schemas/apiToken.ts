import { z } from 'zod';

/** Every API token starts with this, so secret scanners (and people) recognise one in a paste or a commit. */
export const API_TOKEN_PREFIX = 'crl_';
/** Live tokens one user may hold at once; a rig needs one or two, a lab a handful. */
export const MAX_TOKENS_PER_USER = 50;
export const DEFAULT_TOKEN_DAYS = 90;

export const CreateApiTokenRequest = z.object({
  name: z.string().trim().min(1, 'Name the token after what will use it, e.g. "Bench 2 rig"').max(120),
  expiresInDays: z.number().int().min(1).max(365).default(DEFAULT_TOKEN_DAYS),
  /** A read-only token can only read: GET and HEAD. */
  readOnly: z.boolean().default(false),
});
export type CreateApiTokenRequest = z.infer<typeof CreateApiTokenRequest>;

/** The answer to creating a token: the only time the token itself is shown. */
export const ApiTokenCreated = z.object({ id: z.number().int(), token: z.string() });
export type ApiTokenCreated = z.infer<typeof ApiTokenCreated>;

export const ApiTokenInfo = z.object({
  id: z.number().int(),
  name: z.string(),
  /** The token's last four characters, to tell tokens apart. */
  hint: z.string(),
  readOnly: z.boolean(),
  createdAt: z.string(),
  /** Updated at most once a minute; null until first used. */
  lastUsedAt: z.string().nullable(),
  expiresAt: z.string(),
  /** Only in the admins' list of every token. */
  owner: z.object({ id: z.number().int(), name: z.string(), email: z.string() }).optional(),
});
export type ApiTokenInfo = z.infer<typeof ApiTokenInfo>;

export const ApiTokenList = z.object({ items: z.array(ApiTokenInfo) });
export type ApiTokenList = z.infer<typeof ApiTokenList>;
