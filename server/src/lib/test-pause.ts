import { renameSync, writeFileSync } from 'node:fs';

/**
 * Test-only stopping points for the fault tests (tests/server/process-kill.test.ts). A process started with
 * NODE_ENV=test and GAUGELINE_TEST_PAUSE=<point>:<file>, on reaching <point>, writes what it is in the
 * middle of (JSON: its pid and the point's facts) to <file> and waits there, so the test can kill it with
 * SIGKILL at a known place. It waits at most a minute, then carries on as usual. Without both variables
 * (production runs with NODE_ENV=production) it returns at once and `facts` is never called.
 *
 * Points: 'issue-before-commit' — issuing a proposal version, everything written, the transaction not yet
 * committed; 'render-pdf' — a version's PDF render begun (pdf_state 'rendering'), nothing stored yet.
 */
export type PausePoint = 'issue-before-commit' | 'render-pdf';

const WAIT_MS = 60_000;

export async function testPause(point: PausePoint, facts: () => Promise<Record<string, unknown>>): Promise<void> {
  const setting = process.env.GAUGELINE_TEST_PAUSE;
  if (process.env.NODE_ENV !== 'test' || !setting) return;
  const at = setting.indexOf(':');
  if (setting.slice(0, at) !== point) return;
  const file = setting.slice(at + 1);
  // Written whole, then renamed: the test never reads half a file.
  writeFileSync(`${file}.part`, JSON.stringify({ pid: process.pid, point, ...(await facts()) }));
  renameSync(`${file}.part`, file);
  await new Promise((resolve) => setTimeout(resolve, WAIT_MS));
}
