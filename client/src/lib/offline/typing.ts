import { useSyncExternalStore } from 'react';

/**
 * Edits typed but still inside the autosave debounce: not yet in the queue, but the status
 * pill must already say "Saving…".
 */
const pending = new Set<string>();
const listeners = new Set<() => void>();
let count = 0;

function emit(): void {
  count = pending.size;
  for (const l of listeners) l();
}

export function markTyping(key: string, on: boolean): void {
  const had = pending.has(key);
  if (on && !had) pending.add(key);
  else if (!on && had) pending.delete(key);
  else return;
  emit();
}

export function useTypingCount(): number {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => count,
    () => count,
  );
}
