import { API_VERSION } from '@contract';
import { useSyncExternalStore } from 'react';

/**
 * The API version this build was made for (the contract's), against the one the server last
 * named. A difference means this page is older (or newer) than the server: the app says so and
 * offers a reload instead of mixing old code with a changed API (see contract/api-version.ts).
 */
let serverVersion: string | null = null;
const listeners = new Set<() => void>();

export const CLIENT_API_VERSION = String(API_VERSION);

export function noteServerApiVersion(sent: string | null): void {
  if (sent === null || sent === serverVersion) return;
  serverVersion = sent;
  for (const l of listeners) l();
}

export function apiVersionMismatch(): boolean {
  return serverVersion !== null && serverVersion !== CLIENT_API_VERSION;
}

export function useApiVersionMismatch(): boolean {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    apiVersionMismatch,
    apiVersionMismatch,
  );
}
