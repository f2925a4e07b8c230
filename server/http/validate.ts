import type { z } from 'zod';
import { HttpError } from './errors';

/**
 * Validates one part of a request with its zod schema; a failure becomes a
 * 400 whose `fields` name each bad field and what is wrong with it.
 */
export function parseOr400<S extends z.ZodType>(schema: S, value: unknown, where: 'body' | 'query' | 'path'): z.infer<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.join('.') || where;
    fields[key] ??= issue.message;
  }
  const list = Object.entries(fields).map(([k, m]) => `${k}: ${m}`).join('; ');
  throw new HttpError(400, 'invalid-input', `The request ${where} is not valid (${list}).`, fields);
}
