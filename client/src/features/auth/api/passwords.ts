import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch } from '../../../lib/api-client';
import { messageResponse } from '../schemas';

const changedResponse = z.object({ endedSessions: z.number().int() });

export function useChangePassword() {
  return useMutation({
    mutationFn: (input: { currentPassword: string; newPassword: string }) =>
      apiFetch('/api/auth/password', { method: 'POST', body: input, schema: changedResponse }),
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: { email: string }) =>
      apiFetch('/api/auth/password-reset', { method: 'POST', body: input, schema: messageResponse }),
  });
}

export function useCompletePasswordReset() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) =>
      apiFetch('/api/auth/password-reset/complete', { method: 'POST', body: input, schema: messageResponse }),
  });
}
