import { randomUUID } from 'node:crypto';
import { NotFoundError, UnprocessableError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import type { Storage } from '../../services/storage';
import { touchJob } from '../jobs/job-access';
import { findRoom } from '../rooms/room.service';
import { UserSchema } from '../users/user.entity';
import { cleanPhoto, displayName } from './image';
import { PhotoSchema, type Photo } from './photo.entity';

const MAX_PHOTOS_PER_ROOM = 40;

/** Photo writes also need the file storage. */
export interface PhotoContext extends ServiceContext {
  readonly storage: Storage;
}

export interface PhotoIds {
  jobId: string;
  roomId: string;
}

/** Cleans the image, stores the bytes under a fresh uuid, then records the row (removing the file if that fails). */
export async function addPhoto(
  ctx: PhotoContext,
  ids: PhotoIds,
  file: { buffer: Buffer; originalname: string },
): Promise<Photo> {
  const { em, actor, clock, storage } = ctx;
  const { job, room } = await findRoom(ctx, ids.jobId, ids.roomId);
  if ((await em.count(PhotoSchema, { room: room.id })) >= MAX_PHOTOS_PER_ROOM) {
    throw new UnprocessableError(`A room can have at most ${MAX_PHOTOS_PER_ROOM} photos.`);
  }
  const clean = await cleanPhoto(file.buffer);
  const storageKey = randomUUID();
  await storage.put(storageKey, clean.bytes, clean.contentType);
  try {
    return await em.transactional(async (tx) => {
      const photo = tx.create(PhotoSchema, {
        room: room.id,
        storageKey,
        contentType: clean.contentType,
        byteSize: clean.bytes.length,
        width: clean.width,
        height: clean.height,
        originalName: displayName(file.originalname),
        uploadedBy: tx.getReference(UserSchema, actor.userId),
      });
      await tx.flush();
      await touchJob(tx, job.id, clock.now());
      return photo;
    });
  } catch (e) {
    await storage.delete(storageKey).catch(() => undefined);
    throw e;
  }
}

export async function findPhoto(ctx: ServiceContext, ids: PhotoIds & { photoId: string }): Promise<Photo> {
  const { em } = ctx;
  const { room } = await findRoom(ctx, ids.jobId, ids.roomId);
  const photo = await em.findOne(PhotoSchema, { id: ids.photoId, room: room.id });
  if (!photo) throw new NotFoundError('The photo');
  return photo;
}

export async function photoBytes(storage: Storage, photo: Photo): Promise<Buffer> {
  const bytes = await storage.get(photo.storageKey);
  if (!bytes) throw new NotFoundError('The photo file');
  return bytes;
}

export async function deletePhoto(ctx: PhotoContext, ids: PhotoIds & { photoId: string }): Promise<void> {
  const { em, clock, storage } = ctx;
  const photo = await findPhoto(ctx, ids);
  await em.transactional(async (tx) => {
    await tx.nativeDelete(PhotoSchema, { id: photo.id });
    await touchJob(tx, ids.jobId, clock.now());
  });
  await storage.delete(photo.storageKey).catch(() => undefined);
}
