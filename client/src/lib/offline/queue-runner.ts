import type { OfflineQueueOptions, QueueItem, QueueState, NewItem } from './queue';

type Listener = () => void;

/** Runs an offline queue: see offline-queue.ts for the contract. */
export class OfflineQueue<P> {
  private state: QueueState<P>;
  private readonly listeners = new Set<Listener>();
  private persisting: Promise<void> = Promise.resolve();
  private flushing: Promise<void> | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private inFlight: string | null = null;
  private seq = 0;
  private stopped = false;
  /** The version each target reached through this queue's own writes. */
  private readonly reached = new Map<string, number>();

  constructor(private readonly options: OfflineQueueOptions<P>) {
    this.state = {
      loaded: false,
      online: this.isOnline(),
      sending: false,
      items: [],
      conflict: null,
      rejected: null,
      blocked: null,
    };
  }

  private isOnline(): boolean {
    if (this.options.isOnline) return this.options.isOnline();
    return typeof navigator === 'undefined' ? true : navigator.onLine !== false;
  }

  readonly subscribe = (listener: Listener): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  readonly getSnapshot = (): QueueState<P> => this.state;

  private update(patch: Partial<QueueState<P>>): void {
    this.state = { ...this.state, ...patch };
    for (const l of this.listeners) l();
  }

  private setItems(items: readonly QueueItem<P>[]): Promise<void> {
    this.update({ items });
    // Writes to storage are chained so the stored list never goes back in time.
    this.persisting = this.persisting.then(() => this.options.storage.save(items)).catch(() => undefined);
    return this.persisting;
  }

  private readonly handleOnline = () => {
    this.update({ online: true });
    void this.flush();
  };

  private readonly handleOffline = () => this.update({ online: false });

  /** Loads what a previous visit left waiting, listens for the connection and retries now and then. */
  async start(): Promise<void> {
    this.stopped = false;
    // No IndexedDB (private mode, old browser): keep working in memory rather than not at all.
    const stored = await this.options.storage.load().catch(() => []);
    const items = [...stored].sort((a, b) => a.seq - b.seq);
    // Anything enqueued before the load finished goes after what was stored.
    const merged = [...items, ...this.state.items.filter((i) => !items.some((s) => s.id === i.id))];
    this.seq = merged.reduce((m, i) => Math.max(m, i.seq), 0);
    this.update({ loaded: true });
    await this.setItems(merged.map((i, n) => ({ ...i, seq: n + 1 })));
    this.seq = merged.length;
    if (typeof window !== 'undefined') {
      window.addEventListener('online', this.handleOnline);
      window.addEventListener('offline', this.handleOffline);
    }
    const retry = this.options.retryMs ?? 15_000;
    if (retry > 0) this.timer = setInterval(() => void this.flush(), retry);
    void this.flush();
  }

  /** Stops listening and sending (another person signed in on this tab); what waits stays stored. */
  stop(): void {
    this.stopped = true;
    if (typeof window !== 'undefined') {
      window.removeEventListener('online', this.handleOnline);
      window.removeEventListener('offline', this.handleOffline);
    }
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }

  /** Stores the edit (merging it into a waiting one of the same target when allowed), then tries to send. */
  async enqueue(edit: NewItem<P>): Promise<void> {
    // An editor may still hold the version it rendered with when its own previous write has
    // already landed (the debounce fires between the answer and the next render): an edit made
    // on this device stands on the newest version this device wrote, never on an older one.
    const reached = this.reached.get(edit.target);
    const next =
      reached !== undefined && (edit.baseVersion === null || edit.baseVersion < reached)
        ? { ...edit, baseVersion: reached }
        : edit;
    const items = [...this.state.items];
    const coalesce = this.options.coalesce;
    if (coalesce) {
      for (let i = items.length - 1; i >= 0; i--) {
        const waiting = items[i];
        if (!waiting || waiting.target !== next.target) continue;
        if (waiting.id === this.inFlight || waiting.id === this.state.conflict?.id) break;
        const merged = coalesce(waiting, next);
        if (merged === 'drop-both') {
          items.splice(i, 1);
          await this.setItems(items);
          return;
        }
        if (merged) {
          items[i] = merged;
          await this.setItems(items);
          void this.flush();
          return;
        }
        break;
      }
    }
    this.seq += 1;
    const item: QueueItem<P> = {
      ...next,
      id: this.options.newId ? this.options.newId() : crypto.randomUUID(),
      seq: this.seq,
      queuedAt: (this.options.now ? this.options.now() : new Date()).toISOString(),
    };
    await this.setItems([...items, item]);
    void this.flush();
  }

  /** Sends waiting items one by one, oldest first; stops at a network failure or a conflict. */
  flush(): Promise<void> {
    if (!this.flushing) {
      this.flushing = this.drain().finally(() => {
        this.flushing = null;
      });
    }
    return this.flushing;
  }

  private async drain(): Promise<void> {
    if (!this.state.loaded) return;
    for (;;) {
      if (this.stopped) break;
      const head = this.state.items[0];
      if (!head || this.state.conflict) break;
      if (!this.isOnline()) {
        this.update({ online: false });
        break;
      }
      this.inFlight = head.id;
      this.update({ sending: true });
      const result = await this.options.send(head).catch((): { kind: 'network' } => ({ kind: 'network' }));
      this.inFlight = null;
      // The head may have been replaced by a conflict resolution meanwhile; look it up again.
      const current = this.state.items.find((i) => i.id === head.id);
      if (result.kind === 'network') {
        this.update({ sending: false, online: false });
        break;
      }
      if (result.kind === 'blocked') {
        this.update({ sending: false, online: true, blocked: result.message });
        break;
      }
      if (result.kind === 'conflict') {
        this.update({ sending: false, online: true, conflict: current ?? head });
        break;
      }
      const rest = this.state.items.filter((i) => i.id !== head.id);
      if (result.kind === 'rejected') {
        this.update({ rejected: result.message });
        await this.setItems(rest);
      } else {
        // Later edits of the same target were made on top of this one: they now stand on its new version.
        const rebased = rest.map((i) =>
          i.target === head.target && result.version !== null ? { ...i, baseVersion: result.version } : i,
        );
        if (result.version !== null) this.reached.set(head.target, result.version);
        this.options.onSent?.(head, result.version);
        await this.setItems(rebased);
      }
      this.update({ sending: false, online: true, blocked: null });
    }
  }

  /**
   * After a 409: send `payload` against the server's `baseVersion` instead, or 'drop' to
   * keep theirs — which drops every waiting edit of that target, since each carries the
   * whole record as the person had it.
   */
  async resolveConflict(
    itemId: string,
    resolution: { readonly payload: P; readonly baseVersion: number } | 'drop',
  ): Promise<void> {
    const target = this.state.items.find((i) => i.id === itemId)?.target;
    const items =
      resolution === 'drop'
        ? this.state.items.filter((i) => i.target !== target)
        : this.state.items.map((i) => {
            if (i.id === itemId) return { ...i, payload: resolution.payload, baseVersion: resolution.baseVersion };
            return i.target === target ? { ...i, baseVersion: resolution.baseVersion } : i;
          });
    this.update({ conflict: null });
    await this.setItems(items);
    void this.flush();
  }

  /**
   * Drops every waiting edit `match` picks, when what they were for is gone (the person deleted
   * it and was told so); a conflict about one of them is closed too, so the queue moves on.
   */
  async discard(match: (item: QueueItem<P>) => boolean): Promise<void> {
    const keep = this.state.items.filter((i) => i.id === this.inFlight || !match(i));
    if (this.state.conflict && match(this.state.conflict)) this.update({ conflict: null });
    await this.setItems(keep);
    void this.flush();
  }

  dismissRejected(): void {
    this.update({ rejected: null });
  }
}
