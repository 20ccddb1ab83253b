import type { Request } from 'express';

/**
 * The token of an `Authorization: Bearer …` header: '' when the scheme is Bearer but the token is
 * missing, null when there is no Bearer header at all. Only the header is read: a token in the query
 * string would end up in proxy and server logs, so it is never accepted there. Other schemes (Basic,
 * which a browser may attach by itself) do not count.
 */
export function bearerToken(req: Request): string | null {
  const header = req.get('authorization');
  if (header === undefined) return null;
  const value = header.trim();
  const space = value.indexOf(' ');
  const scheme = space < 0 ? value : value.slice(0, space);
  if (scheme.toLowerCase() !== 'bearer') return null;
  return space < 0 ? '' : value.slice(space + 1).trim();
}
