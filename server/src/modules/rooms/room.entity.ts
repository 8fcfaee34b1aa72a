import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import type { Room as RoomInput } from '@calc';
import { JobSchema } from '../jobs/job.entity';

/** One room of a walk-through. `input` is calc's parsed room (its `id` always equals the row's id). */
export const RoomSchema = defineEntity({
  name: 'Room',
  tableName: 'room',
  properties: {
    id: p
      .uuid()
      .primary()
      .onCreate(() => randomUUID()),
    job: p.manyToOne(JobSchema).deleteRule('cascade').index(),
    position: p.integer().default(0),
    input: p.json<RoomInput>(),
    version: p.integer().version(),
    /** Who made the latest change and on which device (lib/change-stamp.ts); null before stamps were kept. */
    changedById: p.uuid().nullable(),
    changedByName: p.string().length(120).nullable(),
    changedOnDevice: p.string().length(40).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});

export type RoomRow = InferEntity<typeof RoomSchema>;
