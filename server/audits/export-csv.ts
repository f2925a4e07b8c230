import Papa from 'papaparse';
import type { EdgeRow } from '../../lib/schemas/audit';

/**
 * A cell a spreadsheet would run as a formula (=, +, -, @, tab, CR) gets a
 * leading apostrophe: node names come from uploaded files, and an export must
 * not turn one into a live formula on someone's desk.
 */
export function neutraliseFormula(cell: string): string {
  return /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
}

const num = (x: number | null) => (x === null ? '' : String(x));

export function edgesCsv(rows: EdgeRow[]): string {
  const header = ['edge', 'source', 'target', 'weight', 'class', 'plus_class', 'plus_exponent', 'minus_class', 'minus_exponent', 'flags', 'tolerance', 'tolerance_share_of_weight', 'sensitivity_re_dlambda2_dw', 'flagged', 'disposition', 'disposition_note', 'disposition_by', 'disposition_at'];
  const data = rows.map((r) => [
    String(r.edgeIndex),
    neutraliseFormula(r.source),
    neutraliseFormula(r.target),
    String(r.weight),
    r.class,
    r.plusClass ?? '',
    num(r.plusExponent),
    r.minusClass ?? '',
    num(r.minusExponent),
    r.flags.join(' '),
    String(r.tolerance),
    num(r.toleranceRel),
    num(r.sensitivity),
    r.flagged ? 'yes' : 'no',
    r.disposition?.kind ?? '',
    neutraliseFormula(r.disposition?.note ?? ''),
    neutraliseFormula(r.disposition?.by ?? ''),
    r.disposition?.at ?? '',
  ]);
  return Papa.unparse({ fields: header, data }, { newline: '\r\n' });
}
