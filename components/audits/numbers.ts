import { fmt, fmtInt } from '../ui/format';

/**
 * `fmt` with whole numbers kept whole: between 10^digits and 10^5,
 * toPrecision would answer "1.0e+2"; this answers "100".
 */
export function fig(x: number | null | undefined, digits = 3): string {
  if (x === null || x === undefined || Number.isNaN(x)) return '—';
  const a = Math.abs(x);
  // Compare after rounding: 99.99 at 2 digits is also a three-digit whole number.
  if (Number(a.toPrecision(digits)) >= 10 ** digits && a < 1e5) return fmtInt(Math.round(x)).replace(/^-/, '−');
  return fmt(x, digits);
}

/** A share as per cent: 0.0123 → "1.2". */
export const pct = (share: number | null | undefined, digits = 2) => (share === null || share === undefined ? '—' : fig(share * 100, digits));
