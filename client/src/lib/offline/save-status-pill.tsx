import type { QueueState } from './queue';

export type SaveStatus =
  | { readonly kind: 'saved' }
  | { readonly kind: 'saving' }
  | { readonly kind: 'offline'; readonly waiting: number }
  | { readonly kind: 'blocked'; readonly waiting: number }
  | { readonly kind: 'conflict' };

/**
 * Pure: what the pill says, from the queue, the edits still inside the debounce and the photos
 * kept on the device (to the person a waiting photo is a change not yet saved like any other).
 */
export function saveStatus(
  state: Pick<QueueState<unknown>, 'items' | 'online' | 'sending' | 'conflict'> & { blocked?: string | null },
  typing: number,
  photos = 0,
): SaveStatus {
  if (state.conflict) return { kind: 'conflict' };
  const waiting = state.items.length + photos;
  if (state.blocked && waiting > 0) return { kind: 'blocked', waiting };
  if (!state.online && waiting > 0) return { kind: 'offline', waiting };
  if (waiting > 0 || state.sending || typing > 0) return { kind: 'saving' };
  return { kind: 'saved' };
}

const looks: Record<SaveStatus['kind'], string> = {
  saved: 'border-ok bg-ok-soft text-ok',
  saving: 'border-ink-200 bg-ink-50 text-ink-800',
  offline: 'border-amber-line bg-amber-soft text-amber-deep',
  blocked: 'border-danger bg-danger-soft text-danger',
  conflict: 'border-danger bg-danger-soft text-danger',
};

function text(s: SaveStatus): string {
  if (s.kind === 'saved') return 'Saved';
  if (s.kind === 'saving') return 'Saving…';
  if (s.kind === 'conflict') return 'Needs your choice — changed by someone else';
  if (s.kind === 'blocked')
    return `Not saved — sign in again; ${s.waiting} ${s.waiting === 1 ? 'change' : 'changes'} kept`;
  return `Offline — ${s.waiting} ${s.waiting === 1 ? 'change' : 'changes'} waiting`;
}

/** Always on screen during a walk-through; role="status" so screen readers hear it change. */
export function SaveStatusPill({ status }: { status: SaveStatus }) {
  return (
    <p
      role="status"
      aria-live="polite"
      className={`inline-flex min-h-9 items-center gap-2 whitespace-nowrap rounded-full border px-3 text-sm font-semibold ${looks[status.kind]}`}
    >
      <span aria-hidden="true" className="size-2 rounded-full bg-current" />
      {text(status)}
    </p>
  );
}
