import type { QueryClient } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { jobKeys } from '../../../entities/job/query-keys';
import type { QueueState } from '../../../lib/offline/queue';
import type { RoomRecord } from '@contract';
import { uploadPhoto } from '../api/upload-photo';
import type { WalkthroughEdit } from './edits';
import type { FileSendResult } from '../../../lib/offline/file-queue';
import type { WaitingFile } from '../../../lib/offline/file-storage';

/**
 * The rooms cache holds only what the server returned, so a room in it has been created there.
 * A room missing from a loaded list with no create of it waiting is gone (deleted elsewhere, its
 * create refused): sending then lets the server's 404 tell the person, instead of the photo
 * waiting for ever. Until the edit queue has loaded, a waiting create cannot be ruled out.
 */
export function roomOnServer(queryClient: QueryClient, edits?: { getSnapshot(): QueueState<WalkthroughEdit> }) {
  return (jobId: string, roomId: string): boolean => {
    const rooms = queryClient.getQueryData<RoomRecord[]>(jobKeys.rooms(jobId));
    if (rooms?.some((r) => r.id === roomId)) return true;
    if (!rooms || !edits) return false;
    const { loaded, items } = edits.getSnapshot();
    return loaded && !items.some(({ payload: e }) => e.kind === 'room-create' && e.roomId === roomId);
  };
}

function failure(e: unknown): FileSendResult {
  if (!isApiError(e) || e.status === 0) return { kind: 'keep' };
  // 5xx may pass, 429 will; 401 means sign in again — the photo must not be lost meanwhile.
  // 403 other-person: someone else signed in on this device; the photo waits for its taker.
  if (e.status >= 500 || e.status === 429 || e.status === 401 || e.code === 'other-person' || e.code === 'api-version')
    return { kind: 'keep' };
  return { kind: 'refused', message: e.detail };
}

/** Uploads one waiting photo and puts the server's record into the room, so its thumbnail replaces the local one. */
export function createPhotoSender(queryClient: QueryClient, person?: string) {
  return async (waiting: WaitingFile): Promise<FileSendResult> => {
    try {
      const photo = await uploadPhoto({ ...waiting, person });
      queryClient.setQueryData<RoomRecord[]>(jobKeys.rooms(waiting.jobId), (rooms) =>
        rooms?.map((r) => (r.id === waiting.roomId ? { ...r, photos: [...r.photos, photo] } : r)),
      );
      // The job's last activity moved; the list refetches when next shown.
      void queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
      return { kind: 'ok' };
    } catch (e) {
      return failure(e);
    }
  };
}
