import { z } from 'zod';

/** The one error envelope of the API. */
export const errorEnvelopeSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    problems: z
      .array(z.object({ code: z.string(), message: z.string(), line: z.number().optional(), element: z.string().optional() }))
      .optional(),
  }),
});
export type ErrorEnvelope = z.infer<typeof errorEnvelopeSchema>;
