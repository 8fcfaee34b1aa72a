import { apiFetch } from '../../../lib/api-client';
import { roomPath } from '../../../entities/job/paths';
import { roomResponse } from '@contract';

/** GET /api/jobs/:jobId/rooms/:roomId — the room as it is now (read after a conflict). */
export async function getRoom(jobId: string, roomId: string) {
  return (await apiFetch(roomPath(jobId, roomId), { schema: roomResponse })).room;
}
