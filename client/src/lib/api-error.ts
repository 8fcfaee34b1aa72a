import { z } from 'zod';

export interface FieldError {
  path: string;
  message: string;
}

/** Every failed request becomes one of these: the client's copy of the server's problem+json. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  readonly status: number;
  /** Last segment of the problem type: "validation", "csrf", "not-found", … or "network". */
  readonly code: string;
  readonly title: string;
  readonly detail: string;
  readonly errors: FieldError[];
  /** Seconds from the Retry-After header (429), when the server sent one. */
  readonly retryAfter: number | null;

  constructor(init: {
    status: number;
    code: string;
    title: string;
    detail: string;
    errors?: FieldError[];
    retryAfter?: number | null;
  }) {
    super(init.detail);
    this.status = init.status;
    this.code = init.code;
    this.title = init.title;
    this.detail = init.detail;
    this.errors = init.errors ?? [];
    this.retryAfter = init.retryAfter ?? null;
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

const problemSchema = z.looseObject({
  type: z.string().optional(),
  title: z.string().optional(),
  status: z.number().optional(),
  detail: z.string().optional(),
  errors: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});

function parseRetryAfter(header: string | null): number | null {
  if (!header) return null;
  const seconds = Number(header);
  if (Number.isFinite(seconds) && seconds >= 0) return Math.ceil(seconds);
  const date = Date.parse(header);
  return Number.isNaN(date) ? null : Math.max(0, Math.ceil((date - Date.now()) / 1000));
}

function fallbackDetail(status: number): string {
  if (status >= 500) return 'Gaugeline could not finish this just now. Try again in a moment.';
  if (status === 404) return 'That was not found.';
  return 'The request was not accepted.';
}

/** Reads a non-2xx response; never throws while doing so. */
export async function apiErrorFromResponse(res: Response): Promise<ApiError> {
  const retryAfter = parseRetryAfter(res.headers.get('Retry-After'));
  const base = {
    status: res.status,
    code: `http-${res.status}`,
    title: res.statusText || 'Error',
    detail: fallbackDetail(res.status),
    retryAfter,
  };
  const type = res.headers.get('Content-Type') ?? '';
  if (!type.includes('json')) return new ApiError(base);
  let body: unknown;
  try {
    body = await res.json();
  } catch {
    return new ApiError(base);
  }
  const parsed = problemSchema.safeParse(body);
  if (!parsed.success) return new ApiError(base);
  const p = parsed.data;
  const code = p.type?.split('/').filter(Boolean).pop() ?? base.code;
  return new ApiError({
    ...base,
    code,
    title: p.title ?? base.title,
    detail: p.detail ?? base.detail,
    errors: p.errors ?? [],
  });
}

export function networkError(): ApiError {
  return new ApiError({
    status: 0,
    code: 'network',
    title: 'No connection',
    detail: 'Could not reach Gaugeline. Check the connection and try again.',
  });
}

/** A readable sentence for any error a query or mutation may throw. */
export function errorMessage(e: unknown): string {
  if (isApiError(e)) return e.detail;
  return 'Something went wrong in this page. Reload to try again.';
}

/** The same error, pinned to one field: for problems (like a 409) the server sends without field paths. */
export function onField(error: ApiError, path: string): ApiError {
  return new ApiError({ ...error, errors: [{ path, message: error.detail }] });
}
