import type { QueryClient } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { jobKeys } from '../../../lib/job-queries';
import type { JobRecord, RoomRecord } from '../../../lib/job-records';
import type { SendResult } from '../../../lib/offline-queue';
import { createRoom } from '../api/create-room';
import { deleteRoom } from '../api/delete-room';
import { getRoom } from '../api/get-room';
import { updateJob } from '../api/update-job';
import { updateRoom } from '../api/update-room';
import type { WalkthroughItem } from './edits';

function putRoom(queryClient: QueryClient, room: RoomRecord): void {
  queryClient.setQueryData<RoomRecord[]>(jobKeys.rooms(room.jobId), (rooms) => {
    if (!rooms) return [room];
    return rooms.some((r) => r.id === room.id) ? rooms.map((r) => (r.id === room.id ? room : r)) : [...rooms, room];
  });
}

function afterWrite(queryClient: QueryClient, jobId: string): void {
  // The server's loads and the jobs list (last activity) are now out of date; refetch lazily.
  void queryClient.invalidateQueries({ queryKey: jobKeys.serverLoads(jobId) });
  void queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
}

function failure(e: unknown): SendResult {
  if (isApiError(e)) {
    if (e.code === 'network' || e.status === 0) return { kind: 'network' };
    // 428 means the edit carried no version: never drop it, ask the person as for a 409.
    if (e.status === 409 || e.status === 428) return { kind: 'conflict' };
    if (e.status === 401) return { kind: 'blocked', message: 'Your session has ended. Sign in again (in another tab keeps this page); your changes stay on this device until then.' };
    // 5xx may pass; keep the edit and try again later rather than lose it.
    if (e.status >= 500 || e.status === 429) return { kind: 'network' };
    const fields = e.errors.map((f) => f.message).join(' ');
    return { kind: 'rejected', message: fields ? `${e.detail} ${fields}` : e.detail };
  }
  return { kind: 'network' };
}

/** Sends one queued edit and puts the server's answer into the query cache. */
export function createEditSender(queryClient: QueryClient) {
  return async (item: WalkthroughItem): Promise<SendResult> => {
    const edit = item.payload;
    try {
      if (edit.kind === 'room-create') {
        const room = await createRoom(edit.jobId, { id: edit.roomId, position: edit.position, input: edit.input }).catch(async (e: unknown) => {
          // A replayed create whose first answer was lost: the room is already there.
          if (isApiError(e) && e.status === 409) return getRoom(edit.jobId, edit.roomId);
          throw e;
        });
        putRoom(queryClient, room);
        afterWrite(queryClient, edit.jobId);
        return { kind: 'ok', version: room.version };
      }
      if (edit.kind === 'room-update') {
        const room = await updateRoom(edit.jobId, edit.roomId, item.baseVersion, edit.input);
        putRoom(queryClient, room);
        afterWrite(queryClient, edit.jobId);
        return { kind: 'ok', version: room.version };
      }
      if (edit.kind === 'room-delete') {
        await deleteRoom(edit.jobId, edit.roomId, item.baseVersion).catch((e: unknown) => {
          if (!(isApiError(e) && e.status === 404)) throw e;
        });
        queryClient.setQueryData<RoomRecord[]>(jobKeys.rooms(edit.jobId), (rooms) => rooms?.filter((r) => r.id !== edit.roomId));
        afterWrite(queryClient, edit.jobId);
        return { kind: 'ok', version: null };
      }
      const job = await updateJob(edit.jobId, item.baseVersion, edit.changes);
      queryClient.setQueryData<JobRecord>(jobKeys.detail(job.id), job);
      afterWrite(queryClient, edit.jobId);
      return { kind: 'ok', version: job.version };
    } catch (e) {
      return failure(e);
    }
  };
}
