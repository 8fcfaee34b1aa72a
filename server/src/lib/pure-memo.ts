/**
 * Remembers the last results of a pure computation by a key derived from its whole input, so the
 * same input is not worked out twice in a row (the loads recompute: issue 11). Least recently used
 * entries go first once `max` is reached.
 *
 * Only for pure functions of what the key covers: the answer for a key can never differ, so a process
 * that has not seen it (another server, after a restart) computes the same thing — this is not state
 * the API depends on. Look up only after the request's permission and tenant checks have passed, and
 * put in the key everything the result depends on (a record's id included), never a person or a session.
 */
export class PureMemo<V> {
  private readonly entries = new Map<string, V>();

  constructor(private readonly max: number) {}

  get(key: string): V | undefined {
    const v = this.entries.get(key);
    if (v === undefined) return undefined;
    // Map keeps insertion order: moving the key to the end makes the first key the least recent.
    this.entries.delete(key);
    this.entries.set(key, v);
    return v;
  }

  set(key: string, value: V): void {
    this.entries.delete(key);
    this.entries.set(key, value);
    if (this.entries.size > this.max) {
      const oldest = this.entries.keys().next();
      if (!oldest.done) this.entries.delete(oldest.value);
    }
  }

  get size(): number {
    return this.entries.size;
  }
}
