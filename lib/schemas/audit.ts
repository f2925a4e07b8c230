import { z } from 'zod';
import { jobsStatusSchema } from './health';
import { conventionSchema } from './network';

/**
 * The audits resource. One audit = one sweep of one network version with
 * fixed settings, then its review and sign-off. States (Hairline's names):
 *
 *   queued → sweeping → in-review → awaiting-sign-off → sealed
 *                          ↑   ↓             ↓
 *                          └ sent-back ←─────┘   (returned to the analyst with a comment)
 *   sweeping → failed | cancelled
 *
 * `sealed` is final: every write is refused by the API and by database triggers.
 */
export const auditStates = ['queued', 'sweeping', 'in-review', 'awaiting-sign-off', 'sealed', 'sent-back', 'failed', 'cancelled'] as const;
export const auditStateSchema = z.enum(auditStates);
export type AuditState = z.infer<typeof auditStateSchema>;

export const responseClasses = ['linear', 'square-root', 'cube-root', 'quadratic', 'flat', 'other'] as const;
export const responseClassSchema = z.enum(responseClasses);
export type ResponseClass = z.infer<typeof responseClassSchema>;

export const dispositionKinds = ['accept', 'mitigate', 'monitor'] as const;
export const dispositionKindSchema = z.enum(dispositionKinds);
export type DispositionKind = z.infer<typeof dispositionKindSchema>;

const complex = z.object({ re: z.number(), im: z.number() });

export const auditSettingsSchema = z.object({
  convention: conventionSchema.optional(),
  /** ε = w̄·10^(−t) for t from `from` to `to` in steps of `step`. */
  ladder: z
    .object({
      from: z.number().min(0.5).max(12),
      to: z.number().min(0.5).max(14),
      step: z.number().min(0.1).max(2),
    })
    .refine((l) => l.to > l.from && (l.to - l.from) / l.step <= 40, { message: 'to must exceed from, with at most 40 steps' })
    .default({ from: 2, to: 7, step: 0.5 }),
  signs: z.array(z.enum(['plus', 'minus'])).min(1).max(2).default(['plus', 'minus']),
  /** τ: the tolerated change of Re λ2 as a share of Re λ2. */
  tolerance: z.number().gt(0).max(0.5).default(0.01),
});
export type AuditSettings = z.infer<typeof auditSettingsSchema>;

export const startAuditSchema = z.object({
  networkId: z.number().int().positive(),
  version: z.number().int().positive(),
  settings: auditSettingsSchema.default({ ladder: { from: 2, to: 7, step: 0.5 }, signs: ['plus', 'minus'], tolerance: 0.01 }),
});
export type StartAudit = z.input<typeof startAuditSchema>;

const person = z.object({ id: z.number().int(), name: z.string() });

export const auditSummarySchema = z.object({
  id: z.number().int(),
  networkId: z.number().int(),
  networkName: z.string(),
  version: z.number().int(),
  convention: conventionSchema,
  state: auditStateSchema,
  settings: z.object({
    ladder: z.object({ from: z.number(), to: z.number(), step: z.number() }),
    signs: z.array(z.enum(['plus', 'minus'])),
    tolerance: z.number(),
  }),
  startedBy: person,
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
  progress: z.object({
    done: z.number().int(),
    total: z.number().int(),
    /** Seconds left at the current pace; null before the first edges finish. */
    etaSeconds: z.number().nullable(),
  }),
  /** Why a run failed or was cancelled. */
  reason: z.string().nullable(),
  lambda2: complex.nullable(),
  cluster: z.object({ size: z.number().int(), spread: z.number() }).nullable(),
  /** Edges per class (the worse of the two signs). */
  classCounts: z.record(z.string(), z.number().int()),
  flaggedCount: z.number().int(),
  /** Flagged edges still without a disposition. */
  undisposedCount: z.number().int(),
});
export type AuditSummary = z.infer<typeof auditSummarySchema>;

export const auditListSchema = z.object({ audits: z.array(auditSummarySchema) });
export const auditListQuerySchema = z.object({
  state: z.string().optional(), // comma-separated states
  networkId: z.coerce.number().int().positive().optional(),
});

export const lockRecordSchema = z.object({
  by: person,
  at: z.string(),
  meaning: z.literal('approved'),
  comment: z.string(),
  /** SHA-256 (hex) over the canonical serialisation of results, dispositions and comment. */
  hash: z.string(),
});

export const auditDetailSchema = auditSummarySchema.extend({
  rooted: z.boolean().nullable(),
  cutOff: z.array(z.string()),
  spectrum: z.array(complex),
  lock: lockRecordSchema.nullable(),
  /** Recomputed on every read of a sealed audit. */
  hashCheck: z.object({ recomputed: z.string(), matches: z.boolean() }).nullable(),
  /** The latest comment that sent it back or submitted it. */
  lastComment: z.object({ by: z.string(), at: z.string(), text: z.string(), action: z.string() }).nullable(),
  /** What the signed-in caller may do now (the server enforces it anyway). */
  allowed: z.array(z.enum(['cancel', 'dispose', 'submit', 'return', 'lock', 'reopen'])),
  /**
   * While queued or sweeping: who could compute the run, so a page can say why
   * a queued run does not move. Null once the sweep is over.
   */
  jobs: jobsStatusSchema.nullable().optional(),
});
export type AuditDetail = z.infer<typeof auditDetailSchema>;

export const dispositionSchema = z.object({
  kind: dispositionKindSchema,
  note: z.string(),
  by: z.string(),
  at: z.string(),
});

/** One row of the audit table. `class` is the worse of the two signs. */
export const edgeRowSchema = z.object({
  edgeIndex: z.number().int(),
  source: z.string(),
  target: z.string(),
  weight: z.number(),
  class: responseClassSchema,
  plusClass: responseClassSchema.nullable(),
  plusExponent: z.number().nullable(),
  minusClass: responseClassSchema.nullable(),
  minusExponent: z.number().nullable(),
  flags: z.array(z.string()),
  /** Weight tolerance |ε| (weight units) and as a share of the weight. */
  tolerance: z.number(),
  toleranceRel: z.number().nullable(),
  /** Re dλ2/dw when λ2 is simple. */
  sensitivity: z.number().nullable(),
  /** Root-type (square-root, cube-root, other sub-linear) or crossover: needs a disposition. */
  flagged: z.boolean(),
  disposition: dispositionSchema.nullable(),
});
export type EdgeRow = z.infer<typeof edgeRowSchema>;

export const edgeSortKeys = ['edge', 'source', 'target', 'weight', 'class', 'plusExponent', 'minusExponent', 'tolerance', 'toleranceRel', 'sensitivity', 'disposition'] as const;

/** Filters and paging of the audit table; the client keeps the same keys in its URL. */
export const edgeQuerySchema = z.object({
  class: z.string().optional(), // comma-separated classes
  expMin: z.coerce.number().optional(),
  expMax: z.coerce.number().optional(),
  tolBelow: z.coerce.number().optional(), // relative tolerance (share of weight)
  disposition: z.string().optional(), // comma-separated: accept, mitigate, monitor, none
  flagged: z.enum(['yes', 'no']).optional(),
  q: z.string().max(200).optional(), // node-name search
  sort: z.enum(edgeSortKeys).default('edge'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});
export type EdgeQuery = z.input<typeof edgeQuerySchema>;

export const edgePageSchema = z.object({
  rows: z.array(edgeRowSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});

const ladderPoint = z.object({ eps: z.number(), delta: z.number(), floor: z.number(), used: z.number(), tracked: z.number() });
const signDetail = z.object({
  class: responseClassSchema,
  exponent: z.number().nullable(),
  prefactor: z.number().nullable(),
  flags: z.array(z.string()),
  slopeSmall: z.number().nullable(),
  slopeLarge: z.number().nullable(),
  crossoverEps: z.number().nullable(),
  noiseFloor: z.number(),
  points: z.array(ladderPoint),
});

export const edgeDetailSchema = edgeRowSchema.extend({
  plus: signDetail.nullable(),
  minus: signDetail.nullable(),
  budget: z.object({
    eps: z.number(),
    relative: z.number().nullable(),
    limitedBy: z.string(),
    allowedDelta: z.number(),
    confirmed: z.boolean(),
  }),
  sensitivityDetail: z.object({ re: z.number(), im: z.number(), condition: z.number() }).nullable(),
});
export type EdgeDetail = z.infer<typeof edgeDetailSchema>;

export const setDispositionSchema = z.object({
  kind: dispositionKindSchema,
  note: z.string().trim().min(3, 'say why in a few words').max(2000),
});

export const commentSchema = z.object({ comment: z.string().trim().min(3, 'a comment is required').max(4000) });
export const optionalCommentSchema = z.object({ comment: z.string().trim().max(4000).optional() });

export const trailEntrySchema = z.object({
  id: z.number().int(),
  at: z.string(),
  actor: z.string().nullable(),
  action: z.string(),
  oldValue: z.string().nullable(),
  newValue: z.string().nullable(),
  reason: z.string().nullable(),
  hash: z.string(),
});
export const trailSchema = z.object({ entries: z.array(trailEntrySchema), verified: z.boolean() });
