import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { sessionResponse, type MeResponse } from '@contract';
import { authKeys } from '../query-keys';

/**
 * The signed-in user and company, or null when nobody is signed in. Asks /api/auth/session, where
 * signed out is a 200 answer: a sign-in page load logs no failed request in the console.
 */
export async function getMe(signal?: AbortSignal): Promise<MeResponse | null> {
  return (await apiFetch('/api/auth/session', { schema: sessionResponse, signal })).me;
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
