import { roomPath } from '../../../lib/job-queries';
import { roomResponse } from '../../../lib/job-records';
import { versionedFetch } from '../../../lib/versioned-request';
import type { RoomInputValue } from '../sync/edits';

/** PATCH /api/jobs/:jobId/rooms/:roomId, If-Match: the version the person edited. */
export async function updateRoom(jobId: string, roomId: string, version: number | null, input: RoomInputValue) {
  return (
    await versionedFetch(roomPath(jobId, roomId), { method: 'PATCH', version, body: { input }, schema: roomResponse })
  ).room;
}
