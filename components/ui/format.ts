/** Number formatting for figures: fixed significant digits, thin-space grouping, true minus signs. */

export function fmt(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || Number.isNaN(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  const s = abs >= 1e5 || abs < 1e-3 ? x.toExponential(digits - 1).replace('e', '×10^') : x.toPrecision(digits);
  return s.replace(/^-/, '−');
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
