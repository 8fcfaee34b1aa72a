import { LoadsPage } from '../../features/loads/components/loads-page';
import { useQueueState } from '../../features/walkthrough/sync/queue-context';

/** /jobs/:jobId/loads, told how many walk-through changes wait on this device; loader: app/job-route-loaders.ts. */
export default function JobLoadsRoute() {
  return <LoadsPage waiting={useQueueState().items.length} />;
}
