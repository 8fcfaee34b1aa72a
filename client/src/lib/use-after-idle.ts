import { startTransition, useEffect, useState } from 'react';

/**
 * False until the browser has had an idle moment after this page's first render (or `timeoutMs`
 * has passed), then true — and true at once for everything mounted after that. For what may come
 * a beat later (charts, folded panels) so that it does not hold up the part a person types into:
 * on a phone the chart library's first render alone held the room form for about a second (issue 11).
 */
let idleSeen = false;
const waiting = new Set<() => void>();
let asked = false;

function askOnce(timeoutMs: number): void {
  if (asked) return;
  asked = true;
  const done = () => {
    idleSeen = true;
    // A transition: React renders what was waiting in slices and lets a keystroke in between them, so
    // the first letter typed is not held behind the charts' or the job details' first render (issue 11).
    startTransition(() => {
      for (const w of waiting) w();
    });
    waiting.clear();
  };
  if (typeof window !== 'undefined' && 'requestIdleCallback' in window)
    window.requestIdleCallback(done, { timeout: timeoutMs });
  else setTimeout(done, Math.min(timeoutMs, 50));
}

export function useAfterIdle(timeoutMs = 1500): boolean {
  const [ready, setReady] = useState(idleSeen);
  useEffect(() => {
    if (ready) return;
    const wake = () => setReady(true);
    waiting.add(wake);
    askOnce(timeoutMs);
    return () => {
      waiting.delete(wake);
    };
  }, [ready, timeoutMs]);
  return ready;
}
