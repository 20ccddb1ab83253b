import { CLIENT_HEADER, CLIENT_HEADER_VALUE } from '../../shared/clientHeader';
import { ApiErrorBody } from '../../shared/schemas/error';

/** An error answered by the API, with its code, message and (for CSV errors) file line. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly line?: number,
  ) {
    super(message);
  }
}

export const isApiError = (e: unknown): e is ApiError => e instanceof ApiError;

async function toError(res: Response): Promise<ApiError> {
  const parsed = ApiErrorBody.safeParse(await res.json().catch(() => null));
  if (parsed.success) return new ApiError(res.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.line);
  return new ApiError(res.status, 'http_error', `The server answered ${res.status} ${res.statusText}`);
}

/** Sent on every API call: the server refuses state-changing requests it cannot tell came from Crestline itself. */
export const clientHeaders: Record<string, string> = { [CLIENT_HEADER]: CLIENT_HEADER_VALUE };

/** The one fetch wrapper: JSON in and out, cookies included, errors as ApiError. */
export async function api<T>(method: string, path: string, body?: unknown): Promise<T> {
  const res = await fetch(`/api${path}`, {
    method,
    credentials: 'same-origin',
    headers: body === undefined ? clientHeaders : { ...clientHeaders, 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw await toError(res);
  return res.status === 204 ? (undefined as T) : ((await res.json()) as T);
}

/** A GET answered as bytes (the binary samples answer, say), with the same cookies, header and errors as `api`. */
export async function apiBytes(path: string, accept: string): Promise<ArrayBuffer> {
  const res = await fetch(`/api${path}`, { credentials: 'same-origin', headers: { ...clientHeaders, accept } });
  if (!res.ok) throw await toError(res);
  return res.arrayBuffer();
}

export { toError };
