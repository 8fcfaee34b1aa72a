import { roomPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';

/** DELETE /api/jobs/:jobId/rooms/:roomId, If-Match: the version the person saw. */
export async function deleteRoom(jobId: string, roomId: string, version: number | null, person?: string) {
  await apiFetch(roomPath(jobId, roomId), { method: 'DELETE', version, person });
}
