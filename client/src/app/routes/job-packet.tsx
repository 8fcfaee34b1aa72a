import { useParams } from 'react-router-dom';
import { z } from 'zod';
import { PacketPage } from '../../features/install/components/packet-page';

const params = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/** /jobs/:jobId/packet — the installer's job packet (loader in job-routes.tsx: the packet query). */
export default function JobPacketRoute() {
  const { jobId } = params.parse(useParams());
  return <PacketPage jobId={jobId} />;
}
