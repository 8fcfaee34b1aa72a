import type { FileStorage, WaitingFile } from './file-storage';

/**
 * Photos wait on the device until their room is on the server and the connection is up,
 * then go one at a time in the order they were taken. Stored before anything else, removed
 * only when the server took them or refused them — a refusal is kept as a notice, so
 * nothing disappears without the person being told.
 */

export type FileSendResult =
  | { readonly kind: 'ok' }
  /** No connection, 5xx, signed out: try again later. */
  | { readonly kind: 'keep' }
  /** The server will never take it (too large, not an image, room full). */
  | { readonly kind: 'refused'; readonly message: string };

export interface FileNotice {
  readonly id: string;
  readonly jobId: string;
  readonly roomId: string;
  readonly fileName: string;
  readonly kind: 'added' | 'refused';
  readonly message: string;
}

export interface FileQueueState {
  readonly loaded: boolean;
  readonly waiting: readonly WaitingFile[];
  readonly uploading: string | null;
  readonly notices: readonly FileNotice[];
}

export interface FileQueueOptions {
  storage: FileStorage;
  send: (photo: WaitingFile) => Promise<FileSendResult>;
  /** True once the room's create has reached the server (a photo cannot be attached before). */
  roomReady: (jobId: string, roomId: string) => boolean;
  isOnline?: () => boolean;
  retryMs?: number;
  newId?: () => string;
  now?: () => Date;
}

export interface NewFile {
  readonly jobId: string;
  readonly roomId: string;
  readonly fileName: string;
  readonly blob: Blob;
}

export class FileQueue {
  private state: FileQueueState = { loaded: false, waiting: [], uploading: null, notices: [] };
  private readonly listeners = new Set<() => void>();
  private flushing: Promise<void> | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private seq = 0;
  private stopped = false;

  constructor(private readonly options: FileQueueOptions) {}

  readonly subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  readonly getSnapshot = (): FileQueueState => this.state;

  private update(patch: Partial<FileQueueState>): void {
    this.state = { ...this.state, ...patch };
    for (const l of this.listeners) l();
  }

  private isOnline(): boolean {
    if (this.options.isOnline) return this.options.isOnline();
    return typeof navigator === 'undefined' ? true : navigator.onLine !== false;
  }

  private readonly handleOnline = () => void this.flush();

  async start(): Promise<void> {
    this.stopped = false;
    // No IndexedDB (private mode): photos still wait in memory for this visit.
    const stored = await this.options.storage.load().catch((): WaitingFile[] => []);
    const waiting = [...stored, ...this.state.waiting.filter((p) => !stored.some((s) => s.id === p.id))].sort(
      (a, b) => a.seq - b.seq,
    );
    this.seq = waiting.reduce((m, p) => Math.max(m, p.seq), 0);
    this.update({ loaded: true, waiting });
    if (typeof window !== 'undefined') window.addEventListener('online', this.handleOnline);
    const retry = this.options.retryMs ?? 15_000;
    if (retry > 0) this.timer = setInterval(() => void this.flush(), retry);
    void this.flush();
  }

  /** Stops uploading (another person signed in on this tab); what waits stays stored. */
  stop(): void {
    this.stopped = true;
    if (typeof window !== 'undefined') window.removeEventListener('online', this.handleOnline);
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }

  list(roomId: string): WaitingFile[] {
    return this.state.waiting.filter((p) => p.roomId === roomId);
  }

  /** Written to storage first, so a reload straight after taking the photo keeps it. */
  async add(photo: NewFile): Promise<void> {
    this.seq += 1;
    const item: WaitingFile = {
      ...photo,
      id: this.options.newId ? this.options.newId() : crypto.randomUUID(),
      seq: this.seq,
      queuedAt: (this.options.now ? this.options.now() : new Date()).toISOString(),
    };
    await this.options.storage.put(item).catch(() => undefined);
    this.update({ waiting: [...this.state.waiting, item] });
    void this.flush();
  }

  async remove(id: string): Promise<void> {
    this.update({ waiting: this.state.waiting.filter((p) => p.id !== id) });
    await this.options.storage.remove(id).catch(() => undefined);
  }

  /** The person deleted the whole job (and was told its photos go with it). */
  async discardJob(jobId: string): Promise<void> {
    await Promise.all(this.state.waiting.filter((p) => p.jobId === jobId).map((p) => this.remove(p.id)));
    this.update({ notices: this.state.notices.filter((n) => n.jobId !== jobId) });
  }

  /** The person deleted the room (and was told its photos go with it). */
  async discardRoom(roomId: string): Promise<void> {
    await Promise.all(this.list(roomId).map((p) => this.remove(p.id)));
  }

  dismiss(noticeId: string): void {
    this.update({ notices: this.state.notices.filter((n) => n.id !== noticeId) });
  }

  flush(): Promise<void> {
    if (!this.flushing) {
      this.flushing = this.drain().finally(() => {
        this.flushing = null;
      });
    }
    return this.flushing;
  }

  private notify(photo: WaitingFile, kind: FileNotice['kind'], message: string): void {
    // Only the latest "added" per room is worth showing; every refusal stays until dismissed.
    const kept = this.state.notices.filter(
      (n) => !(kind === 'added' && n.kind === 'added' && n.roomId === photo.roomId),
    );
    this.update({
      notices: [
        ...kept,
        { id: photo.id, jobId: photo.jobId, roomId: photo.roomId, fileName: photo.fileName, kind, message },
      ],
    });
  }

  private async drain(): Promise<void> {
    if (!this.state.loaded) return;
    for (;;) {
      if (this.stopped || !this.isOnline()) return;
      // Oldest first among rooms the server knows; a room still being created holds only its own photos.
      const next = this.state.waiting.find((p) => this.options.roomReady(p.jobId, p.roomId));
      if (!next) return;
      this.update({ uploading: next.id });
      const result = await this.options.send(next).catch((): FileSendResult => ({ kind: 'keep' }));
      this.update({ uploading: null });
      if (result.kind === 'keep') return;
      if (result.kind === 'refused') this.notify(next, 'refused', result.message);
      else this.notify(next, 'added', `Added ${next.fileName}.`);
      await this.remove(next.id);
    }
  }
}
