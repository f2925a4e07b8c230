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

/** Shorthands over parseOr400 for the parts of a request. */
export const parseBody = <S extends z.ZodType>(schema: S, req: { body?: unknown }): z.infer<S> =>
  parseOr400(schema, req.body ?? {}, 'body');
export const parseParams = <S extends z.ZodType>(schema: S, req: { params?: unknown }): z.infer<S> =>
  parseOr400(schema, req.params ?? {}, 'path');
export const parseQuery = <S extends z.ZodType>(schema: S, req: { query?: unknown }): z.infer<S> =>
  parseOr400(schema, req.query ?? {}, 'query');
