import { useId } from 'react';
import type { RoomView } from '../sync/overlay';
import { usePhotoQueue, usePhotoQueueState } from '../sync/photo-queue-context';
import { useQueueState } from '../sync/queue-context';
import { PhotoRefusals } from './photo-refusals';
import { WaitingFile } from './waiting-photo';

/**
 * Photos of one room. On a phone the picker opens the rear camera. A new photo is kept on the
 * device first and uploads once the room is on the server and the connection is up, so taking
 * one never depends on signal. Server thumbnails come from the authorised photo route.
 */
export function RoomPhotos({ jobId, room }: { jobId: string; room: RoomView }) {
  const id = useId();
  const photos = usePhotoQueue();
  const { waiting, uploading, notices } = usePhotoQueueState();
  const { online } = useQueueState();
  const mine = waiting.filter((p) => p.roomId === room.id);
  const added = notices.find((n) => n.roomId === room.id && n.kind === 'added');
  const busy = mine.some((p) => p.id === uploading);

  const handleFile = (file: File | undefined) => {
    if (!file) return;
    void photos.add({ jobId, roomId: room.id, fileName: file.name, blob: file });
  };

  return (
    <div className="flex flex-col gap-3">
      <h3 className="text-lg font-semibold text-ink-900">Photos</h3>
      {room.photos.length + mine.length > 0 ? (
        <ul className="flex flex-wrap gap-2" aria-label="Room photos">
          {room.photos.map((p, i) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer">
                <img
                  src={p.url}
                  alt={`Photo ${i + 1} of ${room.photos.length}`}
                  loading="lazy"
                  className="size-24 rounded-md border border-line object-cover"
                />
              </a>
            </li>
          ))}
          {mine.map((p) => (
            <li key={p.id}>
              <WaitingFile photo={p} />
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-muted">No photos yet.</p>
      )}
      <div>
        <label
          htmlFor={id}
          className="inline-flex min-h-touch cursor-pointer items-center rounded-md border border-line bg-white px-4 font-semibold text-ink-900 hover:bg-ink-50"
        >
          Take or add a photo
        </label>
        <input
          id={id}
          type="file"
          accept="image/*"
          capture="environment"
          className="sr-only"
          onChange={(e) => {
            handleFile(e.target.files?.[0]);
            e.target.value = '';
          }}
        />
      </div>
      {busy ? <p className="text-sm text-muted">Uploading…</p> : null}
      {mine.length > 0 && room.version === null ? (
        <p className="text-sm text-muted">Photos wait on this device until the room has reached the server.</p>
      ) : null}
      {mine.length > 0 && room.version !== null && !online ? (
        <p className="text-sm text-muted">
          Photos upload when the connection is back; they are kept on this device meanwhile.
        </p>
      ) : null}
      <PhotoRefusals show={(n) => n.jobId === jobId && n.roomId === room.id} />
      {added && mine.length === 0 ? (
        <p role="status" className="text-sm text-ok">
          {added.message}
        </p>
      ) : null}
    </div>
  );
}
