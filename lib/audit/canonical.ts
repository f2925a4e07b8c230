/**
 * A canonical JSON text: object keys sorted, no white space, numbers as
 * JavaScript prints them (shortest round-trip form). The same value always
 * gives the same text, so its SHA-256 can seal a record.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    if (typeof value === 'number' && !Number.isFinite(value)) return JSON.stringify(String(value));
    return JSON.stringify(value ?? null);
  }
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

/** What a seal covers: the results, every disposition, and the approver's comment. */
export interface SealContent {
  auditId: number;
  networkVersionId: number;
  settings: unknown;
  lambda2: { re: number; im: number } | null;
  edges: Array<{
    edgeIndex: number;
    source: string;
    target: string;
    weight: number;
    class: string;
    plusClass: string | null;
    plusExponent: number | null;
    minusClass: string | null;
    minusExponent: number | null;
    flags: string;
    tolerance: number;
  }>;
  dispositions: Array<{ edgeIndex: number; kind: string; note: string; by: number; at: string }>;
  comment: string;
  sealedBy: number;
  sealedAt: string;
}
