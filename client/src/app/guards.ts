import type { QueryClient } from '@tanstack/react-query';
import { redirect } from 'react-router-dom';
import { rolesFor } from '../config/nav';
import { paths, signInPath } from '../config/paths';
import { meQueryOptions } from '../features/auth/api/get-me';
import { isApiError } from '../lib/api-error';
import { setCurrentPerson } from '../lib/offline/person';
import { isOffline, keepPersonCacheOnce } from '../lib/offline/persist-cache';
import type { MeResponse } from '@contract';

export const NOTICE_NOT_ALLOWED = 'not-allowed';

/** Loaders run in parallel, so every guarded loader checks the session itself (the query is shared). */
let confirmed = false;

/**
 * Who is signed in. A `me` restored from the saved cache (lib/offline/persist-cache.ts) is checked
 * with the server once per page load; with no signal it stands, so the app opens offline.
 */
async function currentMe(queryClient: QueryClient): Promise<MeResponse | null> {
  const options = meQueryOptions();
  const cached = queryClient.getQueryData(options.queryKey);
  if (confirmed || cached === undefined) {
    const me = await queryClient.ensureQueryData(options);
    confirmed = true;
    return me;
  }
  if (isOffline()) return cached;
  try {
    const me = await queryClient.fetchQuery({ ...options, staleTime: 0, retry: false });
    confirmed = true;
    return me;
  } catch (e) {
    if (isApiError(e) && e.code === 'network') return cached;
    throw e;
  }
}

export async function requireUser(queryClient: QueryClient, request: Request): Promise<MeResponse> {
  const me = await currentMe(queryClient);
  if (!me) {
    const url = new URL(request.url);
    throw redirect(signInPath(url.pathname + url.search));
  }
  // From here on the device keeps and sends only this person's waiting changes.
  setCurrentPerson({ companyId: me.company.id, userId: me.user.id });
  keepPersonCacheOnce(queryClient);
  return me;
}

/** Areas from config/nav.ts: a role without access goes back home with a notice. */
export async function requireArea(queryClient: QueryClient, request: Request, navId: string): Promise<MeResponse> {
  const me = await requireUser(queryClient, request);
  if (!rolesFor(navId).includes(me.user.role)) throw redirect(`${paths.home}?notice=${NOTICE_NOT_ALLOWED}`);
  return me;
}
