import { useSyncExternalStore } from 'react';
import { getCurrentPerson, personKey, useCurrentPerson, type Person } from './person';

/** Anything the kit runs: the edit queue (queue-runner.ts) and the file queue (file-queue.ts). */
export interface Runner<S> {
  start(): Promise<void>;
  stop(): void;
  subscribe(listener: () => void): () => void;
  getSnapshot(): S;
}

/**
 * One runner per tab for whoever is signed in: made and started on first use, and when another
 * person signs in on the tab, the previous person's stops (its changes stay in their storage) and
 * the new person's is made from theirs. `make` gets null before the sign-in check has run (a
 * loader racing the guard); it should then keep changes in memory only. `with_` is what the runner
 * is built on (the query client, another queue): a different one makes a new runner too.
 */
export function perPerson<A, R extends Runner<unknown>>(make: (person: Person | null, with_: A) => R): (with_: A) => R {
  let held: { readonly key: string; readonly with_: A; readonly runner: R } | null = null;
  return (with_) => {
    const person = getCurrentPerson();
    const key = person ? personKey(person) : '';
    if (held?.key !== key || held.with_ !== with_) {
      held?.runner.stop();
      const runner = make(person, with_);
      held = { key, with_, runner };
      void runner.start();
    }
    return held.runner;
  };
}

/**
 * The `useOfflineQueue` of the kit: the runner a feature uses (injected in tests, else the signed-in
 * person's) and its state, re-rendered when it changes or another person signs in on the tab.
 */
export function useOfflineQueue<S, R extends Runner<S>>(runner: R): { runner: R; state: S } {
  useCurrentPerson();
  const state = useSyncExternalStore(
    runner.subscribe,
    () => runner.getSnapshot(),
    () => runner.getSnapshot(),
  );
  return { runner, state };
}
