import { createStore, type UseStore } from 'idb-keyval';
import { useSyncExternalStore } from 'react';

/**
 * Whose changes these are. Everything the device keeps for later (waiting edits, waiting photos,
 * unsaved drafts, the saved query cache) is stored under the company and person who made it, so
 * on a shared tablet the next person neither sees nor sends the previous person's changes; the
 * first person gets them back when they sign in again. The signed-in guard sets it.
 */
export interface Person {
  readonly companyId: string;
  readonly userId: string;
}

let current: Person | null = null;
const listeners = new Set<() => void>();

export const personKey = (p: Person): string => `${p.companyId}:${p.userId}`;

export function getCurrentPerson(): Person | null {
  return current;
}

export function setCurrentPerson(next: Person | null): void {
  if (current === next || (current && next && personKey(current) === personKey(next))) return;
  current = next;
  if (next) void removeUnscopedStores();
  for (const l of listeners) l();
}

export function subscribePerson(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Re-renders when another person signs in on this tab. */
export function useCurrentPerson(): Person | null {
  return useSyncExternalStore(subscribePerson, getCurrentPerson, getCurrentPerson);
}

export interface PersonStores {
  /** Waiting edits (one key per queue). */
  readonly queue: UseStore;
  /** Waiting photos, one record per photo. */
  readonly photos: UseStore;
  /** The saved query cache, so the app opens with no signal. */
  readonly cache: UseStore;
}

const stores = new Map<string, PersonStores>();

/** One IndexedDB database per kind and person: `gaugeline-queue:<company>:<user>` and so on. */
export function personStores(p: Person): PersonStores {
  const key = personKey(p);
  let s = stores.get(key);
  if (!s) {
    s = {
      queue: createStore(`gaugeline-queue:${key}`, 'edits'),
      photos: createStore(`gaugeline-photos:${key}`, 'waiting'),
      cache: createStore(`gaugeline-cache:${key}`, 'queries'),
    };
    stores.set(key, s);
  }
  return s;
}

/** The names used before storage was per person; nobody can tell whose they were, so they go. */
export const UNSCOPED_DATABASES = ['gaugeline', 'gaugeline-photos'] as const;
const UNSCOPED_DRAFT_PREFIX = 'gaugeline:unsaved-room:v1:';
const STORAGE_LAYOUT_KEY = 'gaugeline:storage-layout';
const STORAGE_LAYOUT = 'per-person-1';

let removing: Promise<void> | null = null;

/** Deletes the stores of the one-per-browser layout, once per browser (remembered in localStorage). */
export function removeUnscopedStores(): Promise<void> {
  removing ??= (async () => {
    try {
      if (typeof localStorage !== 'undefined' && localStorage.getItem(STORAGE_LAYOUT_KEY) === STORAGE_LAYOUT) return;
      if (typeof localStorage !== 'undefined') {
        const old: string[] = [];
        for (let i = 0; i < localStorage.length; i++) {
          const k = localStorage.key(i);
          if (k?.startsWith(UNSCOPED_DRAFT_PREFIX)) old.push(k);
        }
        for (const k of old) localStorage.removeItem(k);
      }
      if (typeof indexedDB !== 'undefined') {
        await Promise.all(
          UNSCOPED_DATABASES.map(
            (name) =>
              new Promise<void>((resolve) => {
                const req = indexedDB.deleteDatabase(name);
                req.onsuccess = () => resolve();
                req.onerror = () => resolve();
                // Another tab of the old version still has it open: it goes when that tab closes.
                req.onblocked = () => resolve();
              }),
          ),
        );
      }
      if (typeof localStorage !== 'undefined') localStorage.setItem(STORAGE_LAYOUT_KEY, STORAGE_LAYOUT);
    } catch {
      // Storage refused (private mode): nothing was stored there either.
    }
  })();
  return removing;
}

/** Tests: forget who is signed in and whether the old stores were removed. */
export function resetPersonForTests(): void {
  current = null;
  removing = null;
  for (const l of listeners) l();
}
