import { z } from 'zod';
import { roomPath } from '../../../lib/job-queries';
import { versionedFetch } from '../../../lib/versioned-request';

/** DELETE /api/jobs/:jobId/rooms/:roomId, If-Match: the version the person saw. */
export async function deleteRoom(jobId: string, roomId: string, version: number | null) {
  await versionedFetch(roomPath(jobId, roomId), { method: 'DELETE', version, schema: z.undefined() });
}
