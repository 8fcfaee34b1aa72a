import type { Room as RoomInput } from '@calc';
import type { ServiceContext } from '../../lib/service-context';
import { findJobView, scopeSql } from '../jobs/job-reads';
import type { PhotoView } from '../photos/photo.presenter';
import type { RoomView } from './room.presenter';
import type { UpdateRoomInput } from './room.schema';

/**
 * The walk-through's hot paths in one statement each (room.service.ts keeps the ORM paths for
 * everything else and for the rare cases: a missing job or room, a stale version).
 */

interface RoomRowSql {
  id: string;
  position: number;
  input: RoomInput;
  version: number;
  created_at: Date | string;
  updated_at: Date | string;
  changed_by_name: string | null;
  changed_on_device: string | null;
  photos: Array<{
    id: string;
    contentType: string;
    byteSize: number;
    width: number;
    height: number;
    originalName: string;
    createdAt: string;
  }>;
}

const date = (d: Date | string) => (d instanceof Date ? d : new Date(d));

const ROOM_COLUMNS = `r.id, r.position, r.input, r.version, r.created_at, r.updated_at, r.changed_by_name, r.changed_on_device,
  coalesce((select json_agg(json_build_object('id', p.id, 'contentType', p.content_type, 'byteSize', p.byte_size,
      'width', p.width, 'height', p.height, 'originalName', p.original_name, 'createdAt', p.created_at)
    order by p.created_at, p.id) from "photo" p where p.room_id = r.id), '[]'::json) as photos`;

export interface RoomWithPhotoViews {
  room: RoomView;
  photos: PhotoView[];
}

function toViews(r: RoomRowSql): RoomWithPhotoViews {
  return {
    room: {
      id: r.id,
      position: r.position,
      input: r.input,
      version: r.version,
      createdAt: date(r.created_at),
      updatedAt: date(r.updated_at),
      changedByName: r.changed_by_name,
      changedOnDevice: r.changed_on_device,
    },
    photos: r.photos.map((p) => ({
      ...p,
      contentType: p.contentType as PhotoView['contentType'],
      createdAt: date(p.createdAt),
    })),
  };
}

/** The rooms of a job the actor may see, with their photos, in order; 404 for a job out of scope. */
export async function listRoomViews(ctx: ServiceContext, jobId: string): Promise<RoomWithPhotoViews[]> {
  const { em, actor } = ctx;
  const scope = scopeSql(actor);
  const rows = await em.execute<RoomRowSql[]>(
    `select ${ROOM_COLUMNS} from "room" r join "job" j on j.id = r.job_id
     where r.job_id = ? and ${scope.sql} order by r.position, r.created_at, r.id`,
    [jobId, ...scope.params],
  );
  if (rows.length === 0) await findJobView(ctx, jobId); // no rooms, or no such job for this person (404)
  return rows.map(toViews);
}

/**
 * Saves a room in one statement when the job is in scope and the version matches: the room's new
 * input/position, version and updatedAt, and the job's last activity at `at` (not its version); when the input
 * really changed (jsonb equality, so a replay of the same values does not count), the job's "ready to propose"
 * mark goes too, as touchJobLoads does on the ORM path. Null when nothing was
 * written (no such room for this person, or another version): the caller then takes the ORM path,
 * which tells 404 from 409 and answers the conflict with the current room.
 */
export async function updateRoomIfCurrent(
  { em, actor, clock }: ServiceContext,
  jobId: string,
  roomId: string,
  version: number,
  input: UpdateRoomInput,
): Promise<RoomWithPhotoViews | null> {
  const scope = scopeSql(actor);
  const rows = await em.execute<RoomRowSql[]>(
    `with old as (select input from "room" where id = ?), r as (
       update "room" r set input = coalesce(?::jsonb, r.input), position = coalesce(?::int, r.position),
         version = r.version + 1, updated_at = ?, changed_by_id = ?, changed_by_name = ?, changed_on_device = ?
       from "job" j where j.id = r.job_id and r.id = ? and r.job_id = ? and r.version = ? and ${scope.sql}
       returning r.id, r.job_id, r.position, r.input, r.version, r.created_at, r.updated_at, r.changed_by_name,
         r.changed_on_device
     ), loads as (select (select input from r) is distinct from (select input from old) as changed),
     touched as (
       update "job" set last_activity_at = ?,
         ready_at = case when loads.changed then null else ready_at end,
         ready_by_id = case when loads.changed then null else ready_by_id end,
         ready_override = case when loads.changed then null else ready_override end
       from loads where id in (select job_id from r))
     select ${ROOM_COLUMNS} from r`,
    [
      roomId,
      input.input === undefined ? null : JSON.stringify({ ...input.input, id: roomId }),
      input.position ?? null,
      new Date(),
      actor.userId,
      actor.name,
      actor.device ?? null,
      roomId,
      jobId,
      version,
      ...scope.params,
      clock.now(),
    ],
  );
  const row = rows[0];
  return row ? toViews(row) : null;
}
