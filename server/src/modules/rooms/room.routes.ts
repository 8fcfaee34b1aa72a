import { ANY_STAFF, JOB_EDITORS, type ApiRouter } from '../../lib/route';
import { ifMatchVersion, setEtag } from '../jobs/version-lock';
import { presentRoom } from './room.presenter';
import { listRoomViews, updateRoomIfCurrent } from './room-reads';
import { createRoomSchema, jobRoomsParams, roomParams, updateRoomSchema } from './room.schema';
import { createRoom, deleteRoom, getRoom, updateRoom } from './room.service';

/** Mounted under /api/jobs: rooms are always reached through a job the actor may see. */
export function roomRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/:jobId/rooms',
    policy: ANY_STAFF,
    params: jobRoomsParams,
    handler: async ({ em, actor, params }) => ({
      rooms: (await listRoomViews(em, actor, params.jobId)).map((r) => presentRoom(r.room, params.jobId, r.photos)),
    }),
  });
  api.route({
    method: 'get',
    path: '/:jobId/rooms/:roomId',
    policy: ANY_STAFF,
    params: roomParams,
    handler: async ({ em, actor, params, res }) => {
      const r = await getRoom(em, actor, params.jobId, params.roomId);
      setEtag(res, r.room.version);
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
    handler: async ({ em, actor, params, body, services, res }) => {
      const r = await createRoom(em, actor, services.clock, params.jobId, body);
      setEtag(res, r.room.version);
      return { room: presentRoom(r.room, params.jobId, r.photos) };
    },
  });
  api.route({
    method: 'patch',
    path: '/:jobId/rooms/:roomId',
    policy: JOB_EDITORS,
    params: roomParams,
    body: updateRoomSchema,
    handler: async ({ em, actor, params, body, services, req, res }) => {
      const version = ifMatchVersion(req);
      const r =
        (await updateRoomIfCurrent(em, actor, services.clock.now(), params.jobId, params.roomId, version, body)) ??
        (await updateRoom(em, actor, services.clock, params.jobId, params.roomId, version, body));
      setEtag(res, r.room.version);
      return { room: presentRoom(r.room, params.jobId, r.photos) };
    },
  });
  api.route({
    method: 'delete',
    path: '/:jobId/rooms/:roomId',
    policy: JOB_EDITORS,
    params: roomParams,
    handler: async ({ em, actor, params, services, req, res }) => {
      await deleteRoom(em, actor, services.clock, services.storage, params.jobId, params.roomId, ifMatchVersion(req));
      res.status(204).end();
      return undefined;
    },
  });
}
