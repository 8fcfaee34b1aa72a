import { startTransition, useEffect, useRef, useState } from 'react';
import type { LivePrime } from '../model/live-room';
import { useAfterIdle } from '../../../lib/use-after-idle';

/**
 * calc's load engine as the walk-through uses it (`./live-parts`: roomLoad, homeLoad and calc's schemas
 * through model/compute, with the figures and totals that show them), loaded on its own: a person can
 * type into a room before the live figures can be worked out, so a phone on a weak signal does not wait
 * for the engine to see the form (issue 11: the walk-through's first load).
 */
export type LoadEngine = typeof import('./live-parts');

let loading: Promise<LoadEngine> | null = null;

/** The engine, fetched once per page; a failed fetch (no signal, no cached copy) may be asked again. */
export function loadEngine(): Promise<LoadEngine> {
  loading ??= import('./live-parts').catch((e: unknown) => {
    loading = null;
    throw e;
  });
  return loading;
}

export type EngineState =
  { readonly status: 'ready'; readonly engine: LoadEngine } | { readonly status: 'loading' | 'failed' };

let ready: Promise<LoadEngine> | null = null;
/** The engine once it has been got ready (what a live part mounted later starts with). */
let readyEngine: LoadEngine | null = null;

/**
 * The engine, got ready once per page for the home the first asker gives (`primeLive`: the rooms
 * parsed and the hours worked out in slices a keystroke can come between), so the first figures' render
 * only recombines. Every live part waits for the same promise and turns ready in the same moment.
 */
function engineReady(home: LivePrime | undefined): Promise<LoadEngine> {
  ready ??= loadEngine().then(
    async (engine) => {
      // Getting ready is only a head start: if it fails, the render works the figures out (or says why not).
      if (home) await engine.primeLive(home).catch(() => undefined);
      readyEngine = engine;
      return engine;
    },
    (e: unknown) => {
      ready = null;
      throw e;
    },
  );
  return ready;
}

/**
 * The engine once the page has had its first idle moment (the form first), at once when it is already
 * here (every editor after the first, a room switched to). 'failed' when it could not be fetched.
 * `prime`: the home it will be asked about (see engineReady).
 */
export function useLoadEngine(prime?: LivePrime): EngineState {
  const idle = useAfterIdle();
  const [state, setState] = useState<EngineState>(() =>
    readyEngine ? { status: 'ready', engine: readyEngine } : { status: 'loading' },
  );
  // The home as it stands when the engine arrives (a ref: asking does not start again on each render).
  const home = useRef(prime);
  home.current = prime;
  useEffect(() => {
    if (state.status !== 'loading' || !idle) return;
    let live = true;
    engineReady(home.current).then(
      // The first figures render as a transition (in slices a keystroke can come between).
      (engine) => live && startTransition(() => setState({ status: 'ready', engine })),
      () => live && setState({ status: 'failed' }),
    );
    return () => {
      live = false;
    };
  }, [state.status, idle]);
  return state;
}

/** The words shown where the figures will be while the engine is on its way, or could not come. */
export function engineWaitMessage(state: EngineState): string {
  return state.status === 'failed'
    ? 'The loads could not be loaded on this device. Reload the page when you have a signal.'
    : 'Working out the loads…';
}
