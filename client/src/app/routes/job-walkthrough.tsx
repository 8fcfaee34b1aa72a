import { lazy, Suspense } from 'react';
import { QueryWidgetBoundary } from '../../components/errors/query-widget-boundary';
import { useParams } from 'react-router-dom';
import { z } from 'zod';
import { JobEditsProvider } from '../../entities/job/job-edits';
import { useAfterIdle } from '../../lib/use-after-idle';
import { WalkthroughView } from '../../features/walkthrough/components/walkthrough-view';
import { useWalkthroughJobEdits } from '../../features/walkthrough/sync/job-edits';

// Folded under the walk-through and not needed to start typing a room: it loads after the page (issue 11).
const JobDetailsPanel = lazy(async () => ({
  default: (await import('../../features/jobs/components/job-details-panel')).JobDetailsPanel,
}));

// After the rooms, on the phone: the salesperson's first price (desk feature), loaded after the page.
const FirstPrice = lazy(async () => ({
  default: (await import('../../features/desk/components/first-price')).FirstPrice,
}));

const jobParams = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/**
 * One job's walk-through with the job's own details (status moves, contact, site, people, delete)
 * folded above it; the details write through the walk-through's queue (entities/job/job-edits.tsx).
 */
export function JobWalkthrough({ jobId }: { jobId: string }) {
  return (
    <JobEditsProvider useEdits={useWalkthroughJobEdits}>
      <WalkthroughView jobId={jobId} jobDetails={(job) => <JobDetailsPanel job={job} />} />
    </JobEditsProvider>
  );
}

/** /jobs/:jobId — the walk-through, then the first price; the loader is in app/job-route-loaders.ts. */
export default function JobWalkthroughRoute() {
  const { jobId } = jobParams.parse(useParams());
  // The first price (its code, its schemas and the desk it reads) comes once the rooms take typing (issue 11).
  const firstPriceNow = useAfterIdle();
  return (
    <>
      <JobWalkthrough jobId={jobId} />
      {firstPriceNow ? (
        <QueryWidgetBoundary name="the first price">
          <Suspense fallback={null}>
            <FirstPrice jobId={jobId} />
          </Suspense>
        </QueryWidgetBoundary>
      ) : null}
    </>
  );
}
