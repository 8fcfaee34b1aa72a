import { useParams } from 'react-router-dom';
import { z } from 'zod';
import { WalkthroughView } from './walkthrough-view';

export const jobParams = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/** Route component for /jobs/:jobId. */
export function WalkthroughPage() {
  const { jobId } = jobParams.parse(useParams());
  return <WalkthroughView jobId={jobId} />;
}
