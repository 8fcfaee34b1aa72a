import { useEffect, useState } from 'react';
import type { WaitingFile as Waiting } from '../../../lib/offline/file-storage';

/** A local URL for the stored bytes, released when the thumbnail goes (object URLs hold the Blob in memory). */
function useObjectUrl(blob: Blob): string | null {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    const next = URL.createObjectURL(blob);
    setUrl(next);
    return () => URL.revokeObjectURL(next);
  }, [blob]);
  return url;
}

export function WaitingFile({ photo }: { photo: Waiting }) {
  const url = useObjectUrl(photo.blob);
  return (
    <figure className="relative size-24">
      {url ? (
        <img
          src={url}
          alt={`${photo.fileName}, waiting to upload`}
          className="size-24 rounded-md border border-dashed border-amber-line object-cover opacity-80"
        />
      ) : null}
      <figcaption className="absolute inset-x-0 bottom-0 rounded-b-md bg-amber-soft/90 px-1 text-center text-xs font-semibold text-amber-deep">
        waiting to upload
      </figcaption>
    </figure>
  );
}
