import { onlineManager, type QueryClient, type QueryKey } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';
import { ApiError } from '../api-error';

/** Whether the device has a connection, as TanStack Query sees it (it pauses fetches while offline). */
export function useOnline(): boolean {
  return useSyncExternalStore(
    (l) => onlineManager.subscribe(l),
    () => onlineManager.isOnline(),
    () => true,
  );
}

export const NOTHING_HELD =
  'No signal, and nothing of this page is saved on this phone yet. It opens once the connection is back; changes kept on this phone are safe meanwhile.';

/** The error a page with no signal and nothing held on the device shows (lib/api-error's "network" code). */
export function nothingHeldOffline(): ApiError {
  return new ApiError({ status: 0, code: 'network', title: 'No signal', detail: NOTHING_HELD });
}

/**
 * For loaders: what the cache holds (refreshed behind the page when online), else a fetch; with
 * no signal and nothing held it fails at once with words instead of a fetch that waits forever
 * (TanStack Query pauses fetches while offline, which left the page blank).
 */
export async function ensureHeld<T>(
  queryClient: QueryClient,
  queryKey: QueryKey,
  ensure: () => Promise<T>,
): Promise<T> {
  if (queryClient.getQueryData(queryKey) === undefined && !onlineManager.isOnline()) throw nothingHeldOffline();
  return ensure();
}
