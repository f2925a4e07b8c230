import { auditSettingsSchema, type AuditSettings } from '@/lib/schemas/audit';
import type { Convention } from '@/lib/schemas/network';

/** The start form as typed (strings), and its translation into the contract's settings. */
export interface StartForm {
  from: string;
  to: string;
  step: string;
  signs: 'both' | 'plus' | 'minus';
  /** τ in per cent of Re λ2. */
  tolerancePct: string;
  convention: Convention;
}

/** The schema's defaults, written as the form shows them. */
export function defaultStartForm(convention: Convention): StartForm {
  const d = auditSettingsSchema.parse({});
  return {
    from: String(d.ladder.from),
    to: String(d.ladder.to),
    step: String(d.ladder.step),
    signs: d.signs.length === 2 ? 'both' : d.signs[0] === 'plus' ? 'plus' : 'minus',
    tolerancePct: String(+(d.tolerance * 100).toPrecision(6)),
    convention,
  };
}

export type StartFormErrors = Partial<Record<'from' | 'to' | 'step' | 'ladder' | 'tolerance', string>>;

const rangeText: StartFormErrors = { from: 'between 0.5 and 12', to: 'between 0.5 and 14', step: 'between 0.1 and 2', tolerance: 'more than 0 and at most 50 per cent' };

const number = (s: string) => (s.trim() === '' ? NaN : Number(s.replace(',', '.').replace('−', '-')));

export function settingsFromForm(f: StartForm): { ok: true; settings: AuditSettings } | { ok: false; errors: StartFormErrors } {
  const errors: StartFormErrors = {};
  const from = number(f.from), to = number(f.to), step = number(f.step), pct = number(f.tolerancePct);
  if (!Number.isFinite(from)) errors.from = 'a number, e.g. 2';
  if (!Number.isFinite(to)) errors.to = 'a number, e.g. 7';
  if (!Number.isFinite(step)) errors.step = 'a number, e.g. 0.5';
  if (!Number.isFinite(pct)) errors.tolerance = 'a percentage, e.g. 1';
  if (Object.keys(errors).length) return { ok: false, errors };
  const parsed = auditSettingsSchema.safeParse({
    convention: f.convention,
    ladder: { from, to, step },
    signs: f.signs === 'both' ? ['plus', 'minus'] : [f.signs],
    tolerance: +(pct / 100).toPrecision(12),
  });
  if (parsed.success) return { ok: true, settings: parsed.data };
  for (const issue of parsed.error.issues) {
    const [a, b] = issue.path.map(String);
    const key = a === 'ladder' ? ((b as 'from' | 'to' | 'step' | undefined) ?? 'ladder') : a === 'tolerance' ? 'tolerance' : 'ladder';
    errors[key] ??= rangeText[key] ?? issue.message;
  }
  return { ok: false, errors };
}

/** Ladder rungs per sign: t = from, from + step, …, to. */
export function ladderSteps(from: number, to: number, step: number): number {
  if (!(to > from) || !(step > 0)) return 0;
  return Math.floor((to - from) / step + 1e-9) + 1;
}
