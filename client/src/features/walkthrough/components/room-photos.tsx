import { useId, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { errorMessage } from '../../../lib/api-error';
import { useUploadPhoto } from '../api/upload-photo';
import type { RoomView } from '../sync/overlay';
import { useQueueState } from '../sync/queue-context';

/**
 * Photos of one room. On a phone the picker opens the rear camera. Thumbnails come from the
 * authorised photo route (the session cookie goes with the image request).
 */
export function RoomPhotos({ jobId, room }: { jobId: string; room: RoomView }) {
  const id = useId();
  const upload = useUploadPhoto(jobId);
  const { online } = useQueueState();
  const [done, setDone] = useState<string | null>(null);
  const saved = room.version !== null;
  const canUpload = saved && online && !upload.isPending;

  const handleFile = async (file: File | undefined) => {
    if (!file) return;
    setDone(null);
    await upload.mutateAsync({ jobId, roomId: room.id, file });
    setDone(file.name);
  };

  return (
    <div className="flex flex-col gap-3">
      <h3 className="text-lg font-semibold text-ink-900">Photos</h3>
      {room.photos.length > 0 ? (
        <ul className="flex flex-wrap gap-2" aria-label="Room photos">
          {room.photos.map((p, i) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer">
                <img src={p.url} alt={`Photo ${i + 1} of ${room.photos.length}`} loading="lazy" className="size-24 rounded-md border border-line object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-muted">No photos yet.</p>
      )}
      <div>
        <label
          htmlFor={id}
          className={`inline-flex min-h-touch cursor-pointer items-center rounded-md border border-line bg-white px-4 font-semibold text-ink-900 ${canUpload ? 'hover:bg-ink-50' : 'cursor-not-allowed opacity-60'}`}
        >
          {upload.isPending ? 'Uploading…' : 'Take or add a photo'}
        </label>
        <input
          id={id}
          type="file"
          accept="image/*"
          capture="environment"
          className="sr-only"
          disabled={!canUpload}
          onChange={(e) => {
            void handleFile(e.target.files?.[0]).catch(() => undefined);
            e.target.value = '';
          }}
        />
      </div>
      {!saved ? <p className="text-sm text-muted">Photos can be added once this room has reached the server.</p> : null}
      {saved && !online ? <p className="text-sm text-muted">Photos upload when the connection is back; the room itself is kept meanwhile.</p> : null}
      {upload.isError ? <Alert tone="danger" title="The photo was not added.">{errorMessage(upload.error)}</Alert> : null}
      {done && !upload.isError ? <p role="status" className="text-sm text-ok">Added {done}.</p> : null}
    </div>
  );
}
