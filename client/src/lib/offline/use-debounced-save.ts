import { useCallback, useEffect, useRef } from 'react';
import { markTyping } from './typing';

export const AUTOSAVE_DELAY_MS = 600;

/**
 * Calls `save` AUTOSAVE_DELAY_MS after the last `schedule`, and at once when the editor
 * closes or the page is hidden (switching app, locking the phone), so nothing typed waits
 * in memory only.
 */
export function useDebouncedSave<T>(key: string, save: (value: T) => void, delay = AUTOSAVE_DELAY_MS) {
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const latest = useRef<{ value: T } | null>(null);
  const saveRef = useRef(save);
  saveRef.current = save;

  const flush = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    const next = latest.current;
    latest.current = null;
    markTyping(key, false);
    if (next) saveRef.current(next.value);
  }, [key]);

  const schedule = useCallback(
    (value: T) => {
      latest.current = { value };
      markTyping(key, true);
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(flush, delay);
    },
    [delay, flush, key],
  );

  const cancel = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
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
