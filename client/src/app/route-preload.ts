import { COMPANY_SETTINGS_PATH, jobPath, jobRoutePatterns, roomsPath } from '../entities/job/paths';
import { fetchEarly } from '../lib/early-fetch';

/**
 * The modules the first screen of a page needs, asked for as soon as the entry runs, before React
 * and the router have even arrived: the router would otherwise find them only after it has loaded
 * (the app's chunk, then the route's, then what the page loads lazily — three round trips one after
 * another on a phone). The same import() the router makes later gets the module already there.
 *
 * Only the pages a phone opens in the field with the heaviest first screen are listed (a job's
 * walk-through and its loads); any other page loads as before — a page missing here is only slower.
 * Each import listed here adds its file names to the entry, which the sign-in page downloads too.
 */
const appRoot = () => import('./routes/app-root');
const jobLoaders = () => import('./job-route-loaders');

/** Turns '/jobs/:jobId' into a pattern for a path with no query, one segment per parameter. */
const patternOf = (route: string) => new RegExp(`^${route.replace(/:[^/]+/g, '[^/]+')}/?$`);

const table: ReadonlyArray<readonly [RegExp, () => ReadonlyArray<Promise<unknown>>]> = [
  [
    patternOf(jobRoutePatterns.walkthrough),
    () => [
      appRoot(),
      jobLoaders(),
      // The job details, folded below, stay lazy: they would compete with the room form for the signal.
      import('./routes/job-walkthrough'),
    ],
  ],
  [patternOf(jobRoutePatterns.loads), () => [appRoot(), jobLoaders(), import('./routes/job-loads')]],
];

/** The job's id in a walk-through or loads address, as the router will read it; null elsewhere. */
function jobIdIn(pathname: string): string | null {
  const m = /^\/jobs\/([^/]+)(?:\/loads)?\/?$/.exec(pathname);
  if (!m?.[1] || m[1] === 'new') return null;
  try {
    return decodeURIComponent(m[1]);
  } catch {
    return null;
  }
}

export function preloadRoute(pathname: string): void {
  const match = table.find(([pattern]) => pattern.test(pathname));
  // A failed download here is not an error: the router asks again and shows its own error if it must.
  for (const p of match?.[1]() ?? []) p.catch(() => undefined);
  // The same pages' first reads (the signed-in guard's session check, the job loader's job, rooms and
  // company settings) leave now too, beside the code, instead of after it (lib/early-fetch.ts).
  const jobId = match ? jobIdIn(pathname) : null;
  if (jobId) {
    fetchEarly('/api/auth/session');
    fetchEarly(jobPath(jobId));
    fetchEarly(roomsPath(jobId));
    fetchEarly(COMPANY_SETTINGS_PATH);
  }
}
