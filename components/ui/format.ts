/** Number formatting for figures: fixed significant digits, thin-space grouping, true minus signs. */

export function fmt(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || Number.isNaN(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  // toPrecision itself switches to e-notation when rounding carries past the digits (99.999 → "1.0e+2").
  const fixed = x.toPrecision(digits);
  const s = abs >= 1e5 || abs < 1e-3 || fixed.includes('e') ? scientific(x, digits) : fixed;
  return s.replace(/^-/, '−');
}

const superscript: Record<string, string> = { '-': '⁻', '+': '', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };

/** 1.6×10⁻⁵ rather than 1.6e-5: easier to read at a glance. */
export function scientific(x: number, digits: number): string {
  const [mant, exp] = x.toExponential(Math.max(0, digits - 1)).split('e');
  return `${mant}×10${[...exp].map((c) => superscript[c] ?? c).join('')}`;
}

/** Short axis labels: plain for ordinary magnitudes, scientific for tiny or huge ones. */
export function fmtTick(t: number): string {
  if (t === 0) return '0';
  const abs = Math.abs(t);
  return (abs < 1e-3 || abs >= 1e5 ? scientific(t, 1) : String(+t.toPrecision(3))).replace(/^-/, '−');
}

export function fmtInt(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');
}

export function fmtComplex(re: number, im: number, digits = 4): string {
  if (Math.abs(im) < 1e-12) return fmt(re, digits);
  return `${fmt(re, digits)} ${im < 0 ? '−' : '+'} ${fmt(Math.abs(im), digits)}i`;
}

export function fmtDate(iso: string): string {
  const d = new Date(iso.includes('T') ? iso : iso.replace(' ', 'T') + 'Z');
  if (Number.isNaN(d.getTime())) return iso;
  return d.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
}
