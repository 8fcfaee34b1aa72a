/**
 * Reads a page will need, asked for by the entry as soon as it runs (app/route-preload.ts), while the
 * app's code is still downloading: on a phone the session check, the job and its rooms then arrive
 * beside the JavaScript instead of after it (issue 11). apiFetch takes such an answer instead of asking
 * again (`takeEarly`), once, and only while it is fresh: a read a page makes later, or any read after a
 * write from this tab, goes to the server as usual. Plain GETs of our own API with the page's cookie,
 * the same the page would make a moment later; nothing is shown from them until apiFetch has checked
 * the answer as it checks any other (a 401 or a signed-out session is handled exactly the same).
 * No imports: this file is part of the entry.
 */
const FRESH_MS = 10_000;

interface Early {
  readonly at: number;
  readonly response: Promise<Response>;
}

const early = new Map<string, Early>();

/** Starts a GET of `path` (same-origin cookie) unless one is already waiting. */
export function fetchEarly(path: string): void {
  if (early.has(path) || typeof fetch !== 'function') return;
  // The body is read at once, whether or not anyone takes the answer: an unread body keeps the request
  // open in the browser (and the page never goes quiet).
  const response = fetch(path, {
    credentials: 'same-origin',
    headers: { Accept: 'application/json, application/problem+json' },
  }).then(
    async (res) =>
      new Response(await res.blob(), { status: res.status, statusText: res.statusText, headers: res.headers }),
  );
  // A failure is apiFetch's to report when it takes the answer; unclaimed, it is nobody's.
  response.catch(() => undefined);
  early.set(path, { at: Date.now(), response });
}

/** The early answer for a GET of `path`, once; undefined when there is none or it is older than 10 s. */
export function takeEarly(path: string): Promise<Response> | undefined {
  const e = early.get(path);
  if (!e) return undefined;
  early.delete(path);
  return Date.now() - e.at <= FRESH_MS ? e.response : undefined;
}

/** A write from this tab: no answer read before it may stand in for a read after it. */
export function forgetEarly(): void {
  early.clear();
}
