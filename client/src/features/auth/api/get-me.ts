import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { isApiError } from '../../../lib/api-error';
import { meResponse, type MeResponse } from '@contract';
import { authKeys } from '../query-keys';

/** The signed-in user and company, or null when nobody is signed in (401). */
export async function getMe(signal?: AbortSignal): Promise<MeResponse | null> {
  try {
    return await apiFetch('/api/auth/me', { schema: meResponse, signal });
  } catch (e) {
    if (isApiError(e) && e.status === 401) return null;
    throw e;
  }
}

export const meQueryOptions = () =>
  queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 5 * 60_000 });

export function useMe() {
  return useSuspenseQuery(meQueryOptions()).data;
}

/** For pages inside the signed-in shell, where the guard has already made sure of a session. */
export function useSignedIn(): MeResponse {
  const me = useMe();
  if (!me) throw new Error('This page needs a signed-in user.');
  return me;
}
