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
  /** The problem body's other members as sent (e.g. `existing` on a 409 duplicate); read them with a check. */
  readonly extra: Readonly<Record<string, unknown>>;

  constructor(init: {
    status: number;
    code: string;
    title: string;
    detail: string;
    errors?: FieldError[];
    retryAfter?: number | null;
    extra?: Readonly<Record<string, unknown>>;
  }) {
    super(init.detail);
    this.status = init.status;
    this.code = init.code;
    this.title = init.title;
    this.detail = init.detail;
    this.errors = init.errors ?? [];
    this.retryAfter = init.retryAfter ?? null;
    this.extra = init.extra ?? {};
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

interface Problem {
  type?: string;
  title?: string;
  detail?: string;
  errors: FieldError[];
  extra: Record<string, unknown>;
}

const PROBLEM_MEMBERS = new Set(['type', 'title', 'status', 'detail', 'instance', 'errors']);

const optionalString = (v: unknown): v is string | undefined => v === undefined || typeof v === 'string';
const isFieldError = (v: unknown): v is FieldError =>
  typeof v === 'object' &&
  v !== null &&
  typeof Reflect.get(v, 'path') === 'string' &&
  typeof Reflect.get(v, 'message') === 'string';

/**
 * The problem+json members we use, or null when the body is not one. Checked by hand rather than
 * with zod: this file is in the first chunk every page loads, sign-in included (issue 11).
 */
function readProblem(body: unknown): Problem | null {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) return null;
  const type: unknown = Reflect.get(body, 'type');
  const title: unknown = Reflect.get(body, 'title');
  const detail: unknown = Reflect.get(body, 'detail');
  const status: unknown = Reflect.get(body, 'status');
  const errors: unknown = Reflect.get(body, 'errors');
  if (!optionalString(type) || !optionalString(title) || !optionalString(detail)) return null;
  if (status !== undefined && typeof status !== 'number') return null;
  if (errors !== undefined && !(Array.isArray(errors) && errors.every(isFieldError))) return null;
  return {
    type,
    title,
    detail,
    errors: errors === undefined ? [] : errors.map((e: FieldError) => ({ path: e.path, message: e.message })),
    extra: Object.fromEntries(Object.entries(body).filter(([k]) => !PROBLEM_MEMBERS.has(k))),
  };
}

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
  const p = readProblem(body);
  if (!p) return new ApiError(base);
  const code = p.type?.split('/').filter(Boolean).pop() ?? base.code;
  return new ApiError({
    ...base,
    code,
    title: p.title ?? base.title,
    detail: p.detail ?? base.detail,
    errors: p.errors,
    extra: p.extra,
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
