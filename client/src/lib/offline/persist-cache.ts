import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { onlineManager, type QueryClient } from '@tanstack/react-query';
import { persistQueryClientRestore, persistQueryClientSubscribe } from '@tanstack/react-query-persist-client';
import { del, get, set } from 'idb-keyval';
import { CLIENT_API_VERSION } from '../api-version';
import { LAST_PERSON_KEY } from './last-person';
import { getCurrentPerson, personKey, personStores, subscribePerson, type Person } from './person';

/**
 * The query cache kept per person in IndexedDB (`gaugeline-cache:<company>:<user>`), so a
 * salesperson who opens the app or reloads with no signal sees the jobs and rooms they last had.
 * Written as it changes (at most once a second); read back at start-up for the person who was
 * last signed in on this device; removed at sign-out. A cache made for another API version is
 * dropped rather than shown (`buster`).
 */
const MAX_AGE_MS = 14 * 24 * 3_600_000;
const BUSTER = `api-${CLIENT_API_VERSION}`;

function persisterFor(p: Person) {
  const store = personStores(p).cache;
  return createAsyncStoragePersister({
    storage: {
      getItem: async (key: string) => (await get<string>(key, store)) ?? null,
      setItem: (key: string, value: string) => set(key, value, store),
      removeItem: (key: string) => del(key, store),
    },
    key: 'queries',
    throttleTime: 1000,
  });
}

function isPerson(v: unknown): v is Person {
  if (typeof v !== 'object' || v === null) return false;
  const r: Record<string, unknown> = { ...v };
  return typeof r.companyId === 'string' && typeof r.userId === 'string';
}

function lastPerson(): Person | null {
  try {
    const raw = localStorage.getItem(LAST_PERSON_KEY);
    const parsed: unknown = raw ? JSON.parse(raw) : null;
    return isPerson(parsed) ? { companyId: parsed.companyId, userId: parsed.userId } : null;
  } catch {
    return null;
  }
}

/** Before the router's first loaders: the last person's queries, so the app can open with no signal. */
export async function restorePersonCache(queryClient: QueryClient): Promise<void> {
  const p = lastPerson();
  if (!p) return;
  await persistQueryClientRestore({
    queryClient,
    persister: persisterFor(p),
    maxAge: MAX_AGE_MS,
    buster: BUSTER,
  }).catch(() => undefined);
}

let stopSaving: (() => void) | null = null;

/** Saves the signed-in person's queries into their own store; another person signing in switches stores. */
export function keepPersonCache(queryClient: QueryClient): () => void {
  let following: string | null = null;
  const follow = () => {
    const p = getCurrentPerson();
    if (!p || personKey(p) === following) return;
    stopSaving?.();
    following = personKey(p);
    try {
      localStorage.setItem(LAST_PERSON_KEY, JSON.stringify(p));
    } catch {
      // No localStorage: the cache is still saved, only not found again after a restart offline.
    }
    stopSaving = persistQueryClientSubscribe({
      queryClient,
      persister: persisterFor(p),
      buster: BUSTER,
      // A query marked `meta: { persist: false }` (a customer's proposal) is never written to the device.
      dehydrateOptions: { shouldDehydrateQuery: (q) => q.state.status === 'success' && q.meta?.persist !== false },
    });
  };
  follow();
  const off = subscribePerson(follow);
  return () => {
    off();
    stopSaving?.();
    stopSaving = null;
  };
}

let keeping = false;

/**
 * keepPersonCache, started once per page: at start-up after a restore, or by the signed-in guard
 * on a device where nobody was saved (start-up then loads none of this, see boot.tsx).
 */
export function keepPersonCacheOnce(queryClient: QueryClient): void {
  if (keeping) return;
  keeping = true;
  keepPersonCache(queryClient);
}

/** Sign-out: this person's saved queries go, and the device forgets who was last signed in. */
export async function forgetPersonCache(): Promise<void> {
  stopSaving?.();
  stopSaving = null;
  const p = getCurrentPerson() ?? lastPerson();
  try {
    localStorage.removeItem(LAST_PERSON_KEY);
  } catch {
    // Nothing was stored.
  }
  if (p) await persisterFor(p).removeClient();
}

/** Whether a fetch would be held back by TanStack Query (offline): the cached answer is all there is. */
export const isOffline = (): boolean => !onlineManager.isOnline();
