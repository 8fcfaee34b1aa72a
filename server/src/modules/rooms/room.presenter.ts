import { presentPhoto } from '../photos/photo.presenter';
import type { Photo } from '../photos/photo.entity';
import type { RoomRow } from './room.entity';

/** The only shape a room leaves the server in; its photos come with it (metadata only, bytes by URL). */
export function presentRoom(r: RoomRow, jobId: string, photos: readonly Photo[]) {
  return {
    id: r.id,
    jobId,
    position: r.position,
    input: r.input,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    photos: photos.map((p) => presentPhoto(p, jobId, r.id)),
  };
}

export type RoomDto = ReturnType<typeof presentRoom>;
