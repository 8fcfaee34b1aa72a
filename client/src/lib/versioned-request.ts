import { z } from 'zod';
import { apiFetch } from './api-client';
import { ApiError, apiErrorFromResponse, networkError } from './api-error';

/**
 * Requests that lib/api-client.ts cannot make yet: writes carrying `If-Match: "N"` (the
 * optimistic-lock version the person edited) and multipart photo uploads. It fetches the
 * CSRF token through apiFetch and sends the same headers apiFetch does. When api-client
 * grows a `headers` option this file shrinks to a call of apiFetch.
 */

const csrfSchema = z.object({ token: z.string().min(1) });
let csrfToken: Promise<string> | null = null;

/** Forget the token (tests; a new session). */
export function clearVersionedCsrfToken(): void {
  csrfToken = null;
}

function token(): Promise<string> {
  if (!csrfToken) {
    const pending = apiFetch('/api/auth/csrf', { schema: csrfSchema }).then((t) => t.token);
    pending.catch(() => {
      if (csrfToken === pending) csrfToken = null;
    });
    csrfToken = pending;
  }
  return csrfToken;
}

export interface VersionedOptions<T> {
  method: 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** JSON body, or FormData for an upload. */
  body?: unknown;
  /** The version the person last saw; sent as If-Match. */
  version?: number | null;
  schema: z.ZodType<T>;
}

async function sendOnce(path: string, options: VersionedOptions<unknown>, csrf: string): Promise<Response> {
  const headers: Record<string, string> = {
    Accept: 'application/json, application/problem+json',
    'X-CSRF-Token': csrf,
  };
  const isForm = options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (options.version !== undefined && options.version !== null) headers['If-Match'] = `"${options.version}"`;
  const body =
    options.body === undefined
      ? undefined
      : options.body instanceof FormData
        ? options.body
        : JSON.stringify(options.body);
  let res: Response;
  try {
    res = await fetch(path, { method: options.method, credentials: 'same-origin', headers, body });
  } catch {
    throw networkError();
  }
  if (!res.ok) throw await apiErrorFromResponse(res);
  return res;
}

export async function versionedFetch<T>(path: string, options: VersionedOptions<T>): Promise<T> {
  let res: Response;
  try {
    res = await sendOnce(path, options, await token());
  } catch (e) {
    if (!(e instanceof ApiError && e.status === 403 && e.code === 'csrf')) throw e;
    csrfToken = null;
    res = await sendOnce(path, options, await token());
  }
  const text = res.status === 204 ? '' : await res.text();
  return options.schema.parse(text === '' ? undefined : JSON.parse(text));
}
