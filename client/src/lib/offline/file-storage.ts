import { del, entries, set, type UseStore } from 'idb-keyval';

/** A photo taken on this device that has not reached the server yet. */
export interface WaitingFile {
  readonly id: string;
  /** Order of taking; uploads go by it (queuedAt can repeat within a millisecond). */
  readonly seq: number;
  readonly jobId: string;
  readonly roomId: string;
  readonly fileName: string;
  readonly queuedAt: string;
  readonly blob: Blob;
}

/** One record per photo, so adding or removing one never rewrites the others' bytes. */
export interface FileStorage {
  load(): Promise<WaitingFile[]>;
  put(photo: WaitingFile): Promise<void>;
  remove(id: string): Promise<void>;
}

/** What comes back from IndexedDB is read as written by this file; anything else is skipped. */
function isWaitingPhoto(v: unknown): v is WaitingFile {
  if (typeof v !== 'object' || v === null) return false;
  const r: Record<string, unknown> = { ...v };
  return (
    typeof r.id === 'string' &&
    typeof r.seq === 'number' &&
    typeof r.jobId === 'string' &&
    typeof r.roomId === 'string' &&
    typeof r.fileName === 'string' &&
    typeof r.queuedAt === 'string' &&
    r.blob instanceof Blob
  );
}

/** IndexedDB through idb-keyval, apart from the edit queue: it stores Blobs as they are. */
export function idbFileStorage(db: UseStore): FileStorage {
  return {
    load: async () => (await entries(db)).map(([, v]: [unknown, unknown]) => v).filter(isWaitingPhoto),
    put: (photo) => set(photo.id, photo, db),
    remove: (id) => del(id, db),
  };
}

/** For tests, and the same shape a reload would see: a new queue over the same object keeps what was put. */
export function memoryFileStorage(): FileStorage & { readonly ids: () => string[] } {
  const photos = new Map<string, WaitingFile>();
  return {
    load: async () => [...photos.values()],
    put: async (photo) => {
      photos.set(photo.id, photo);
    },
    remove: async (id) => {
      photos.delete(id);
    },
    ids: () => [...photos.keys()],
  };
}
