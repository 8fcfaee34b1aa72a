import { roomResponse, roomsResponse } from '@contract';
import { ANY_STAFF, JOB_EDITORS, NO_CONTENT, type ApiRouter } from '../../lib/route';
import { presentRoom } from './room.presenter';
import { listRoomViews, updateRoomIfCurrent } from './room-reads';
import { createRoomSchema, jobRoomsParams, roomParams, updateRoomSchema } from './room.schema';
import { createRoom, deleteRoom, getRoom, updateRoom } from './room.service';

const etag = (out: { room: { version: number } }) => out.room.version;

/** Mounted under /api/jobs: rooms are always reached through a job the actor may see. */
export function roomRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/rooms',
    policy: ANY_STAFF,
    params: jobRoomsParams,
    response: roomsResponse,
    handler: async ({ service, params }) => ({
      rooms: (await listRoomViews(service, params.jobId)).map((r) => presentRoom(r.room, params.jobId, r.photos)),
    }),
  });
  api.route({
    method: 'get',
    path: '/:jobId/rooms/:roomId',
    policy: ANY_STAFF,
    params: roomParams,
    response: roomResponse,
    versioned: etag,
    handler: async ({ service, params }) => {
      const r = await getRoom(service, params.jobId, params.roomId);
      return { room: presentRoom(r.room, params.jobId, r.photos) };
    },
  });
  api.route({
    method: 'post',
    path: '/:jobId/rooms',
    policy: JOB_EDITORS,
    params: jobRoomsParams,
    body: createRoomSchema,
    status: 201,
    response: roomResponse,
    versioned: etag,
    handler: async ({ service, params, body }) => {
      const r = await createRoom(service, params.jobId, body);
      return { room: presentRoom(r.room, params.jobId, r.photos) };
    },
  });
  api.route({
    method: 'patch',
    path: '/:jobId/rooms/:roomId',
    policy: JOB_EDITORS,
    params: roomParams,
    body: updateRoomSchema,
    response: roomResponse,
    versioned: etag,
    handler: async ({ service, params, body, ifMatch }) => {
      const r =
        (await updateRoomIfCurrent(service, params.jobId, params.roomId, ifMatch, body)) ??
        (await updateRoom(service, params.jobId, params.roomId, ifMatch, body));
      return { room: presentRoom(r.room, params.jobId, r.photos) };
    },
  });
  api.route({
    method: 'delete',
    path: '/:jobId/rooms/:roomId',
    policy: JOB_EDITORS,
    params: roomParams,
    response: NO_CONTENT,
    versioned: true,
    handler: async ({ service, params, services, ifMatch }) => {
      await deleteRoom({ ...service, storage: services.storage }, params.jobId, params.roomId, ifMatch);
    },
  });
}
