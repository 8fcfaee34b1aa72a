import { queryOptions, useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { outboxKeys } from '../query-keys';
import { outboxResponse } from '@contract';

export async function getOutbox(signal?: AbortSignal) {
  return (await apiFetch('/api/dev/outbox', { schema: outboxResponse, signal })).messages;
}

export const outboxQueryOptions = () =>
  queryOptions({ queryKey: outboxKeys.list(), queryFn: ({ signal }) => getOutbox(signal), staleTime: 5_000 });

export function useOutbox() {
  return useSuspenseQuery(outboxQueryOptions());
}

/** The outbox exists only on development servers (404 elsewhere); the menu asks before offering it. */
export function useOutboxAvailable(enabled: boolean): boolean {
  const q = useQuery({ ...outboxQueryOptions(), enabled, staleTime: 5 * 60_000 });
  return enabled && q.isSuccess;
}
