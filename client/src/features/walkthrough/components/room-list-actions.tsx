import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { copyRoomInput, newRoomId, ROOM_TEMPLATES } from '../model/room-templates';
import { roomTarget } from '../sync/edits';
import type { RoomView } from '../sync/overlay';
import { useWalkthroughQueue } from '../sync/queue-context';
import { SelectOptions } from '../../../components/ui/field-shell';

const templateOptions = ROOM_TEMPLATES.map((t) => ({ value: t.key, label: t.label }));

/** "Add room" from a template and "Copy this room" (the one open): a typical room in a tap or two. */
export function RoomListActions({
  jobId,
  rooms,
  current,
  onCreated,
}: {
  jobId: string;
  rooms: readonly RoomView[];
  current: RoomView | null;
  onCreated: (id: string) => void;
}) {
  const queue = useWalkthroughQueue();
  const [template, setTemplate] = useState('bedroom');
  const nextPosition = rooms.reduce((m, r) => Math.max(m, r.position + 1), 0);

  const create = (input: Record<string, unknown>, id: string) => {
    void queue.enqueue({
      target: roomTarget(id),
      baseVersion: null,
      payload: { kind: 'room-create', jobId, roomId: id, position: nextPosition, input },
    });
    onCreated(id);
  };
  const handleAdd = () => {
    const t = ROOM_TEMPLATES.find((x) => x.key === template) ?? ROOM_TEMPLATES[0];
    if (!t) return;
    const id = newRoomId();
    const sameKind = rooms.filter(
      (r) => typeof r.input.name === 'string' && r.input.name.startsWith(String(t.input.name)),
    ).length;
    create(
      {
        ...structuredClone(t.input),
        id,
        name: sameKind > 0 ? `${String(t.input.name)} ${sameKind + 1}` : t.input.name,
      },
      id,
    );
  };
  const handleCopy = () => {
    if (!current) return;
    const id = newRoomId();
    create(copyRoomInput(current.input, id), id);
  };

  return (
    <div className="flex items-center gap-2">
      <label className="sr-only" htmlFor="room-template">
        Room template
      </label>
      <select
        id="room-template"
        className="min-h-touch min-w-0 flex-1 rounded-md border border-line bg-white px-2 text-base text-ink-950 sm:max-w-56"
        value={template}
        onChange={(e) => setTemplate(e.target.value)}
      >
        <SelectOptions options={templateOptions} />
      </select>
      <Button onClick={handleAdd}>Add room</Button>
      <Button variant="secondary" disabled={!current} onClick={handleCopy}>
        Copy room
      </Button>
    </div>
  );
}
