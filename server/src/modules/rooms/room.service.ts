import type { EntityManager } from '@mikro-orm/postgresql';
import { randomUUID } from 'node:crypto';
import { NotFoundError, UnprocessableError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import type { Storage } from '../../services/storage';
import { isDeepStrictEqual } from 'node:util';
import { findJob, touchJob, touchJobLoads } from '../jobs/job-access';
import type { Job } from '../jobs/job.entity';
import { assertVersion } from '../../lib/version-lock';
import { stampOf } from '../../lib/change-stamp';
import { PhotoSchema, type Photo } from '../photos/photo.entity';
import { RoomSchema, type RoomRow } from './room.entity';
import { presentRoom } from './room.presenter';
import type { CreateRoomInput, UpdateRoomInput } from './room.schema';

/** calc's home schema takes at most 200 rooms. */
const MAX_ROOMS = 200;

export interface RoomWithPhotos {
  room: RoomRow;
  photos: Photo[];
}

export async function roomsOf(em: EntityManager, job: Job): Promise<RoomWithPhotos[]> {
  const rooms = await em.find(
    RoomSchema,
    { job: job.id },
    { orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } },
  );
  const photos = rooms.length
    ? await em.find(
        PhotoSchema,
        { room: { $in: rooms.map((r) => r.id) } },
        { orderBy: { createdAt: 'asc', id: 'asc' } },
      )
    : [];
  return rooms.map((room) => ({ room, photos: photos.filter((p) => p.room.id === room.id) }));
}

/** A room of a job the actor may see; 404 otherwise (inside a transaction: `{ ...ctx, em: tx }`). */
export async function findRoom(
  ctx: ServiceContext,
  jobId: string,
  roomId: string,
): Promise<{ job: Job; room: RoomRow }> {
  const { em } = ctx;
  const job = await findJob(ctx, jobId);
  const room = await em.findOne(RoomSchema, { id: roomId, job: job.id });
  if (!room) throw new NotFoundError('The room');
  return { job, room };
}

export async function getRoom(ctx: ServiceContext, jobId: string, roomId: string): Promise<RoomWithPhotos> {
  const { room } = await findRoom(ctx, jobId, roomId);
  return {
    room,
    photos: await ctx.em.find(PhotoSchema, { room: room.id }, { orderBy: { createdAt: 'asc', id: 'asc' } }),
  };
}

export function createRoom(ctx: ServiceContext, jobId: string, input: CreateRoomInput): Promise<RoomWithPhotos> {
  return ctx.em.transactional(async (tx) => {
    const job = await findJob({ ...ctx, em: tx }, jobId);
    const count = await tx.count(RoomSchema, { job: job.id });
    if (count >= MAX_ROOMS) throw new UnprocessableError(`A job can have at most ${MAX_ROOMS} rooms.`);
    const id = input.id ?? randomUUID();
    const room = tx.create(RoomSchema, {
      id,
      job,
      position: input.position ?? count,
      input: { ...input.input, id },
      ...stampOf(ctx.actor),
    });
    await tx.flush();
    await touchJobLoads(tx, job.id, ctx.clock.now());
    return { room, photos: [] };
  });
}

export function updateRoom(
  ctx: ServiceContext,
  jobId: string,
  roomId: string,
  version: number,
  input: UpdateRoomInput,
): Promise<RoomWithPhotos> {
  return ctx.em.transactional(async (tx) => {
    const { job, room } = await findRoom({ ...ctx, em: tx }, jobId, roomId);
    const photos = await tx.find(PhotoSchema, { room: room.id }, { orderBy: { createdAt: 'asc', id: 'asc' } });
    assertVersion(version, room.version, 'The room', () => presentRoom(room, job.id, photos));
    const before = room.input;
    if (input.input !== undefined) room.input = { ...input.input, id: room.id };
    if (input.position !== undefined) room.position = input.position;
    Object.assign(room, stampOf(ctx.actor));
    await tx.flush();
    // A replay of the same values, or a move in the list, leaves the loads (and the ready mark) as they were.
    if (!isDeepStrictEqual(room.input, before)) await touchJobLoads(tx, job.id, ctx.clock.now());
    else await touchJob(tx, job.id, ctx.clock.now());
    return { room, photos };
  });
}

/** Deleting a room also removes its photos' files. */
export interface RoomDeleteContext extends ServiceContext {
  readonly storage: Storage;
}

export async function deleteRoom(
  ctx: RoomDeleteContext,
  jobId: string,
  roomId: string,
  version: number,
): Promise<void> {
  const { storage } = ctx;
  const keys = await ctx.em.transactional(async (tx) => {
    const { job, room } = await findRoom({ ...ctx, em: tx }, jobId, roomId);
    const photos = await tx.find(PhotoSchema, { room: room.id });
    assertVersion(version, room.version, 'The room', () => presentRoom(room, job.id, photos));
    tx.remove(photos);
    tx.remove(room);
    await tx.flush();
    await touchJobLoads(tx, job.id, ctx.clock.now());
    return photos.map((p) => p.storageKey);
  });
  // Files go after the rows are gone: a failed delete leaves an orphan file, never a row without its file.
  await Promise.all(keys.map((k) => storage.delete(k).catch(() => undefined)));
}
