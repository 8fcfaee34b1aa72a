import { useAfterIdle } from '../../../lib/use-after-idle';
import type { RoomView } from '../sync/overlay';

/** Tabs drawn before the page's first idle moment: more than a phone's row shows, through the one chosen. */
const FIRST_TABS = 12;

/**
 * One button per room; the chosen one is open below. A big job's row of tabs scrolls sideways and a
 * phone shows three or four of them, so the first render draws the first dozen (and on to the chosen
 * one) and the rest come at the page's first idle moment: on the 100-room bench job the tabs were half
 * of what the first render drew before the room name showed (issue 11).
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
  const all = useAfterIdle();
  const upTo = all ? rooms.length : Math.max(FIRST_TABS, rooms.findIndex((r) => r.id === selectedId) + 1);
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
