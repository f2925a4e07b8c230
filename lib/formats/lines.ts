/**
 * Offset → 1-based line number. Built once per file so that looking up
 * 20,000 rows stays a binary search each rather than a rescan of the text.
 */
export class LineIndex {
  private readonly starts: number[] = [0];

  constructor(text: string) {
    for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) this.starts.push(i + 1);
  }

  lineAt(offset: number): number {
    let lo = 0;
    let hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.starts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  }
}

/** Strip a leading byte-order mark and unify line ends, so every reader counts lines the same way. */
export function normaliseText(text: string): string {
  const noBom = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  return noBom.includes('\r') ? noBom.replace(/\r\n?/g, '\n') : noBom;
}
