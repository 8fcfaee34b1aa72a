import type { RoomRecord } from '@contract';
import { presentPhoto, type PhotoView } from '../photos/photo.presenter';
import { presentLastChange, type ChangeStamp } from '../../lib/change-stamp';
import type { RoomRow } from './room.entity';

/** What presentRoom reads: the entity, or a plain row read for a hot path (room-reads.ts). */
export type RoomView = Pick<RoomRow, 'id' | 'position' | 'input' | 'version' | 'createdAt' | 'updatedAt'> & ChangeStamp;

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
    lastChange: presentLastChange(r),
    photos: photos.map((p) => presentPhoto(p, jobId, r.id)),
  };
}
