import { z } from 'zod';

// The server's mail.presenter.ts shape.
export const messageSchema = z.object({
  id: z.string(),
  kind: z.enum(['new-user', 'password-changed', 'password-reset']),
  to: z.string(),
  subject: z.string(),
  state: z.enum(['waiting', 'retrying', 'failed', 'sent']),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Message = z.infer<typeof messageSchema>;

export const messagesResponse = z.object({ messages: z.array(messageSchema) });
export const messageResponse = z.object({ message: messageSchema });
