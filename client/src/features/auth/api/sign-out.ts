import { useMutation, useQueryClient } from '@tanstack/react-query';
import { paths } from '../../../config/paths';
import { apiFetch, clearCsrfToken } from '../../../lib/api-client';
import { forgetPersonCache } from '../../../lib/offline/persist-cache';

export async function signOut(): Promise<void> {
  try {
    await apiFetch('/api/auth/logout', { method: 'POST' });
  } finally {
    clearCsrfToken();
    // The saved query cache is this person's: it goes now (their waiting changes stay, for them alone).
    await forgetPersonCache().catch(() => undefined);
  }
}

/**
 * Signs out, then loads the sign-in page afresh: a full page load is the surest way that
 * nothing of the previous user (cache, form state, menus) stays in memory on a shared device.
 */
export function useSignOut(leave: () => void = () => window.location.assign(paths.signIn)) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      void queryClient.cancelQueries();
      leave();
    },
  });
}
