import { preloadRoute } from './app/route-preload';

/**
 * The entry is only this: it asks for the page's own modules first (app/route-preload.ts) and the
 * app (boot.tsx: React, the router, the saved cache) beside them, so a phone downloads both at once
 * instead of one after the other (issue 11: walk-through on a phone ≤ 3 s cold, ≤ 1 s warm).
 */
preloadRoute(window.location.pathname);
void import('./boot');
