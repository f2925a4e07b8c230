import { z } from 'zod';
import { importOptionsSchema } from '../formats/options';

/** The networks resource: list, detail, versions, import and diff. */

export const conventionSchema = z.enum(['in', 'out']);
export type Convention = z.infer<typeof conventionSchema>;

const complex = z.object({ re: z.number(), im: z.number() });

/** Computed once per version, in the background (large networks take minutes). */
export const versionSummarySchema = z.object({
  nodeCount: z.number().int(),
  edgeCount: z.number().int(),
  weightRange: z.object({ min: z.number(), max: z.number() }).nullable(),
  meanWeight: z.number(),
  rooted: z.boolean(),
  roots: z.array(z.string()),
  cutOff: z.array(z.string()),
  lambda2: complex,
  cluster: z.object({ size: z.number().int(), spread: z.number() }),
  spectrum: z.array(complex),
});
export type VersionSummary = z.infer<typeof versionSummarySchema>;

export const summaryStateSchema = z.enum(['pending', 'ready', 'failed']);

export const versionInfoSchema = z.object({
  version: z.number().int(),
  nodeCount: z.number().int(),
  edgeCount: z.number().int(),
  sourceName: z.string(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  summaryState: summaryStateSchema,
  summaryError: z.string().nullable(),
  lambda2Re: z.number().nullable(),
});
export type VersionInfo = z.infer<typeof versionInfoSchema>;

export const networkListItemSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  convention: conventionSchema,
  latest: versionInfoSchema,
  createdAt: z.string(),
});
export type NetworkListItem = z.infer<typeof networkListItemSchema>;

export const networkListSchema = z.object({ networks: z.array(networkListItemSchema) });

export const networkListQuerySchema = z.object({
  q: z.string().max(160).optional(),
  sort: z.enum(['name', 'updated', 'nodes', 'lambda2']).default('updated'),
});

export const networkDetailSchema = networkListItemSchema.extend({
  versions: z.array(versionInfoSchema),
});
export type NetworkDetail = z.infer<typeof networkDetailSchema>;

export const versionDetailSchema = versionInfoSchema.extend({
  networkId: z.number().int(),
  convention: conventionSchema,
  summary: versionSummarySchema.nullable(),
  nodes: z.array(z.string()),
  edges: z.array(z.object({ source: z.string(), target: z.string(), weight: z.number() })),
});
export type VersionDetail = z.infer<typeof versionDetailSchema>;

export const versionDiffSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  added: z.array(z.object({ source: z.string(), target: z.string(), weight: z.number() })),
  removed: z.array(z.object({ source: z.string(), target: z.string(), weight: z.number() })),
  reweighted: z.array(z.object({ source: z.string(), target: z.string(), before: z.number(), after: z.number() })),
});
export type VersionDiff = z.infer<typeof versionDiffSchema>;

/**
 * An import: either a new network (`name`) or the next version of an
 * existing one (`networkId`), with the file's text and the parser options.
 * Sent as JSON (paste-in) or as multipart form fields beside the file.
 */
export const importRequestSchema = z
  .object({
    name: z.string().trim().min(1).max(160).optional(),
    description: z.string().max(2000).default(''),
    networkId: z.coerce.number().int().positive().optional(),
    convention: conventionSchema.default('in'),
    format: importOptionsSchema.shape.format.optional(),
    text: z.string().optional(),
    fileName: z.string().max(255).optional(),
    options: importOptionsSchema.omit({ format: true, limits: true }).partial().default({}),
  })
  .refine((r) => (r.name ? !r.networkId : !!r.networkId), {
    message: 'give either a name for a new network or the networkId of an existing one',
    path: ['name'],
  });
export type ImportRequest = z.input<typeof importRequestSchema>;

export const importProblemSchema = z.object({
  code: z.string(),
  message: z.string(),
  line: z.number().int().optional(),
  element: z.string().optional(),
  column: z.string().optional(),
});

export const importResultSchema = z.object({
  networkId: z.number().int(),
  version: z.number().int(),
  warnings: z.array(importProblemSchema),
});
export type ImportResult = z.infer<typeof importResultSchema>;
