import { useMutation } from '@tanstack/react-query';
import { accountMessageResponse, passwordChangedResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';

export function useChangePassword() {
  return useMutation({
    mutationFn: (input: { currentPassword: string; newPassword: string }) =>
      apiFetch('/api/auth/password', { method: 'POST', body: input, schema: passwordChangedResponse }),
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: { email: string }) =>
      apiFetch('/api/auth/password-reset', { method: 'POST', body: input, schema: accountMessageResponse }),
  });
}

export function useCompletePasswordReset() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) =>
      apiFetch('/api/auth/password-reset/complete', { method: 'POST', body: input, schema: accountMessageResponse }),
  });
}
