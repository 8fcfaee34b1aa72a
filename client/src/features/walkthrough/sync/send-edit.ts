import type { QueryClient } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { jobKeys } from '../../../entities/job/query-keys';
import { customerQueryOptions, getCustomer, getJob, roomsQueryOptions } from '../../../entities/job/queries';
import type { SendResult } from '../../../lib/offline/queue';
import { OTHER_PERSON, sendFailure as failure } from '../../../lib/offline/send-failure';
import type { JobRecord, RoomRecord } from '@contract';
import { createRoom } from '../api/create-room';
import { deleteRoom } from '../api/delete-room';
import { getRoom } from '../api/get-room';
import { saveCustomer, updateJob } from '../../../entities/job/requests';
import { updateRoom } from '../api/update-room';
import type { WalkthroughItem } from './edits';
import { customerHolds, jobHolds, roomHolds } from './settle-replay';

type RoomsChange = (rooms: RoomRecord[]) => RoomRecord[];

/**
 * Lays a write's answer over the rooms list the screen holds, so that no fetch answered before
 * the write can put the older list back (a new room missing, a deleted one still there):
 * - a list is held: a refetch still on its way is cancelled first, then the answer goes in;
 * - no list yet (or its first fetch is on its way): the answer waits for the server's whole
 *   list instead of making up a list of one room, then goes in.
 */
async function changeRooms(queryClient: QueryClient, jobId: string, change: RoomsChange): Promise<void> {
  const key = jobKeys.rooms(jobId);
  const apply = () => queryClient.setQueryData<RoomRecord[]>(key, (rooms) => (rooms ? change(rooms) : rooms));
  if (queryClient.getQueryData(key) === undefined) {
    void queryClient.fetchQuery(roomsQueryOptions(jobId)).then(apply, () => undefined);
    return;
  }
  await queryClient.cancelQueries({ queryKey: key, exact: true });
  apply();
}

/** The room as the server answered, unless the list already holds a newer version of it. */
const withRoom =
  (room: RoomRecord): RoomsChange =>
  (rooms) => {
    const held = rooms.find((r) => r.id === room.id);
    if (!held) return [...rooms, room];
    return held.version > room.version ? rooms : rooms.map((r) => (r.id === room.id ? room : r));
  };

function afterWrite(queryClient: QueryClient, jobId: string): void {
  // The server's loads and the jobs list (last activity) are now out of date; refetch lazily.
  void queryClient.invalidateQueries({ queryKey: jobKeys.serverLoads(jobId) });
  void queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
}

export { OTHER_PERSON };

const isConflict = (e: unknown) => isApiError(e) && e.status === 409;

/**
 * After a 409, the record as it is now when it already holds every value the edit writes (a
 * replay of a write whose answer was lost): settled without asking. Otherwise the 409 stands.
 */
async function heldAlready<T>(e: unknown, read: () => Promise<T>, holds: (record: T) => boolean): Promise<T> {
  if (!isConflict(e)) throw e;
  const record = await read().catch(() => null);
  if (record !== null && holds(record)) return record;
  throw e;
}

/**
 * Sends one queued edit and puts the server's answer into the query cache. `person` (the user id
 * whose queue this is) goes with every write, so the server refuses it under anyone else's session.
 */
export function createEditSender(queryClient: QueryClient, person?: string) {
  return async (item: WalkthroughItem): Promise<SendResult> => {
    const edit = item.payload;
    try {
      if (edit.kind === 'room-create') {
        const room = await createRoom(
          edit.jobId,
          {
            id: edit.roomId,
            position: edit.position,
            input: edit.input,
          },
          person,
        ).catch(async (e: unknown) => {
          // A replayed create whose first answer was lost: the room is already there.
          if (isApiError(e) && e.status === 409) return getRoom(edit.jobId, edit.roomId);
          throw e;
        });
        await changeRooms(queryClient, edit.jobId, withRoom(room));
        afterWrite(queryClient, edit.jobId);
        return { kind: 'ok', version: room.version };
      }
      if (edit.kind === 'room-update') {
        const room = await updateRoom(edit.jobId, edit.roomId, item.baseVersion, edit.input, person).catch(
          (e: unknown) =>
            heldAlready(
              e,
              () => getRoom(edit.jobId, edit.roomId),
              (r) => roomHolds(r, edit.input),
            ),
        );
        await changeRooms(queryClient, edit.jobId, withRoom(room));
        afterWrite(queryClient, edit.jobId);
        return { kind: 'ok', version: room.version };
      }
      if (edit.kind === 'room-delete') {
        await deleteRoom(edit.jobId, edit.roomId, item.baseVersion, person).catch((e: unknown) => {
          if (!(isApiError(e) && e.status === 404)) throw e;
        });
        await changeRooms(queryClient, edit.jobId, (rooms) => rooms.filter((r) => r.id !== edit.roomId));
        afterWrite(queryClient, edit.jobId);
        return { kind: 'ok', version: null };
      }
      if (edit.kind === 'customer-update') {
        const customer = await saveCustomer(edit.customerId, item.baseVersion, edit.changes, person).catch(
          (e: unknown) =>
            heldAlready(
              e,
              () => getCustomer(edit.customerId),
              (c) => customerHolds(c, edit.changes),
            ),
        );
        queryClient.setQueryData(customerQueryOptions(customer.id).queryKey, customer);
        // The job's header and the jobs list show the customer's name.
        void queryClient.invalidateQueries({ queryKey: jobKeys.detail(edit.jobId), exact: true });
        void queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
        return { kind: 'ok', version: customer.version };
      }
      const job = await updateJob(edit.jobId, item.baseVersion, edit.changes, person).catch((e: unknown) =>
        heldAlready(
          e,
          () => getJob(edit.jobId),
          (j) => jobHolds(j, edit.changes),
        ),
      );
      queryClient.setQueryData<JobRecord>(jobKeys.detail(job.id), job);
      afterWrite(queryClient, edit.jobId);
      return { kind: 'ok', version: job.version };
    } catch (e) {
      return failure(e);
    }
  };
}
