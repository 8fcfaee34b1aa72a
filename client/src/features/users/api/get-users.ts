import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { userKeys } from '../query-keys';
import { usersResponse } from '@contract';

export async function getUsers(signal?: AbortSignal) {
  return (await apiFetch('/api/users', { schema: usersResponse, signal })).users;
}

export const usersQueryOptions = () =>
  queryOptions({ queryKey: userKeys.list(), queryFn: ({ signal }) => getUsers(signal) });

export function useUsers() {
  return useSuspenseQuery(usersQueryOptions()).data;
}
