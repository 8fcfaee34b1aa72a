import { useState, useSyncExternalStore } from 'react';
import { Button } from '../../components/ui/button';
import { useApiVersionMismatch } from '../api-version';

/**
 * The installed app's updates. The service worker (made at build time, vite.config.ts) keeps the
 * shell and assets for opening with no signal; a new build waits until the person chooses to
 * reload — never forced in the middle of an edit. Waiting changes are in IndexedDB either way.
 */
let waiting = false;
let update: ((reload?: boolean) => Promise<void>) | null = null;
const listeners = new Set<() => void>();

/** Called by register-worker.ts when a new build's worker is installed and waiting. */
export function offerUpdate(apply: (reload?: boolean) => Promise<void>): void {
  update = apply;
  waiting = true;
  for (const l of listeners) l();
}

function useUpdateWaiting(): boolean {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => waiting,
    () => waiting,
  );
}

function reload(): void {
  if (waiting && update) void update(true);
  else window.location.reload();
}

/** "A new version is ready" (the person picks the moment), or, when the server's API moved on, a reload asked for. */
export function AppUpdateBanner() {
  const ready = useUpdateWaiting();
  const mismatch = useApiVersionMismatch();
  const [later, setLater] = useState(false);
  if (!mismatch && (!ready || later)) return null;
  return (
    <div
      role={mismatch ? 'alert' : 'status'}
      className="flex flex-wrap items-center justify-center gap-3 border-b border-amber-line bg-amber-soft px-4 py-2 text-ink-950"
    >
      <p className="font-semibold">
        {mismatch
          ? 'Gaugeline was updated on the server. Reload to carry on — changes waiting on this device are kept and sent after the reload.'
          : 'A new version of Gaugeline is ready.'}
      </p>
      <div className="flex gap-2">
        <Button onClick={reload}>Reload now</Button>
        {mismatch ? null : (
          <Button variant="ghost" onClick={() => setLater(true)}>
            Later
          </Button>
        )}
      </div>
    </div>
  );
}
