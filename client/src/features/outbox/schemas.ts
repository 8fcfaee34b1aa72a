import { z } from 'zod';

export const outboxMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const outboxResponse = z.object({ messages: z.array(outboxMessageSchema) });
