import { apiFetch } from '../../../lib/api-client';
import { roomPath } from '../../../entities/job/paths';
import { roomResponse } from '@contract';
import type { RoomInputValue } from '../sync/edits';

/** PATCH /api/jobs/:jobId/rooms/:roomId, If-Match: the version the person edited. */
export async function updateRoom(
  jobId: string,
  roomId: string,
  version: number | null,
  input: RoomInputValue,
  person?: string,
) {
  return (
    await apiFetch(roomPath(jobId, roomId), { method: 'PATCH', version, body: { input }, person, schema: roomResponse })
  ).room;
}
