import type { RoomRecord } from '@contract';
import { presentPhoto, type PhotoView } from '../photos/photo.presenter';
import type { RoomRow } from './room.entity';

/** What presentRoom reads: the entity, or a plain row read for a hot path (room-reads.ts). */
export type RoomView = Pick<RoomRow, 'id' | 'position' | 'input' | 'version' | 'createdAt' | 'updatedAt'>;

/** The only shape a room leaves the server in; its photos come with it (metadata only, bytes by URL). */
export function presentRoom(r: RoomView, jobId: string, photos: readonly PhotoView[]): RoomRecord {
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
