/**
 * The zod schema the server uses to check ImportOptions from a request, and
 * the defaults filled in before parsing. Limits have a ceiling so a request
 * cannot ask the server to build an arbitrarily large network in memory; the
 * server should still set limits from its own configuration, not the client's.
 */
import { z } from 'zod';
import { DEFAULT_LIMITS, IMPORT_FORMATS, MAX_NAME_LENGTH, type ImportOptions } from './types';

export const LIMIT_CEILING = { maxNodes: 100_000, maxEdges: 1_000_000 } as const;

const columnName = z.string().trim().min(1, 'a column name cannot be empty').max(MAX_NAME_LENGTH);

export const importOptionsSchema = z
  .object({
    format: z.enum(IMPORT_FORMATS as [ImportOptions['format'], ...ImportOptions['format'][]]),
    columns: z.object({ source: columnName.optional(), target: columnName.optional(), weight: columnName.optional() }).strict().optional(),
    graphmlWeightKey: z.string().trim().min(1).max(MAX_NAME_LENGTH).optional(),
    undirected: z.enum(['refuse', 'both-directions']).optional(),
    duplicates: z.enum(['refuse', 'sum']).optional(),
    limits: z
      .object({
        maxNodes: z.number().int().positive().max(LIMIT_CEILING.maxNodes).optional(),
        maxEdges: z.number().int().positive().max(LIMIT_CEILING.maxEdges).optional(),
      })
      .strict()
      .optional(),
  })
  .strict() satisfies z.ZodType<ImportOptions>;

export type ResolvedOptions = {
  format: ImportOptions['format'];
  columns: ImportOptions['columns'];
  graphmlWeightKey: string | undefined;
  undirected: 'refuse' | 'both-directions';
  duplicates: 'refuse' | 'sum';
  maxNodes: number;
  maxEdges: number;
};

export function resolveOptions(options: ImportOptions): ResolvedOptions {
  return {
    format: options.format,
    columns: options.columns,
    graphmlWeightKey: options.graphmlWeightKey,
    undirected: options.undirected ?? 'refuse',
    duplicates: options.duplicates ?? 'refuse',
    maxNodes: options.limits?.maxNodes ?? DEFAULT_LIMITS.maxNodes,
    maxEdges: options.limits?.maxEdges ?? DEFAULT_LIMITS.maxEdges,
  };
}
