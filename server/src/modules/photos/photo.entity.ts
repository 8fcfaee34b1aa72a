import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { RoomSchema } from '../rooms/room.entity';
import { UserSchema } from '../users/user.entity';
import { uuidKey } from '../../lib/entity-columns';

/** A room photo. The bytes live in the storage service under `storageKey` (a uuid, never the file name). */
export const PhotoSchema = defineEntity({
  name: 'Photo',
  tableName: 'photo',
  properties: {
    id: uuidKey(),
    room: p.manyToOne(RoomSchema).deleteRule('cascade').index(),
    storageKey: p.uuid().unique(),
    contentType: p.string().length(40),
    byteSize: p.integer(),
    width: p.integer(),
    height: p.integer(),
    /** For display only, sanitised; never used as a path. */
    originalName: p.string().length(120),
    uploadedBy: p.manyToOne(UserSchema),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});

export type Photo = InferEntity<typeof PhotoSchema>;
