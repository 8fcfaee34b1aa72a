import { roomsPath } from '../../../lib/job-queries';
import { roomResponse } from '../../../lib/job-records';
import { versionedFetch } from '../../../lib/versioned-request';
import type { RoomInputValue } from '../sync/edits';

/** POST /api/jobs/:jobId/rooms — the id is made on the phone so an offline create replays safely. */
export async function createRoom(jobId: string, body: { id: string; position: number; input: RoomInputValue }) {
  return (await versionedFetch(roomsPath(jobId), { method: 'POST', body, schema: roomResponse })).room;
}
