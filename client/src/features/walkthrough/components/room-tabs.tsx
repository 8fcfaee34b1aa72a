import type { RoomView } from '../sync/overlay';

/** One button per room; the chosen one is open below. */
export function RoomTabs({
  rooms,
  selectedId,
  onSelect,
}: {
  rooms: readonly RoomView[];
  selectedId: string | null;
  onSelect: (id: string) => void;
}) {
  return (
    <ul aria-label="Rooms" className="flex gap-2 overflow-x-auto pb-1">
      {rooms.map((r, i) => (
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
