import type { QueryClient } from '@tanstack/react-query';
import { redirect } from 'react-router-dom';
import { rolesFor } from '../config/nav';
import { paths, signInPath } from '../config/paths';
import { meQueryOptions } from '../features/auth/api/get-me';
import { setCurrentPerson } from '../lib/offline/person';
import type { MeResponse } from '@contract';

export const NOTICE_NOT_ALLOWED = 'not-allowed';

/** Loaders run in parallel, so every guarded loader checks the session itself (the query is shared). */
export async function requireUser(queryClient: QueryClient, request: Request): Promise<MeResponse> {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (!me) {
    const url = new URL(request.url);
    throw redirect(signInPath(url.pathname + url.search));
  }
  // From here on the device keeps and sends only this person's waiting changes.
  setCurrentPerson({ companyId: me.company.id, userId: me.user.id });
  return me;
}

/** Areas from config/nav.ts: a role without access goes back home with a notice. */
export async function requireArea(queryClient: QueryClient, request: Request, navId: string): Promise<MeResponse> {
  const me = await requireUser(queryClient, request);
  if (!rolesFor(navId).includes(me.user.role)) throw redirect(`${paths.home}?notice=${NOTICE_NOT_ALLOWED}`);
  return me;
}
