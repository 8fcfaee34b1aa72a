import { useSyncExternalStore } from 'react';

/** Below Tailwind's `sm` (640 px): a phone held upright, where long screens fold to one line per part. */
const PHONE_QUERY = '(max-width: 639.98px)';

const media = () => (typeof window === 'undefined' || !window.matchMedia ? null : window.matchMedia(PHONE_QUERY));

function subscribe(onChange: () => void): () => void {
  const m = media();
  m?.addEventListener('change', onChange);
  return () => m?.removeEventListener('change', onChange);
}

/**
 * True on a phone-width screen, read synchronously on the first render (no wide layout drawn first and then
 * swapped), and kept current when the window is resized or the phone turned.
 */
export function usePhone(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => media()?.matches ?? false,
    () => false,
  );
}
