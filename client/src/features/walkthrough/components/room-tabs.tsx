import { startTransition, useEffect, useState } from 'react';
import { useAfterIdle } from '../../../lib/use-after-idle';
import type { RoomView } from '../sync/overlay';

/** Tabs drawn before the page's first idle moment: more than a phone's row shows, through the one chosen. */
const FIRST_TABS = 12;
/** Tabs added at each idle moment after that, until every room has one. */
const MORE_TABS = 24;

/** Runs `work` at the browser's next idle moment (or soon, where it has no idle callbacks); returns a cancel. */
function whenIdle(work: () => void): () => void {
  if (typeof window !== 'undefined' && 'requestIdleCallback' in window) {
    const id = window.requestIdleCallback(work, { timeout: 1000 });
    return () => window.cancelIdleCallback(id);
  }
  const id = setTimeout(work, 20);
  return () => clearTimeout(id);
}

/**
 * One button per room; the chosen one is open below. A big job's row of tabs scrolls sideways and a
 * phone shows three or four of them, so the first render draws the first dozen (and on to the chosen
 * one) and the rest come after the page's first idle moment, two dozen at each idle moment: on the
 * 100-room bench job the tabs were half of what the first render drew before the room name showed, and
 * all of them at once were one long layout just as the room name took its first letter (issue 11).
 */
export function RoomTabs({
  rooms,
  selectedId,
  onSelect,
}: {
  rooms: readonly RoomView[];
  selectedId: string | null;
  onSelect: (id: string) => void;
}) {
  const idle = useAfterIdle();
  const [drawn, setDrawn] = useState(FIRST_TABS);
  const upTo = Math.max(drawn, rooms.findIndex((r) => r.id === selectedId) + 1);
  useEffect(() => {
    if (!idle || upTo >= rooms.length) return;
    return whenIdle(() => startTransition(() => setDrawn(upTo + MORE_TABS)));
  }, [idle, upTo, rooms.length]);
  return (
    <ul aria-label="Rooms" className="flex gap-2 overflow-x-auto pb-1">
      {rooms.slice(0, upTo).map((r, i) => (
        <li key={r.id}>
          <button
            type="button"
            aria-pressed={r.id === selectedId}
            onClick={() => onSelect(r.id)}
            className="min-h-touch whitespace-nowrap rounded-full border border-line bg-white px-4 font-semibold text-ink-900 aria-pressed:border-ink-800 aria-pressed:bg-ink-800 aria-pressed:text-white"
          >
            {typeof r.input.name === 'string' && r.input.name ? r.input.name : `Room ${i + 1}`}
            {r.waiting ? <span className="sr-only"> (not yet saved)</span> : null}
          </button>
        </li>
      ))}
    </ul>
  );
}
