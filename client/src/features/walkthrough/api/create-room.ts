import { apiFetch } from '../../../lib/api-client';
import { roomsPath } from '../../../entities/job/paths';
import { roomResponse } from '@contract';
import type { RoomInputValue } from '../sync/edits';

/** POST /api/jobs/:jobId/rooms — the id is made on the phone so an offline create replays safely. */
export async function createRoom(
  jobId: string,
  body: { id: string; position: number; input: RoomInputValue },
  person?: string,
) {
  return (await apiFetch(roomsPath(jobId), { method: 'POST', body, person, schema: roomResponse })).room;
}
