import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { z } from 'zod';
import { companySettingsQueryOptions, jobQueryOptions, roomsQueryOptions } from '../../../lib/job-queries';
import { WalkthroughView } from './walkthrough-view';

export const jobParams = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/** Route component for /jobs/:jobId: the job and its rooms from the server, the queue laid over them. */
export function WalkthroughPage() {
  const { jobId } = jobParams.parse(useParams());
  const job = useSuspenseQuery(jobQueryOptions(jobId)).data;
  const rooms = useSuspenseQuery(roomsQueryOptions(jobId)).data;
  // Settings only change units and defaults; the walk-through works without them.
  const settings = useQuery(companySettingsQueryOptions()).data ?? null;
  return <WalkthroughView job={job} rooms={rooms} settings={settings} />;
}
