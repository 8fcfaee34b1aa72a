import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { copyRoomInput, newRoomId, ROOM_TEMPLATES } from '../model/room-templates';
import { roomTarget } from '../sync/edits';
import type { RoomView } from '../sync/overlay';
import { useWalkthroughQueue } from '../sync/queue-context';
import { SelectInput } from './field-kit';

const templateOptions = ROOM_TEMPLATES.map((t) => ({ value: t.key, label: t.label }));

/** "Add room" from a template and "Copy previous room": a typical room in a tap or two. */
export function RoomListActions({
  jobId,
  rooms,
  onCreated,
}: {
  jobId: string;
  rooms: readonly RoomView[];
  onCreated: (id: string) => void;
}) {
  const queue = useWalkthroughQueue();
  const [template, setTemplate] = useState('bedroom');
  const nextPosition = rooms.reduce((m, r) => Math.max(m, r.position + 1), 0);
  const previous = rooms[rooms.length - 1];

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
    if (!previous) return;
    const id = newRoomId();
    create(copyRoomInput(previous.input, id), id);
  };

  return (
    <div className="flex flex-wrap items-end gap-2">
      <div className="min-w-44">
        <SelectInput label="Room template" value={template} options={templateOptions} onChange={setTemplate} />
      </div>
      <Button onClick={handleAdd}>Add room</Button>
      <Button variant="secondary" disabled={!previous} onClick={handleCopy}>
        Copy previous room
      </Button>
    </div>
  );
}
