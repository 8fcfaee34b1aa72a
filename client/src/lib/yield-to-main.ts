/**
 * Gives the browser the main thread for a moment (a keystroke, a frame) and resumes after it: the
 * Prioritized Task Scheduling API's scheduler.yield() where the browser has it (the rest of the work
 * keeps its place in line), else a new task. For long work split into slices (issue 11: on a slow phone
 * a letter typed while one long task runs waits for all of it).
 */
interface YieldingScheduler {
  yield(): Promise<void>;
}

export function yieldToMain(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: Partial<YieldingScheduler> }).scheduler;
  if (typeof scheduler?.yield === 'function') return scheduler.yield();
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * Runs `step` for each item, handing the main thread back whenever a slice has run `sliceMs`; resolves
 * when all are done, or early (false) once `stillWanted` says the work is no longer needed.
 */
export async function inSlices<T>(
  items: Iterable<T>,
  step: (item: T) => void,
  { sliceMs = 8, stillWanted = () => true }: { sliceMs?: number; stillWanted?: () => boolean } = {},
): Promise<boolean> {
  let start = performance.now();
  for (const item of items) {
    if (performance.now() - start >= sliceMs) {
      await yieldToMain();
      if (!stillWanted()) return false;
      start = performance.now();
    }
    step(item);
  }
  return true;
}
