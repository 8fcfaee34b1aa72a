import { z } from 'zod';
import { photoResponse } from '@contract';
import { ANY_STAFF, JOB_EDITORS, NO_CONTENT, rawResponse, type ApiRouter } from '../../lib/route';
import { roomParams } from '../rooms/room.schema';
import { presentPhoto } from './photo.presenter';
import { addPhoto, deletePhoto, findPhoto, photoBytes } from './photo.service';
import { receiveUpload } from '../../lib/receive-upload';

const photoParams = roomParams.extend({ photoId: z.uuid({ message: 'Must be a photo id.' }) });

/** Mounted under /api/jobs. Bytes leave only through the GET below, after the same scope checks as the job. */
export function photoRoutes(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/:jobId/rooms/:roomId/photos',
    policy: JOB_EDITORS,
    params: roomParams,
    multipart: true,
    status: 201,
    response: photoResponse,
    handler: async ({ service, params, services, req, res }) => {
      const file = await receiveUpload(req, res, services.config.UPLOAD_MAX_BYTES);
      const photo = await addPhoto({ ...service, storage: services.storage }, params, file);
      return { photo: presentPhoto(photo, params.jobId, params.roomId) };
    },
  });
  api.route({
    method: 'get',
    path: '/:jobId/rooms/:roomId/photos/:photoId',
    policy: ANY_STAFF,
    params: photoParams,
    summary: 'The photo (JPEG, re-encoded without metadata)',
    response: rawResponse('image/jpeg'),
    handler: async ({ service, params, services, res }) => {
      const photo = await findPhoto(service, params);
      const bytes = await photoBytes(services.storage, photo);
      res
        .status(200)
        .setHeader('Content-Type', photo.contentType)
        .setHeader('X-Content-Type-Options', 'nosniff')
        .setHeader('Content-Disposition', `inline; filename="room-photo-${photo.id}.jpg"`)
        .setHeader('Cache-Control', 'private, max-age=300')
        .setHeader('Content-Length', String(bytes.length))
        .end(bytes);
      return undefined;
    },
  });
  api.route({
    method: 'delete',
    path: '/:jobId/rooms/:roomId/photos/:photoId',
    policy: JOB_EDITORS,
    params: photoParams,
    response: NO_CONTENT,
    handler: async ({ service, params, services }) => {
      await deletePhoto({ ...service, storage: services.storage }, params);
    },
  });
}
