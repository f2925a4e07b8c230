import type { z } from 'zod';
import { errorEnvelopeSchema } from '../schemas/error';

/** An API failure as the client sees it: the server's code and sentence, or a network problem. */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
    /** Every finding behind a refusal (e.g. each bad line of an import). */
    public readonly problems?: Array<{ code: string; message: string; line?: number; element?: string }>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/**
 * Fetches `/api/v1${path}` and validates the answer with the same zod schema
 * the server uses, so a contract drift fails loudly at the boundary.
 */
export async function apiRequest<S extends z.ZodType>(
  schema: S,
  path: string,
  init: RequestInit = {},
): Promise<z.infer<S>> {
  let res: Response;
  try {
    res = await fetch(`/api/v1${path}`, {
      credentials: 'same-origin',
      ...init,
      headers: { Accept: 'application/json', ...(typeof init.body === 'string' ? { 'Content-Type': 'application/json' } : {}), ...init.headers },
    });
  } catch {
    throw new ApiError(0, 'network', 'The server could not be reached. Check your connection and try again.');
  }
  const body: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const env = errorEnvelopeSchema.safeParse(body);
    if (env.success) {
      const e = env.data.error;
      throw new ApiError(res.status, e.code, e.message, e.fields, e.problems);
    }
    throw new ApiError(res.status, 'unexpected', `The server answered ${res.status} without an explanation.`);
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw new ApiError(res.status, 'bad-response', 'The server sent an answer this page does not understand.');
  return parsed.data;
}
