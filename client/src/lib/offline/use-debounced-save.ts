import { useCallback, useEffect, useRef } from 'react';
import { markTyping } from './typing';

export const AUTOSAVE_DELAY_MS = 600;

/** The longest the pause waits for the page to catch up before it saves anyway. */
const CATCH_UP_MS = 2000;

/**
 * Runs `fn` once the page has caught up with the person: when the browser is idle, so keystrokes
 * already waiting are handled first (on a slow phone the pause can end while the next key still waits
 * behind a long render: saving then stored "100" of a "1000" being typed). Where there is no
 * requestIdleCallback, after the tasks already queued. Returns the way to call it off.
 */
function whenCaughtUp(fn: () => void): () => void {
  if (typeof window !== 'undefined' && 'requestIdleCallback' in window) {
    const handle = window.requestIdleCallback(fn, { timeout: CATCH_UP_MS });
    return () => window.cancelIdleCallback(handle);
  }
  const handle = setTimeout(fn, 0);
  return () => clearTimeout(handle);
}

/**
 * Calls `save` AUTOSAVE_DELAY_MS after the last `schedule` (once the page has caught up), and at once when the editor
 * closes or the page is hidden (switching app, locking the phone), so nothing typed waits
 * in memory only.
 */
export function useDebouncedSave<T>(key: string, save: (value: T) => void, delay = AUTOSAVE_DELAY_MS) {
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const idle = useRef<(() => void) | null>(null);
  const latest = useRef<{ value: T } | null>(null);
  const saveRef = useRef(save);
  saveRef.current = save;

  const stop = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    idle.current?.();
    idle.current = null;
  };

  const flush = useCallback(() => {
    stop();
    const next = latest.current;
    latest.current = null;
    markTyping(key, false);
    if (next) saveRef.current(next.value);
  }, [key]);

  const schedule = useCallback(
    (value: T) => {
      latest.current = { value };
      markTyping(key, true);
      stop();
      timer.current = setTimeout(() => {
        timer.current = null;
        idle.current = whenCaughtUp(flush);
      }, delay);
    },
    [delay, flush, key],
  );

  const cancel = useCallback(() => {
    stop();
    latest.current = null;
    markTyping(key, false);
  }, [key]);

  useEffect(() => {
    const handleHide = () => {
      if (document.visibilityState === 'hidden') flush();
    };
    document.addEventListener('visibilitychange', handleHide);
    window.addEventListener('pagehide', flush);
    return () => {
      document.removeEventListener('visibilitychange', handleHide);
      window.removeEventListener('pagehide', flush);
      flush();
    };
  }, [flush]);

  return { schedule, flush, cancel };
}
