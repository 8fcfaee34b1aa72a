import type { HomeLoad } from '@calc';
import { isApiError } from '../../../lib/api-error';
import { useServerLoads } from '../api/get-server-loads';
import { compareLoads } from '../model/compare';

/** A small note under the totals: the server recomputed the same saved inputs — do the numbers agree? */
export function ServerCheck({ jobId, jobVersion, browser }: { jobId: string; jobVersion: number; browser: HomeLoad }) {
  const server = useServerLoads(jobId);
  if (server.isPending)
    return (
      <p role="status" className="text-sm text-muted">
        Checking against the server…
      </p>
    );
  if (server.isError) {
    const offline = isApiError(server.error) && server.error.code === 'network';
    return (
      <p role="status" className="text-sm text-muted">
        {offline
          ? 'Not checked against the server: no connection. These are the browser’s numbers.'
          : `Not checked against the server: ${server.error.message}`}
      </p>
    );
  }
  const mismatches = compareLoads(browser, server.data);
  const stale = server.data.jobVersion !== jobVersion;
  if (mismatches.length === 0) {
    return (
      <p role="status" className="text-sm text-ok">
        ✓ Checked against server: the server’s recalculation gives the same numbers.
      </p>
    );
  }
  return (
    <div role="alert" className="rounded-md border-l-4 border-amber-line bg-amber-soft px-3 py-2 text-sm text-ink-950">
      <p className="font-semibold text-amber-deep">
        The server’s numbers differ from the browser’s{stale ? ' (the job changed since; refresh to recheck)' : ''}:
      </p>
      <ul className="list-disc pl-5">
        {mismatches.map((m) => (
          <li key={m.what}>
            {m.what}: browser {m.browser.toLocaleString('en-US')}, server {m.server.toLocaleString('en-US')}
          </li>
        ))}
      </ul>
      <p>The server’s figures are the ones a proposal will use.</p>
    </div>
  );
}
