import { API_VERSION_HEADER, DEVICE_HEADER } from '@contract';
import type { z } from 'zod';
import { CLIENT_API_VERSION, noteServerApiVersion } from './api-version';
import { ApiError, apiErrorFromResponse, networkError } from './api-error';
import { forgetEarly, takeEarly } from './early-fetch';
import { deviceLabel } from './device';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface ApiOptions {
  method?: Method;
  /** JSON (any value), or FormData for an upload (the browser sets the multipart boundary). */
  body?: unknown;
  /** The optimistic-lock version the person edited, sent as `If-Match: "N"`. */
  version?: number | null;
  /** A queued change replayed for this person (user id): the server refuses it under anyone else's session. */
  person?: string;
  signal?: AbortSignal;
}

let csrfToken: Promise<string> | null = null;

/** The CSRF token is tied to the session: forget it whenever the session changes (sign-in, sign-out). */
export function clearCsrfToken(): void {
  csrfToken = null;
}

// Checked by hand rather than with zod: this file is in the first chunk every page loads (issue 11).
function tokenOf(body: unknown): string {
  const token: unknown = typeof body === 'object' && body !== null ? Reflect.get(body, 'token') : undefined;
  if (typeof token !== 'string' || token === '') throw new Error('The server sent no CSRF token.');
  return token;
}

function getCsrfToken(): Promise<string> {
  if (!csrfToken) {
    const pending = send('/api/auth/csrf', { method: 'GET' }).then(async (res) => tokenOf(await res.json()));
    // A failed fetch must not stay cached.
    pending.catch(() => {
      if (csrfToken === pending) csrfToken = null;
    });
    csrfToken = pending;
  }
  return csrfToken;
}

async function send(path: string, options: ApiOptions, csrf?: string): Promise<Response> {
  const headers: Record<string, string> = {
    Accept: 'application/json, application/problem+json',
    [API_VERSION_HEADER]: CLIENT_API_VERSION,
  };
  const form = typeof FormData !== 'undefined' && options.body instanceof FormData ? options.body : null;
  if (options.body !== undefined && !form) headers['Content-Type'] = 'application/json';
  if (csrf) headers['X-CSRF-Token'] = csrf;
  if ((options.method ?? 'GET') !== 'GET') headers[DEVICE_HEADER] = deviceLabel();
  if (options.version !== undefined && options.version !== null) headers['If-Match'] = `"${options.version}"`;
  if (options.person !== undefined) headers['X-Gaugeline-Person'] = options.person;
  const method = options.method ?? 'GET';
  if (method !== 'GET') forgetEarly();
  // A plain read the entry already asked for (lib/early-fetch.ts) takes that answer, checked like any other.
  const early =
    method === 'GET' && options.version == null && options.person === undefined ? takeEarly(path) : undefined;
  let res: Response;
  try {
    res = await (early ??
      fetch(path, {
        method,
        credentials: 'same-origin',
        headers,
        body: options.body === undefined ? undefined : (form ?? JSON.stringify(options.body)),
        signal: options.signal,
      }));
  } catch (e) {
    if (e instanceof DOMException && e.name === 'AbortError') throw e;
    throw networkError();
  }
  noteServerApiVersion(res.headers.get(API_VERSION_HEADER));
  if (!res.ok) throw await apiErrorFromResponse(res);
  return res;
}

async function sendWithCsrf(path: string, options: ApiOptions): Promise<Response> {
  const method = options.method ?? 'GET';
  if (method === 'GET') return send(path, options);
  try {
    return await send(path, options, await getCsrfToken());
  } catch (e) {
    // The session may have rotated under us: fetch a fresh token and try exactly once more.
    if (!(e instanceof ApiError && e.status === 403 && e.code === 'csrf')) throw e;
    clearCsrfToken();
    return send(path, options, await getCsrfToken());
  }
}

async function readBody(res: Response): Promise<unknown> {
  if (res.status === 204) return undefined;
  const text = await res.text();
  return text === '' ? undefined : JSON.parse(text);
}

/**
 * The one fetch for our API: same-origin cookie, X-CSRF-Token on writes (fetched once, refetched
 * and retried once after a 403 csrf), If-Match from `version`, JSON or FormData bodies. With a
 * schema, the body is parsed (the parse boundary: callers get typed data or a thrown error).
 * Non-2xx responses throw ApiError; no connection throws ApiError code 'network'.
 */
export function apiFetch<T>(path: string, options: ApiOptions & { schema: z.ZodType<T> }): Promise<T>;
export function apiFetch(path: string, options?: ApiOptions): Promise<unknown>;
export async function apiFetch<T>(
  path: string,
  options: ApiOptions & { schema?: z.ZodType<T> } = {},
): Promise<unknown> {
  const res = await sendWithCsrf(path, options);
  const body = await readBody(res);
  return options.schema ? options.schema.parse(body) : body;
}
