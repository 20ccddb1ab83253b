import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { API_TOKEN_PREFIX, MAX_TOKENS_PER_USER, type ApiTokenCreated, type ApiTokenInfo, type CreateApiTokenRequest } from '../../shared/schemas/apiToken';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { countLiveTokens, deleteExpiredTokens, deleteToken, findLiveToken, findTokenOwner, insertToken, listTokens, touchToken } from '../db/apiTokenRepository';
import { users } from '../db/schema';
import { AppError, notFound } from '../errors';
import { countRequest } from './requestLimits';
import { hashSecretToken, sameHash } from './secretTokens';

const DAY_MS = 24 * 3600 * 1000;
/** The prefix and 32 base64url characters (192 random bits): anything else is refused before any lookup. */
const TOKEN_SHAPE = new RegExp(`^${API_TOKEN_PREFIX}[A-Za-z0-9_-]{32}$`);

/**
 * A new token for `user`, shown this once; only its SHA-256 is kept. At most MAX_TOKENS_PER_USER live
 * ones: the count and the insert run under a lock on the user's row, so parallel requests cannot
 * slip past the cap together.
 */
export async function createApiToken(ctx: AppContext, user: User, req: CreateApiTokenRequest): Promise<ApiTokenCreated> {
  const token = API_TOKEN_PREFIX + randomBytes(24).toString('base64url');
  const expiresAt = new Date(Date.now() + req.expiresInDays * DAY_MS);
  const id = await ctx.db.transaction(async (tx) => {
    await tx.select({ id: users.id }).from(users).where(eq(users.id, user.id)).for('update');
    await deleteExpiredTokens(tx, user.id);
    if ((await countLiveTokens(tx, user.id)) >= MAX_TOKENS_PER_USER) {
      throw new AppError(409, 'too_many_tokens', `You already have ${MAX_TOKENS_PER_USER} API tokens; revoke one you no longer use first`);
    }
    return insertToken(tx, { userId: user.id, name: req.name, tokenHash: hashSecretToken(token), hint: token.slice(-4), readOnly: req.readOnly, expiresAt });
  });
  return { id, token };
}

type Listed = Awaited<ReturnType<typeof listTokens>>[number];
const toInfo = (r: Listed, withOwner: boolean): ApiTokenInfo => ({
  id: r.id,
  name: r.name,
  hint: r.hint,
  readOnly: r.readOnly,
  createdAt: r.createdAt.toISOString(),
  lastUsedAt: r.lastUsedAt?.toISOString() ?? null,
  expiresAt: r.expiresAt.toISOString(),
  ...(withOwner ? { owner: { id: r.ownerId, name: r.ownerName, email: r.ownerEmail } } : {}),
});

export const ownApiTokens = async (ctx: AppContext, userId: number) => (await listTokens(ctx.db, userId)).map((r) => toInfo(r, false));

/** Every user's tokens, for admins. */
export const allApiTokens = async (ctx: AppContext) => (await listTokens(ctx.db)).map((r) => toInfo(r, true));

/** Revokes a token at once: its owner, or an admin. Someone else's token id answers 404, as an unknown one does. */
export async function revokeApiToken(ctx: AppContext, user: User, id: number): Promise<void> {
  const owner = await findTokenOwner(ctx.db, id);
  if (owner === null || (owner !== user.id && user.role !== 'admin')) throw notFound('API token');
  await deleteToken(ctx.db, id);
}

/**
 * The owner a token acts as, with the owner's current role, or null when the token is malformed,
 * unknown, revoked or expired, or its owner is deactivated (one answer for all, so a guess learns
 * nothing). The lookup is by the token's hash, so no comparison runs over the secret itself.
 */
export async function resolveApiToken(ctx: AppContext, token: string): Promise<{ user: User; tokenId: number; readOnly: boolean } | null> {
  if (!TOKEN_SHAPE.test(token)) return null;
  const hash = hashSecretToken(token);
  const row = await findLiveToken(ctx.db, hash);
  if (!row || !sameHash(row.tokenHash, hash) || !row.user.active) return null;
  if (row.stale) await touchToken(ctx.db, row.id);
  const { id, email, name, role } = row.user;
  return { user: { id, email, name, role }, tokenId: row.id, readOnly: row.readOnly };
}

/** Each token's own request limit, counted in the database so that every server process shares it. */
export const countTokenRequest = (ctx: AppContext, tokenId: number) =>
  countRequest(ctx, `api-token:${tokenId}`, ctx.config.TOKEN_REQUESTS_PER_MINUTE, 60, { code: 'too_many_requests', message: 'This API token is making too many requests' });
