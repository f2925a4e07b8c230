import type { AuditState, ResponseClass } from '@/lib/schemas/audit';
import type { DispositionFilter, EdgeSortKey } from './edge-query-url';

/**
 * How each kind of thing is shown: a glyph and a word always, a colour only
 * as a second cue (tailwind text classes from the house palette).
 */

export interface Look {
  glyph: string;
  label: string;
  tone: string;
}

/** A glyph that hints at the response law's shape. */
export const classLook: Record<ResponseClass, Look & { law: string }> = {
  linear: { glyph: '╱', label: 'linear', tone: 'text-ink-soft', law: '|Δ| ∝ |ε|' },
  'square-root': { glyph: '√', label: 'square-root', tone: 'text-rust', law: '|Δ| ∝ |ε|^½' },
  'cube-root': { glyph: '∛', label: 'cube-root', tone: 'text-rust', law: '|Δ| ∝ |ε|^⅓' },
  quadratic: { glyph: '²', label: 'quadratic', tone: 'text-verdigris', law: '|Δ| ∝ |ε|²' },
  flat: { glyph: '─', label: 'flat', tone: 'text-verdigris', law: 'no change above the noise floor' },
  other: { glyph: '?', label: 'other', tone: 'text-ochre', law: 'no clean power law' },
};

export const stateLook: Record<AuditState, Look & { hint: string }> = {
  queued: { glyph: '◌', label: 'queued', tone: 'text-ochre', hint: 'waiting for a free worker' },
  sweeping: { glyph: '◐', label: 'sweeping', tone: 'text-ochre', hint: 'perturbing every edge along the ladder' },
  'in-review': { glyph: '◆', label: 'in review', tone: 'text-ink', hint: 'an auditor records a disposition for each flagged edge' },
  'awaiting-sign-off': { glyph: '◇', label: 'awaiting sign-off', tone: 'text-ink', hint: 'an approver who did not start the run seals it' },
  sealed: { glyph: '■', label: 'sealed', tone: 'text-verdigris', hint: 'final: nothing in it can change' },
  'sent-back': { glyph: '↩', label: 'sent back', tone: 'text-rust', hint: 'returned to the analyst with a comment' },
  failed: { glyph: '×', label: 'failed', tone: 'text-rust', hint: 'the sweep stopped with an error' },
  cancelled: { glyph: '⊘', label: 'cancelled', tone: 'text-ink-faint', hint: 'stopped before it finished' },
};

export const dispositionLook: Record<DispositionFilter, Look & { hint: string }> = {
  accept: { glyph: '✓', label: 'accept', tone: 'text-verdigris', hint: 'the fragility is understood and tolerable as built' },
  mitigate: { glyph: '△', label: 'mitigate', tone: 'text-rust', hint: 'change the design or the calibration before relying on it' },
  monitor: { glyph: '◎', label: 'monitor', tone: 'text-ochre', hint: 'keep it, and watch this weight in operation' },
  none: { glyph: '○', label: 'no disposition', tone: 'text-ink-faint', hint: 'not yet reviewed' },
};

/** The engine's flags in words. */
export const flagText: Record<string, string> = {
  crossover: 'crossover: the local exponent drifts along the ladder',
  'low-signal': 'low signal: fewer than three points above the noise floor',
  'identity-change': 'identity change: another eigenvalue took over at some points (dropped)',
  'sign-change': 'sign change: the law differs between +ε and −ε',
  'mixed-sign': 'mixed sign: Δ changes sign inside the fitted run',
  truncated: 'truncated: −ε steps beyond half the weight left out',
  probe: 'probe: an absent link (weight 0) tried as a new one',
};

export const limitText: Record<string, string> = {
  plus: 'the +ε side',
  minus: 'the −ε side',
  weight: 'the weight itself (cannot go below zero)',
  cap: 'the largest step tried',
  'not-rooted': 'the network not being rooted (λ2 = 0)',
};

/** The trail's action names (`audit.…`) in words. */
export const actionText: Record<string, string> = {
  'audit.started': 'started the run',
  'audit.resumed': 'resumed the sweep after a restart',
  'audit.sweep-finished': 'sweep finished; ready for review',
  'audit.failed': 'sweep failed',
  'audit.cancelled': 'cancelled the run',
  'audit.disposition': 'recorded a disposition',
  'audit.submitted': 'submitted for sign-off',
  'audit.returned': 'sent back to the analyst',
  'audit.reopened': 'reopened for review',
  'audit.sealed': 'sealed the audit (approved)',
};

/** A trail value (JSON text) as a short line: `kind accept · note …`. */
export function describeValue(raw: string | null): string {
  if (raw === null) return '—';
  let v: unknown;
  try {
    v = JSON.parse(raw);
  } catch {
    return raw;
  }
  return plainWords(v, true);
}

/** A stored value in words: lists joined by commas, nested records as "key value" pairs, no JSON punctuation. */
function plainWords(v: unknown, top = false): string {
  if (v === null || v === undefined) return '—';
  if (Array.isArray(v)) return v.map((x) => plainWords(x)).join(', ');
  if (typeof v !== 'object') return String(v);
  const parts = Object.entries(v as Record<string, unknown>).map(([k, x]) => `${k} ${plainWords(x)}`);
  return parts.join(top ? ' · ' : ', ');
}

/** The sort keys as the phone's sort choice names them. */
export const sortLabels: Record<EdgeSortKey, string> = {
  edge: '#',
  source: 'source',
  target: 'target',
  weight: 'weight',
  class: 'class',
  plusExponent: 'p at +ε',
  minusExponent: 'p at −ε',
  tolerance: 'tolerance',
  toleranceRel: 'tolerance %',
  sensitivity: 'sensitivity',
  disposition: 'disposition',
};
