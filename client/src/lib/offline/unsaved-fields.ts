import { useSyncExternalStore } from 'react';

/**
 * Fields that show an error and so are not saved, per editor ("room:<id>", "job:<id>"). The status
 * pill reads the total: while any field is refused it cannot say "Saved", whatever else was sent.
 */
const counts = new Map<string, number>();
const listeners = new Set<() => void>();
let total = 0;

export function markUnsavedFields(key: string, count: number): void {
  const had = counts.get(key) ?? 0;
  if (had === count) return;
  if (count > 0) counts.set(key, count);
  else counts.delete(key);
  total = [...counts.values()].reduce((a, b) => a + b, 0);
  for (const l of listeners) l();
}

export function useUnsavedFieldCount(): number {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => total,
    () => total,
  );
}
