import type { QueueState } from './queue';

export type SaveStatus =
  | { readonly kind: 'saved' }
  | { readonly kind: 'saving' }
  | { readonly kind: 'offline'; readonly waiting: number }
  | { readonly kind: 'blocked'; readonly waiting: number }
  | { readonly kind: 'conflict' }
  /** Fields showing an error: their values are not sent (the rest of the record may be). */
  | { readonly kind: 'invalid'; readonly fields: number; readonly waiting: number; readonly online: boolean };

/**
 * Pure: what the pill says, from the queue, the edits still inside the debounce, the photos
 * kept on the device (to the person a waiting photo is a change not yet saved like any other)
 * and the fields refused on screen (never "Saved" while one is).
 */
export function saveStatus(
  state: Pick<QueueState<unknown>, 'items' | 'online' | 'sending' | 'conflict'> & { blocked?: string | null },
  typing: number,
  photos = 0,
  invalidFields = 0,
): SaveStatus {
  if (state.conflict) return { kind: 'conflict' };
  const waiting = state.items.length + photos;
  if (state.blocked && waiting > 0) return { kind: 'blocked', waiting };
  if (invalidFields > 0) return { kind: 'invalid', fields: invalidFields, waiting, online: state.online };
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
  invalid: 'border-danger bg-danger-soft text-danger',
};

const changes = (n: number) => `${n} ${n === 1 ? 'change' : 'changes'}`;

function text(s: SaveStatus): string {
  if (s.kind === 'saved') return 'Saved';
  if (s.kind === 'saving') return 'Saving…';
  if (s.kind === 'conflict') return 'Needs your choice — changed elsewhere meanwhile';
  if (s.kind === 'blocked') return `Not saved — sign in again; ${changes(s.waiting)} kept`;
  if (s.kind === 'invalid') {
    const fix = `Not saved — ${s.fields} ${s.fields === 1 ? 'field' : 'fields'} to fix`;
    return !s.online && s.waiting > 0 ? `${fix}; offline, ${changes(s.waiting)} waiting` : fix;
  }
  return `Offline — ${changes(s.waiting)} waiting`;
}

/** Moves to the first field showing an error, so "Not saved — 1 field to fix" is one tap from the fix. */
export function focusFirstInvalidField(): void {
  const field = document.querySelector<HTMLElement>('main [aria-invalid="true"], [aria-invalid="true"]');
  if (!field) return;
  // A folded section (a wall, the design conditions) opens to show the field.
  for (let d = field.closest('details'); d; d = d.parentElement?.closest('details') ?? null) d.open = true;
  field.scrollIntoView?.({ block: 'center' });
  field.focus({ preventScroll: true });
}

/** Always on screen during a walk-through; role="status" so screen readers hear it change. */
export function SaveStatusPill({ status, onFix = focusFirstInvalidField }: { status: SaveStatus; onFix?: () => void }) {
  const look = `inline-flex min-h-9 items-center gap-2 whitespace-nowrap rounded-full border px-3 text-sm font-semibold ${looks[status.kind]}`;
  const dot = <span aria-hidden="true" className="size-2 rounded-full bg-current" />;
  if (status.kind === 'invalid')
    return (
      <p role="status" aria-live="polite" className="m-0">
        <button
          type="button"
          className={`${look} min-h-touch cursor-pointer underline-offset-2 hover:underline`}
          onClick={onFix}
        >
          {dot}
          {text(status)}
        </button>
      </p>
    );
  return (
    <p role="status" aria-live="polite" className={look}>
      {dot}
      {text(status)}
    </p>
  );
}
