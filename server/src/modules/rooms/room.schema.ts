import { z } from 'zod';
import { roomInputSchema } from '@calc';

/**
 * calc's room schema (the same one the browser's form uses), closed to unknown top-level
 * keys. `input.id` may be sent but is ignored: a saved room's input id is always its row id.
 */
export const roomInputBody = z.preprocess(
  (v) => (typeof v === 'object' && v !== null && !Array.isArray(v) ? { ...v, id: 'pending' } : v),
  roomInputSchema.strict(),
);

const position = z
  .int({ message: 'Position must be a whole number.' })
  .min(0, { message: 'Position must be between 0 and 10000.' })
  .max(10_000, { message: 'Position must be between 0 and 10000.' });

export const createRoomSchema = z.strictObject({
  /** A client-made id lets a room created offline be replayed safely: a second POST gets 409. */
  id: z.uuid({ message: 'Must be a room id.' }).optional(),
  position: position.optional(),
  input: roomInputBody,
});

export const updateRoomSchema = z
  .strictObject({ position: position.optional(), input: roomInputBody.optional() })
  .refine((v) => v.position !== undefined || v.input !== undefined, { message: 'Send the input or the position.' });

export const jobRoomsParams = z.strictObject({ jobId: z.uuid({ message: 'Must be a job id.' }) });
export const roomParams = jobRoomsParams.extend({ roomId: z.uuid({ message: 'Must be a room id.' }) });

export type CreateRoomInput = z.output<typeof createRoomSchema>;
export type UpdateRoomInput = z.output<typeof updateRoomSchema>;
