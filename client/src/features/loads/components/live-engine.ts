import { startTransition, useEffect, useState } from 'react';
import { useAfterIdle } from '../../../lib/use-after-idle';

/**
 * calc's load engine as the walk-through uses it (`./live-parts`: roomLoad, homeLoad and calc's schemas
 * through model/compute, with the figures and totals that show them), loaded on its own: a person can
 * type into a room before the live figures can be worked out, so a phone on a weak signal does not wait
 * for the engine to see the form (issue 11: the walk-through's first load).
 */
export type LoadEngine = typeof import('./live-parts');

let loaded: LoadEngine | null = null;
let loading: Promise<LoadEngine> | null = null;

/** The engine, fetched once per page; a failed fetch (no signal, no cached copy) may be asked again. */
export function loadEngine(): Promise<LoadEngine> {
  loading ??= import('./live-parts').then(
    (m) => (loaded = m),
    (e: unknown) => {
      loading = null;
      throw e;
    },
  );
  return loading;
}

export type EngineState =
  { readonly status: 'ready'; readonly engine: LoadEngine } | { readonly status: 'loading' | 'failed' };

/**
 * The engine once the page has had its first idle moment (the form first), at once when it is already
 * here (every editor after the first, a room switched to). 'failed' when it could not be fetched.
 */
export function useLoadEngine(): EngineState {
  const idle = useAfterIdle();
  const [state, setState] = useState<EngineState>(() =>
    loaded ? { status: 'ready', engine: loaded } : { status: 'loading' },
  );
  useEffect(() => {
    if (state.status !== 'loading' || !idle) return;
    let live = true;
    loadEngine().then(
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
