import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { mailKeys } from '../query-keys';
import { mailMessagesResponse } from '@contract';

export async function getMessages(signal?: AbortSignal) {
  return (await apiFetch('/api/mail', { schema: mailMessagesResponse, signal })).messages;
}

export const messagesQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.list(), queryFn: ({ signal }) => getMessages(signal) });

/** Refreshed every 15 s while open: a retry happening in the background shows without a reload. */
export function useMessages() {
  return useSuspenseQuery({ ...messagesQueryOptions(), refetchInterval: 15_000 });
}
