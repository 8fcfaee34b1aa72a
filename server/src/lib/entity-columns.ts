import { p } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';

/**
 * Columns many records share, written once for every entity (the migrations create them per table).
 * Spread into `defineEntity({ properties: { ... } })`.
 */

/** The primary key: a uuid made by the server when the row is created (a room's may come from the device). */
export const uuidKey = () =>
  p
    .uuid()
    .primary()
    .onCreate(() => randomUUID());

/** When the row was made, and when it last changed (every update sets it). */
export const timestamps = () => ({
  createdAt: p.datetime().onCreate(() => new Date()),
  updatedAt: p
    .datetime()
    .onCreate(() => new Date())
    .onUpdate(() => new Date()),
});

/** Who made the latest change and on which device (lib/change-stamp.ts); null before stamps were kept. */
export const changeStamp = () => ({
  changedById: p.uuid().nullable(),
  changedByName: p.string().length(120).nullable(),
  changedOnDevice: p.string().length(40).nullable(),
});
