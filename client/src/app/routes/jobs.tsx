import { JobsListPage } from '../../features/jobs/components/jobs-list-page';
import { useQueueState } from '../../features/walkthrough/sync/queue-context';

/** /jobs, told how many walk-through changes wait on this device (said with no signal); loader: app/job-route-loaders.ts. */
export default function JobsRoute() {
  return <JobsListPage waiting={useQueueState().items.length} />;
}
