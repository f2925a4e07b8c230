/**
 * Turning a weight as written into a positive finite number, or into the
 * reason it cannot be one. Number() alone is too lenient ('' → 0, '0x1f' → 31,
 * ' 1 ' → 1, 'Infinity' → Infinity), so the accepted spelling is explicit.
 */
import { quote } from './problems';
import { WEIGHT_RANGE, type ProblemCode } from './types';
import type { RawWeight } from './raw';

/** Plain decimal with optional sign, fraction and exponent: 2, -0.5, .75, 3., 1.2e-3. */
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const INFINITE_WORDS = /^[+-]?(?:inf|infinity|∞)$/i;
const NAN_WORDS = /^[+-]?nan$/i;
const EXAMPLE = 'use a decimal such as 0.75';

export type WeightCheck =
  | { ok: true; value: number }
  | { ok: false; code: ProblemCode; text: string };

export function checkWeight(raw: RawWeight): WeightCheck {
  if ('value' in raw) return checkValue(raw.value, String(raw.value), true);
  const written = raw.text.trim();
  if (written === '') return { ok: false, code: 'empty-weight', text: `the weight is empty; ${EXAMPLE}` };
  if (NAN_WORDS.test(written)) {
    return { ok: false, code: 'not-a-number', text: `weight ${quote(written)} means "not a number" and cannot weigh an edge; ${EXAMPLE}` };
  }
  if (INFINITE_WORDS.test(written)) {
    return { ok: false, code: 'not-finite', text: `weight ${quote(written)} is infinite; every weight must be a finite number` };
  }
  if (!DECIMAL.test(written)) {
    return { ok: false, code: 'not-a-number', text: `weight ${quote(written)} is not a number; ${EXAMPLE}${hint(written)}` };
  }
  return checkValue(Number(written), written, false);
}

function checkValue(value: number, written: string, fromJsonNumber: boolean): WeightCheck {
  if (Number.isNaN(value)) return { ok: false, code: 'not-a-number', text: `the weight is not a number; ${EXAMPLE}` };
  if (!Number.isFinite(value)) {
    // JSON.parse('1e309') and Number('1e309') both give Infinity: say why, since the file shows a plain number.
    const shown = fromJsonNumber ? 'the weight' : `weight ${quote(written)}`;
    return {
      ok: false,
      code: 'not-finite',
      text: `${shown} is too large to store (it overflows to infinity); weights must stay below about 1.8e308`,
    };
  }
  if (value < 0) {
    return { ok: false, code: 'weight-not-positive', text: `weight ${quote(written)} is negative; weights must be greater than zero` };
  }
  if (value === 0) {
    const why = fromJsonNumber || /^[+-]?[0.]+(?:[eE]|$)/.test(written) ? 'is zero' : 'is so small it rounds to zero';
    return {
      ok: false,
      code: 'weight-not-positive',
      text: `weight ${quote(written)} ${why}; leave a link with no coupling out of the file instead`,
    };
  }
  if (value > WEIGHT_RANGE.max || value < WEIGHT_RANGE.min) {
    const shown = fromJsonNumber ? `weight ${value}` : `weight ${quote(written)}`;
    return {
      ok: false,
      code: 'weight-out-of-range',
      text: `${shown} is outside the range Hairline can compute with (1e-100 to 1e100); rescale every weight of the network by the same factor`,
    };
  }
  return { ok: true, value };
}

/** Point at the usual culprit when a spreadsheet wrote the number its own way. */
function hint(written: string): string {
  if (/^[+-]?\d+,\d+$/.test(written)) return ' (a decimal comma? write 0.75, not 0,75)';
  if (/^[+-]?\d{1,3}(?:[ ,']\d{3})+(?:\.\d+)?$/.test(written)) return ' (remove the thousands separators)';
  if (/^[+-]?\d+(?:\.\d+)?\s*%$/.test(written)) return ' (write 0.5, not 50%)';
  return '';
}
