import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { originalPositionFor, TraceMap } from '@jridgewell/trace-mapping';

/**
 * What the phone's main thread did during one page load, from a Chromium performance trace
 * (browser.startTracing with the DevTools timeline and V8 sampling-profiler categories): the long
 * tasks (≥ 50 ms at the throttled CPU) with what each one ran, and the JavaScript self time by source
 * file (mapped back through the build's source maps), so the work before the first keystroke can be
 * named. Durations are the throttled phone's (4× this machine's), and unlike the wall-clock timings
 * they hardly move with the machine's load: the throttle counts the renderer's own CPU time.
 */

export interface TraceEvent {
  readonly name: string;
  readonly cat?: string;
  readonly ph: string;
  readonly ts: number;
  readonly dur?: number;
  /** Thread (CPU) time of the event, µs: what the main thread itself spent, whatever else the machine ran. */
  readonly tdur?: number;
  readonly pid: number;
  readonly tid: number;
  readonly id?: string;
  readonly args?: Record<string, unknown>;
}

export interface LongTask {
  /** ms after navigation start. */
  readonly startMs: number;
  /** Wall-clock length of the task. */
  readonly ms: number;
  /** The main thread's CPU time in it (the throttle's share included: Chromium's 4× slowdown keeps the thread busy). */
  readonly cpuMs: number;
  /** The task's largest parts, e.g. "evaluate module shell-….js 180 ms". */
  readonly parts: ReadonlyArray<{ readonly what: string; readonly ms: number }>;
  /** JavaScript self time inside the task by original source file (from the sampling profiler). */
  readonly sources: ReadonlyArray<{ readonly source: string; readonly ms: number }>;
}

export interface TraceSummary {
  /** When the room-name field showed and when the typed letter had arrived, ms after navigation start. */
  readonly visibleMs: number;
  readonly typedMs: number;
  /**
   * Main-thread CPU time in tasks before the field showed, between showing and taking the letter, and in
   * the 3 s after. CPU time, not wall time: a loaded machine makes the tasks wait for a core (longer on
   * the clock) but hardly changes the CPU time they take, so these compare across runs.
   */
  readonly busyBeforeVisibleMs: number;
  readonly busyVisibleToTypedMs: number;
  readonly busyAfterTypedMs: number;
  /** Every long task from navigation start to the end of the trace, in order. */
  readonly longTasks: readonly LongTask[];
  /** Main-thread CPU time by kind until the letter arrived (script, style, layout, paint, parse, GC…). */
  readonly byKind: ReadonlyArray<{ readonly kind: string; readonly ms: number }>;
  /** JavaScript self time by original source file until the letter arrived. */
  readonly bySource: ReadonlyArray<{ readonly source: string; readonly ms: number }>;
  /**
   * The main thread's CPU in each task that handled a typed letter (its keypress/input events and the
   * render they ran) from `keysFromMs` on: the letters typed once the page had settled. What a letter waits
   * for; the work a keystroke leaves for later (a deferred render) is in the tasks after it.
   */
  readonly keyTasksMs: readonly number[];
}

/** An event's CPU time in ms (its wall time where the trace has no thread time). */
const cpu = (e: TraceEvent) => (e.tdur ?? e.dur ?? 0) / 1000;
const data = (e: TraceEvent) => (e.args?.data ?? {}) as Record<string, unknown>;
const str = (v: unknown) => (typeof v === 'string' ? v : '');
const file = (url: string) => url.replace(/^.*\//, '').replace(/\?.*$/, '');

/** One name for what a timeline event did, as a person reading the list wants it. */
function describe(e: TraceEvent): string | null {
  const d = data(e);
  switch (e.name) {
    case 'v8.evaluateModule':
    case 'EvaluateScript':
      return `evaluate ${file(str(d.url) || str(e.args?.url) || str((e.args?.fileName as string | undefined) ?? '')) || 'module'}`;
    case 'v8.compileModule':
    case 'v8.compile':
    case 'CompileScript':
      return `compile ${file(str(d.url) || str(e.args?.fileName)) || 'script'}`;
    case 'FunctionCall':
      return `call ${str(d.functionName) || '(anonymous)'} (${file(str(d.url))})`;
    case 'TimerFire':
      return 'timer';
    case 'FireIdleCallback':
      return 'idle callback';
    case 'FireAnimationFrame':
      return 'animation frame';
    case 'EventDispatch':
      return `event ${str(d.type)}`;
    case 'RunMicrotasks':
      return 'microtasks (promise callbacks)';
    case 'ParseHTML':
      return 'parse HTML';
    case 'ParseAuthorStyleSheet':
      return `parse CSS ${file(str((d.styleSheetUrl as string | undefined) ?? ''))}`;
    case 'UpdateLayoutTree':
    case 'RecalculateStyles':
      return 'style recalc';
    case 'Layout':
      return 'layout';
    case 'PrePaint':
    case 'Paint':
    case 'PaintImage':
    case 'Layerize':
    case 'UpdateLayer':
    case 'CompositeLayers':
      return 'paint';
    case 'MajorGC':
    case 'MinorGC':
    case 'V8.GC_SCAVENGER':
    case 'V8.GC_MARK_COMPACTOR':
    case 'BlinkGC.AtomicPhase':
      return 'garbage collection';
    case 'HandlePostMessage':
      return 'postMessage (React scheduler)';
    case 'ResourceReceivedData':
    case 'ResourceFinish':
      return null;
    case 'FontLoad':
    case 'Decode Image':
      return e.name === 'FontLoad' ? 'font load' : 'image decode';
    default:
      return null;
  }
}

const KIND: Record<string, string> = {
  'style recalc': 'style',
  layout: 'layout',
  paint: 'paint',
  'parse HTML': 'parse HTML',
  'garbage collection': 'GC',
};
function kindOf(what: string): string {
  if (KIND[what]) return KIND[what];
  if (what.startsWith('parse CSS')) return 'parse CSS';
  if (what.startsWith('compile')) return 'compile';
  if (what.startsWith('evaluate')) return 'module/script evaluation';
  return 'script';
}

/** Maps a built asset's (line, column) back to the original source file, through its .map beside it. */
class SourceMapper {
  private readonly maps = new Map<string, TraceMap | null>();
  constructor(private readonly assetsDir: string | null) {}
  source(url: string, line: number, column: number): string {
    const name = file(url);
    if (!name) return '(native / browser)';
    if (!this.assetsDir || !name.endsWith('.js')) return name;
    let map = this.maps.get(name);
    if (map === undefined) {
      const path = join(this.assetsDir, `${name}.map`);
      map = existsSync(path) ? new TraceMap(readFileSync(path, 'utf8')) : null;
      this.maps.set(name, map);
    }
    if (!map) return name;
    let source: string | null = null;
    try {
      source = line >= 0 ? originalPositionFor(map, { line: line + 1, column: Math.max(0, column) }).source : null;
    } catch {
      // A position outside the map (V8 reports some frames at line -1): the built file's name is all there is.
    }
    if (!source) return name;
    return source
      .replace(/^.*node_modules\//, 'node_modules/')
      .replace(/^(\.\.\/)+/, '')
      .replace(/^node_modules\/(\.pnpm\/)?((@[^/]+\/)?[^/]+)\/.*$/, '$2 (package)');
  }
}

interface Sample {
  readonly ts: number;
  readonly source: string;
}

/** The V8 sampling profiler's samples on the page's main thread, each with the source file it was in. */
function samplesOf(events: readonly TraceEvent[], pid: number, tid: number, mapper: SourceMapper): Sample[] {
  const profiles = new Map<string, { start: number; nodes: Map<number, string>; last: number }>();
  const out: Sample[] = [];
  for (const e of events) {
    if (e.pid !== pid) continue;
    if (e.name === 'Profile' && e.tid === tid && e.id) {
      const start = Number(data(e).startTime ?? e.ts);
      profiles.set(e.id, { start, nodes: new Map(), last: start });
    } else if (e.name === 'ProfileChunk' && e.id) {
      const p = profiles.get(e.id);
      if (!p) continue;
      const d = data(e) as {
        cpuProfile?: {
          nodes?: Array<{
            id: number;
            callFrame: { functionName?: string; url?: string; lineNumber?: number; columnNumber?: number };
          }>;
          samples?: number[];
        };
        timeDeltas?: number[];
      };
      for (const n of d.cpuProfile?.nodes ?? []) {
        const cf = n.callFrame;
        const special = ['(garbage collector)', '(program)', '(idle)', '(root)'].includes(cf.functionName ?? '');
        p.nodes.set(
          n.id,
          special ? (cf.functionName ?? '') : mapper.source(cf.url ?? '', cf.lineNumber ?? 0, cf.columnNumber ?? 0),
        );
      }
      const samples = d.cpuProfile?.samples ?? [];
      const deltas = d.timeDeltas ?? [];
      for (let i = 0; i < samples.length; i += 1) {
        p.last += deltas[i] ?? 0;
        const source = p.nodes.get(samples[i] ?? -1) ?? '?';
        if (source === '(idle)' || source === '(root)') continue;
        out.push({ ts: p.last, source });
      }
    }
  }
  return out.sort((a, b) => a.ts - b.ts);
}

function sourceTimes(samples: readonly Sample[], from: number, to: number): Array<{ source: string; ms: number }> {
  // Each sample stands for the time until the next one (the sampling interval), capped at 2 ms.
  const sums = new Map<string, number>();
  for (let i = 0; i < samples.length; i += 1) {
    const s = samples[i];
    if (!s || s.ts < from || s.ts >= to) continue;
    const next = samples[i + 1]?.ts ?? s.ts;
    sums.set(s.source, (sums.get(s.source) ?? 0) + Math.min(2000, next - s.ts) / 1000);
  }
  return [...sums].map(([source, ms]) => ({ source, ms })).sort((a, b) => b.ms - a.ms);
}

/**
 * Summarises one trace: the renderer main thread that navigated last, from its navigation start until
 * `endMs` after it; `visibleMs` and `typedMs` split it. `assetsDir` (dist/client/assets) maps the built
 * files back to their sources.
 */
export function summariseTrace(
  events: readonly TraceEvent[],
  opts: {
    visibleMs: number;
    typedMs: number;
    endMs: number;
    keysFromMs?: number;
    assetsDir?: string;
    minTaskMs?: number;
  },
): TraceSummary {
  const mainThreads = events.filter(
    (e) => e.ph === 'M' && e.name === 'thread_name' && str(e.args?.name) === 'CrRendererMain',
  );
  // The main thread whose frame navigated last (the measured load), by its navigationStart mark.
  const navs = events
    .filter((e) => e.name === 'navigationStart' && mainThreads.some((m) => m.pid === e.pid && m.tid === e.tid))
    .filter((e) => /^https?:/.test(str(data(e).documentLoaderURL)))
    .sort((a, b) => a.ts - b.ts);
  const nav = navs.at(-1);
  if (!nav) throw new Error('the trace has no navigationStart on a renderer main thread');
  const { pid, tid } = nav;
  const t0 = nav.ts;
  const at = (msAfter: number) => t0 + msAfter * 1000;
  const end = at(opts.endMs);
  const typed = at(opts.typedMs);
  const visible = at(opts.visibleMs);
  const minTask = (opts.minTaskMs ?? 50) * 1000;
  const keysFrom = at(opts.keysFromMs ?? opts.endMs);
  const mapper = new SourceMapper(opts.assetsDir ?? null);
  const samples = samplesOf(events, pid, tid, mapper);

  const onThread = events
    .filter(
      (e) =>
        e.pid === pid && e.tid === tid && e.ph === 'X' && e.dur !== undefined && e.ts + (e.dur ?? 0) > t0 && e.ts < end,
    )
    .sort((a, b) => a.ts - b.ts || (b.dur ?? 0) - (a.dur ?? 0));
  const tasks = onThread.filter((e) => e.name === 'RunTask' || e.name === 'ThreadControllerImpl::RunTask');
  // Nested RunTasks (a task inside a task) count once: keep the outermost.
  const top: TraceEvent[] = [];
  for (const t of tasks) {
    const last = top.at(-1);
    if (last && t.ts < last.ts + (last.dur ?? 0)) continue;
    top.push(t);
  }

  const kinds = new Map<string, number>();
  const longTasks: LongTask[] = [];
  let before = 0;
  let between = 0;
  let after = 0;
  for (const task of top) {
    const tEnd = task.ts + (task.dur ?? 0);
    // A task counts where it started (one straddling a mark is rare and short next to the windows).
    if (task.ts < t0) continue;
    if (task.ts < visible) before += cpu(task);
    else if (task.ts < typed) between += cpu(task);
    else if (task.ts < keysFrom) after += cpu(task);
    // The task's parts: the outermost described events inside it (an event inside a described one is its detail).
    const inside = onThread.filter((e) => e !== task && e.ts >= task.ts && e.ts + (e.dur ?? 0) <= tEnd);
    const parts = new Map<string, number>();
    let coveredUntil = 0;
    let explained = 0;
    const counts = task.ts < typed;
    for (const e of inside) {
      const what = describe(e);
      if (!what || e.ts < coveredUntil) continue;
      coveredUntil = e.ts + (e.dur ?? 0);
      parts.set(what, (parts.get(what) ?? 0) + cpu(e));
      if (counts) kinds.set(kindOf(what), (kinds.get(kindOf(what)) ?? 0) + cpu(e));
      explained += cpu(e);
    }
    const other = Math.max(0, cpu(task) - explained);
    if (counts) kinds.set('other browser work', (kinds.get('other browser work') ?? 0) + other);
    if ((task.dur ?? 0) < minTask) continue;
    if (other > 1) parts.set('other browser work', other);
    longTasks.push({
      startMs: (task.ts - t0) / 1000,
      ms: (task.dur ?? 0) / 1000,
      cpuMs: cpu(task),
      parts: [...parts].map(([what, ms]) => ({ what, ms })).sort((a, b) => b.ms - a.ms),
      sources: sourceTimes(samples, task.ts, tEnd),
    });
  }
  const keyTasksMs = top
    .filter((task) => task.ts >= keysFrom)
    .filter((task) =>
      onThread.some(
        (e) =>
          e.name === 'EventDispatch' &&
          str(data(e).type) === 'keypress' &&
          e.ts >= task.ts &&
          e.ts < task.ts + (task.dur ?? 0),
      ),
    )
    .map(cpu);
  return {
    keyTasksMs,
    visibleMs: opts.visibleMs,
    typedMs: opts.typedMs,
    busyBeforeVisibleMs: before,
    busyVisibleToTypedMs: between,
    busyAfterTypedMs: after,
    longTasks,
    byKind: [...kinds].map(([kind, ms]) => ({ kind, ms })).sort((a, b) => b.ms - a.ms),
    bySource: sourceTimes(samples, t0, typed),
  };
}

const ms = (n: number) => n.toFixed(0);
/** The middle value (the mean of the two middle ones for an even count); NaN for none. */
export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length === 0 ? Number.NaN : s.length % 2 ? (s[m] ?? Number.NaN) : ((s[m - 1] ?? 0) + (s[m] ?? 0)) / 2;
}

/** The summary as lines for the bench's output: every long task in order, marked before/after the field showed and the letter. */
export function formatTrace(label: string, s: TraceSummary): string[] {
  const long = (from: number, to: number) => s.longTasks.filter((t) => t.startMs >= from && t.startMs < to);
  const sum = (ts: readonly LongTask[]) => ms(ts.reduce((a, t) => a + t.cpuMs, 0));
  const lines = [
    `  ${label} trace (main-thread CPU ms at 4× slowdown; the field showed at ${ms(s.visibleMs)} ms, the letter arrived at ${ms(s.typedMs)} ms):`,
    `    busy ${ms(s.busyBeforeVisibleMs)} before the field showed (${sum(long(-Infinity, s.visibleMs))} in long tasks), ` +
      `${ms(s.busyVisibleToTypedMs)} between showing and taking the letter (${sum(long(s.visibleMs, s.typedMs))}), ` +
      `${ms(s.busyAfterTypedMs)} in the 3 s after (${sum(long(s.typedMs, Infinity))})`,
    `    until the letter, by kind: ${s.byKind
      .filter((k) => k.ms >= 5)
      .map((k) => `${k.kind} ${ms(k.ms)}`)
      .join(', ')}`,
    ...(s.keyTasksMs.length
      ? [
          `    each letter typed once the page settled: ${s.keyTasksMs.map(ms).join(' / ')} CPU ms in its task (median ${ms(median(s.keyTasksMs))})`,
        ]
      : []),
    `    until the letter, JavaScript by source (sampled): ${s.bySource
      .slice(0, 10)
      .map((k) => `${k.source} ${ms(k.ms)}`)
      .join(', ')}`,
  ];
  for (const t of s.longTasks) {
    const when = t.startMs < s.visibleMs ? 'before shown' : t.startMs < s.typedMs ? 'SHOWN→TYPED' : 'after typed';
    lines.push(
      `    ${ms(t.cpuMs).padStart(4)} CPU ms (${ms(t.ms)} on the clock) at +${ms(t.startMs)} (${when}): ${t.parts
        .slice(0, 4)
        .map((p) => `${p.what} ${ms(p.ms)}`)
        .join('; ')}` +
        (t.sources.length
          ? ` — JS: ${t.sources
              .slice(0, 5)
              .map((p) => `${p.source} ${ms(p.ms)}`)
              .join(', ')}`
          : ''),
    );
  }
  return lines;
}
