import type { Room, Tightness } from '@calc';
import { memo, useState } from 'react';
import { engineWaitMessage, useLoadEngine } from './live-engine';
import type { LiveHomeInputs } from '../model/live-room';
import { groupedNumber } from '../../../lib/grouped-number';

const n = groupedNumber;

interface Props {
  room: Room | null;
  designConditions: Record<string, unknown> | null;
  tightness: Tightness;
  /** The other rooms and the house facts (see RoomLoadPanel). */
  home: LiveHomeInputs;
}

/**
 * A phone's view of the room's live loads: one line pinned to the bottom of the screen while the
 * form scrolls (sensible, latent, heat loss), which opens to the figures. Hidden on a wide screen,
 * where the full panel stays beside the form.
 * Memoised: the room editor hands it the room a beat behind the form (useDeferredValue), so a
 * keystroke's own render skips it (issue 11).
 */
export const RoomLoadBar = memo(function RoomLoadBar({ room, designConditions, tightness, home }: Props) {
  const [open, setOpen] = useState(false);
  const engine = useLoadEngine({ ...home, designConditions, tightness });
  const parts = engine.status === 'ready' ? engine.engine : null;
  const result = room && parts ? parts.computeLiveRoomLoad(room, home, designConditions, tightness) : null;
  const line = !room
    ? 'Loads wait for the fields marked in red'
    : engine.status !== 'ready'
      ? engineWaitMessage(engine)
      : result && !result.ok
        ? result.message
        : result?.ok
          ? `Sensible ${n(result.value.sensibleGain.total)} · Latent ${n(result.value.latentGain.total)} · Heat loss ${n(result.value.heatLoss.total)} Btu/h`
          : '';
  return (
    <aside
      aria-label="This room’s loads, pinned"
      className="fixed inset-x-0 bottom-0 z-20 border-t border-ink-200 bg-white/95 shadow-[0_-2px_8px_rgba(0,0,0,0.08)] backdrop-blur lg:hidden"
    >
      {open && result?.ok && parts ? (
        <div id="room-load-bar-figures" className="max-h-[55vh] overflow-y-auto px-4 pt-3">
          <parts.LoadFigures load={result.value} />
        </div>
      ) : null}
      <button
        type="button"
        aria-expanded={open}
        aria-controls={open ? 'room-load-bar-figures' : undefined}
        disabled={!result?.ok}
        onClick={() => setOpen((o) => !o)}
        className="flex min-h-touch w-full items-center justify-between gap-2 px-4 py-2 text-left text-sm font-semibold text-ink-900 disabled:cursor-default"
      >
        <span data-testid="room-load-bar">{line}</span>
        {result?.ok && parts ? (
          <span aria-hidden="true" className="shrink-0 text-muted">
            {open ? '▾' : '▴'}
          </span>
        ) : null}
      </button>
    </aside>
  );
});
