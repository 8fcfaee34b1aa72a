import { useEffect, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { QueryWidgetBoundary } from '../../../components/errors/query-widget-boundary';
import { Alert } from '../../../components/ui/alert';
import { buttonClass } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { jobPaths } from '../../../entities/job/paths';
import { JOB_STATUSES, mayEditJob } from '@contract';
import { jobStatusLabels } from '../../../entities/job/labels';
import { useViewer } from '../../../lib/viewer';
import { OfflineNotice } from '../../../lib/offline/offline-notice';
import { useJobs } from '../api/get-jobs';
import { filtersFromSearch } from './jobs-filters';
import { JobsTable } from './jobs-table';

const field = 'block min-h-touch w-full rounded-md border border-line bg-white px-3 text-base';

/** /jobs: search by customer, address or status; newest activity first; paged on the server. */
export function JobsListPage({ waiting = 0 }: { waiting?: number }) {
  const [params, setParams] = useSearchParams();
  const filters = filtersFromSearch(params);
  const [typed, setTyped] = useState(filters.search);
  const viewer = useViewer();
  // Installers read the jobs assigned to them; starting one is for the people who sell (the contract's rule).
  const mayStart = viewer === null || mayEditJob(viewer.role);

  const update = (patch: Record<string, string>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(patch)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    setParams(next, { replace: true });
  };
  useEffect(() => {
    if (typed.trim() === filters.search) return;
    const t = setTimeout(() => update({ q: typed.trim(), page: '' }), 300);
    return () => clearTimeout(t);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [typed]);

  return (
    <div>
      <PageHeader
        title="Jobs"
        lead={
          mayStart
            ? 'Every job you can see, the most recently active first.'
            : 'The jobs assigned to you, the most recently active first.'
        }
        actions={
          mayStart ? (
            <Link className={buttonClass('primary')} to={jobPaths.new}>
              New job
            </Link>
          ) : undefined
        }
      />
      <div role="search" className="mb-4 grid gap-3 sm:grid-cols-[2fr_1fr]">
        <div className="flex flex-col gap-1">
          <label htmlFor="jobs-search" className="text-sm font-semibold text-ink-900">
            Search jobs
          </label>
          <input
            id="jobs-search"
            type="search"
            className={field}
            value={typed}
            onChange={(e) => setTyped(e.target.value)}
            placeholder="Customer, street, city or postal code"
          />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="jobs-status" className="text-sm font-semibold text-ink-900">
            Status
          </label>
          <select
            id="jobs-status"
            className={field}
            value={filters.status}
            onChange={(e) => update({ status: e.target.value, page: '' })}
          >
            <option value="">Any status</option>
            {JOB_STATUSES.map((s) => (
              <option key={s} value={s}>
                {jobStatusLabels[s]}
              </option>
            ))}
          </select>
        </div>
      </div>
      <QueryWidgetBoundary name="the job list">
        <JobsResults
          filters={filters}
          waiting={waiting}
          mayStart={mayStart}
          onPage={(page) => update({ page: page > 1 ? String(page) : '' })}
        />
      </QueryWidgetBoundary>
    </div>
  );
}

function JobsResults({
  filters,
  mayStart,
  waiting,
  onPage,
}: {
  filters: ReturnType<typeof filtersFromSearch>;
  mayStart: boolean;
  waiting: number;
  onPage: (page: number) => void;
}) {
  const jobs = useJobs(filters);
  // With no signal TanStack Query waits ("paused") instead of failing: say so instead of spinning.
  if (jobs.isPending && jobs.fetchStatus === 'paused')
    return (
      <Alert tone="warning" title="No signal">
        <p>
          This phone has not saved this list{filters.search || filters.status ? ' for this search' : ''} yet. It loads
          once the connection is back.
        </p>
        {waiting > 0 ? (
          <p>
            {waiting} {waiting === 1 ? 'change waits' : 'changes wait'} on this phone to be sent.
          </p>
        ) : null}
      </Alert>
    );
  if (jobs.isPending) return <Spinner label="Loading jobs…" />;
  if (jobs.isError)
    return (
      <Alert tone="danger" title="Could not load the jobs.">
        {errorMessage(jobs.error)}
      </Alert>
    );
  const { items, total, page, pageSize } = jobs.data;
  if (total === 0) {
    return (
      <EmptyState title={filters.search || filters.status ? 'No job matches' : 'No jobs yet'}>
        {filters.search || filters.status
          ? 'Try another search or status.'
          : mayStart
            ? 'Start one with “New job” when a customer calls.'
            : 'A job shows here once the office assigns it to you.'}
      </EmptyState>
    );
  }
  return (
    <>
      <OfflineNotice updatedAt={jobs.dataUpdatedAt} waiting={waiting} />
      <JobsTable jobs={items} total={total} page={page} pageSize={pageSize} onPage={onPage} />
    </>
  );
}
