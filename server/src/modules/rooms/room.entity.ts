import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import type { Room as RoomInput } from '@calc';
import { JobSchema } from '../jobs/job.entity';
import { changeStamp, timestamps, uuidKey } from '../../lib/entity-columns';

/** One room of a walk-through. `input` is calc's parsed room (its `id` always equals the row's id). */
export const RoomSchema = defineEntity({
  name: 'Room',
  tableName: 'room',
  properties: {
    id: uuidKey(),
    job: p.manyToOne(JobSchema).deleteRule('cascade').index(),
    position: p.integer().default(0),
    input: p.json<RoomInput>(),
    version: p.integer().version(),
    ...changeStamp(),
    ...timestamps(),
  },
});

export type RoomRow = InferEntity<typeof RoomSchema>;
