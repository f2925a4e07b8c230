import { z } from 'zod';

/** One message the local mail fake received. */
export const outboxMessageSchema = z.object({
  id: z.number().int(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxListSchema = z.object({ messages: z.array(outboxMessageSchema) });

/** The first http(s) link in a message body: what a tester opens. */
export function firstLink(text: string): string | null {
  const m = /https?:\/\/[^\s<>"]+/.exec(text);
  return m ? m[0] : null;
}
