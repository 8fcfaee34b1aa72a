import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';
import { summariseTrace, type TraceEvent, type TraceSummary } from './phone-trace';

/** A phone on weak 4G, as issue 11 sets it: 4× CPU slowdown, 1.6 Mbps down, 750 kbps up, 150 ms round trip. */
const NETWORK = {
  offline: false,
  latency: 150,
  downloadThroughput: (1.6 * 1024 * 1024) / 8,
  uploadThroughput: (750 * 1024) / 8,
};
const CPU_SLOWDOWN = 4;
/** With a trace: how long it goes on after the letter arrived, to show what the page kept for later. */
const AFTER_TYPED_MS = 3000;
/** With a trace: letters typed one at a time after that, a pause apart, to time a settled keystroke's work. */
const MORE_KEYS = 'abcdefgh';
const KEY_PAUSE_MS = 300;

export interface PhoneTiming {
  readonly coldMs: number;
  readonly warmMs: number;
  /** Until the room-name field was on screen (the rest is the typed letter reaching it). */
  readonly coldVisibleMs: number;
  readonly warmVisibleMs: number;
  /** Whether the service worker answered the warm load (it controlled the page). */
  readonly warmFromWorker: boolean;
  readonly transferredKb: number;
  readonly foreign: number;
  /** With BENCH_PHONE_PROFILE: what the main thread did on each load (bench/lib/phone-trace.ts). */
  readonly traces?: { readonly cold: TraceSummary; readonly warm: TraceSummary };
}

/** The Chromium trace categories the summary reads: tasks, timeline events and V8's sampling profiler. */
const TRACE_CATEGORIES = [
  'toplevel',
  'devtools.timeline',
  'disabled-by-default-devtools.timeline',
  'v8',
  'v8.execute',
  'disabled-by-default-v8.cpu_profiler',
  'blink.user_timing',
  'loading',
];

/**
 * Time from navigation until the walk-through's room-name field takes a typed letter, on a
 * throttled 375 px Chromium (Debian's, through playwright-core): cold (empty cache) and warm
 * (the same tab opening the page again). Signs in with the given cookie (sent as a browser
 * behind the TLS proxy would, X-Forwarded-Proto: https).
 */
export async function phoneTimings(
  base: string,
  cookie: { name: string; value: string },
  path: string,
  profile?: { assetsDir: string; saveDir?: string },
) {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-sync'],
  });
  let context: BrowserContext | undefined;
  try {
    context = await browser.newContext({
      viewport: { width: 375, height: 812 },
      deviceScaleFactor: 2,
      isMobile: true,
      hasTouch: true,
      extraHTTPHeaders: { 'X-Forwarded-Proto': 'https' },
    });
    const host = new URL(base).hostname;
    await context.addCookies([
      { ...cookie, domain: host, path: '/', secure: true, httpOnly: true, sameSite: 'Lax' as const },
    ]);
    const page = await context.newPage();
    // No page.route() here: routing turns Chromium's HTTP cache off, and the warm figure needs it.
    // The app asks no other host for anything; any such request is counted and printed.
    let foreign = 0;
    page.on('request', (r) => {
      if (!r.url().startsWith(base) && !r.url().startsWith('data:') && !r.url().startsWith('blob:')) foreign += 1;
    });
    page.setDefaultTimeout(60_000);
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', NETWORK);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
    let bytes = 0;
    cdp.on('Network.loadingFinished', (e: { encodedDataLength: number }) => {
      bytes += e.encodedDataLength;
    });

    const trace = process.env.BENCH_PHONE_TRACE === '1';
    let tNav = 0;
    if (trace) {
      page.on('request', (r) =>
        console.log(`    +${(performance.now() - tNav).toFixed(0)} ms → ${r.method()} ${r.url().replace(base, '')}`),
      );
      page.on('requestfinished', (r) =>
        console.log(`    +${(performance.now() - tNav).toFixed(0)} ms ✓ ${r.url().replace(base, '')}`),
      );
    }
    let visibleMs = 0;
    const traces: Partial<Record<'cold' | 'warm', TraceSummary>> = {};
    const typeable = async (letter: string, label: 'cold' | 'warm') => {
      const t0 = performance.now();
      tNav = t0;
      await page.goto(`${base}${path}`, { waitUntil: 'commit' });
      const field = page.getByLabel('Room name', { exact: true }).first();
      await field.waitFor({ state: 'visible' });
      visibleMs = performance.now() - t0;
      await field.press('End');
      await field.pressSequentially(letter);
      await page.waitForFunction(
        (l) => (document.activeElement as HTMLInputElement | null)?.value.endsWith(l) ?? false,
        letter,
      );
      const ms = performance.now() - t0;
      if (profile) {
        // What the page does next (the work kept until after the first keystroke) is in the trace too.
        await page.waitForTimeout(AFTER_TYPED_MS);
        // Then more letters, each once the last one's work is done: the room editor's cost per keystroke.
        const keysFromMs = performance.now() - t0;
        for (const key of MORE_KEYS) {
          await field.press(key);
          await page.waitForTimeout(KEY_PAUSE_MS);
        }
        const keysEndMs = performance.now() - t0;
        const raw = await browser.stopTracing();
        for (let i = 0; i < MORE_KEYS.length; i += 1) await field.press('Backspace');
        // The file's name carries when the field showed and took the letter (ms), for reading it again later.
        if (profile.saveDir)
          writeFileSync(
            join(
              profile.saveDir,
              `phone-${label}-${Date.now()}-shown${Math.round(visibleMs)}-typed${Math.round(ms)}.json`,
            ),
            raw,
          );
        const events = (JSON.parse(raw.toString('utf8')) as { traceEvents: TraceEvent[] }).traceEvents;
        traces[label] = summariseTrace(events, {
          visibleMs,
          typedMs: ms,
          endMs: keysEndMs,
          keysFromMs,
          assetsDir: profile.assetsDir,
        });
      }
      await field.press('Backspace');
      return ms;
    };
    // The profiler starts before the measured navigation (starting it costs the page it starts in a moment).
    if (profile) await browser.startTracing(page, { categories: TRACE_CATEGORIES });
    const coldMs = await typeable('q', 'cold');
    const coldVisibleMs = visibleMs;
    const transferredKb = bytes / 1024;
    // Let the first visit's edit settle (it is typed back), then open the page again in the same tab.
    if (profile) await browser.startTracing(page, { categories: TRACE_CATEGORIES });
    await page.waitForTimeout(1500);
    const warmMs = await typeable('z', 'warm');
    const warmVisibleMs = visibleMs;
    const warmFromWorker = await page.evaluate(() => navigator.serviceWorker?.controller != null);
    await page.waitForTimeout(1500);
    return {
      coldMs,
      warmMs,
      coldVisibleMs,
      warmVisibleMs,
      warmFromWorker,
      transferredKb,
      foreign,
      ...(traces.cold && traces.warm ? { traces: { cold: traces.cold, warm: traces.warm } } : {}),
    } satisfies PhoneTiming;
  } finally {
    await context?.close().catch(() => undefined);
    await browser.close();
  }
}
