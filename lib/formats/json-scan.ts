/**
 * A small JSON scanner used beside JSON.parse for what JSON.parse does not
 * give: the offset of a syntax error (engines word and position it
 * differently, some not at all), and the offset of each item of the top-level
 * "edges" and "nodes" lists, so problems can name a line as well as a path.
 * Iterative, so deeply nested input cannot overflow the call stack.
 */

type Frame = { kind: 'object' | 'array'; count: number; key?: string; record?: string };

export type JsonScan = { errorAt?: number; offsets: Map<string, number> };

const RECORDED = new Set(['edges', 'nodes']);
const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;

export function scanJson(text: string): JsonScan {
  const offsets = new Map<string, number>();
  const stack: Frame[] = [];
  let i = 0;
  const fail = (): JsonScan => ({ errorAt: Math.min(i, text.length), offsets });
  const skipSpace = () => {
    while (i < text.length && ' \t\n\r'.includes(text[i])) i += 1;
  };
  const readString = (): string | undefined => {
    const start = i;
    i += 1;
    while (i < text.length) {
      const c = text.charCodeAt(i);
      if (c === 0x22) {
        i += 1;
        return text.slice(start, i);
      }
      if (c < 0x20) return undefined;
      if (c === 0x5c) {
        const next = text[i + 1];
        if (next === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) return undefined;
          i += 6;
        } else if (next !== undefined && '"\\/bfnrt'.includes(next)) i += 2;
        else return undefined;
      } else i += 1;
    }
    return undefined;
  };
  /** Reads `"key" :` in an object; stores the key on the frame. */
  const readKey = (frame: Frame): boolean => {
    skipSpace();
    if (text[i] !== '"') return false;
    const raw = readString();
    if (raw === undefined) return false;
    frame.key = JSON.parse(raw) as string;
    skipSpace();
    if (text[i] !== ':') return false;
    i += 1;
    return true;
  };

  for (;;) {
    // A value starts here.
    skipSpace();
    const parent = stack[stack.length - 1];
    if (parent?.record !== undefined) offsets.set(`${parent.record}[${parent.count}]`, i);
    const c = text[i];
    if (c === '{' || c === '[') {
      const frame: Frame = { kind: c === '{' ? 'object' : 'array', count: 0 };
      if (frame.kind === 'array' && stack.length === 1 && parent.kind === 'object' && RECORDED.has(parent.key ?? '')) frame.record = parent.key;
      i += 1;
      skipSpace();
      if (text[i] === (c === '{' ? '}' : ']')) i += 1;
      else {
        stack.push(frame);
        if (frame.kind === 'object' && !readKey(frame)) return fail();
        continue;
      }
    } else if (c === '"') {
      if (readString() === undefined) return fail();
    } else if (text.startsWith('true', i) || text.startsWith('null', i)) i += 4;
    else if (text.startsWith('false', i)) i += 5;
    else {
      NUMBER.lastIndex = i;
      if (!NUMBER.test(text)) return fail();
      i = NUMBER.lastIndex;
    }
    // After a value: a separator, closing brackets, or the end.
    for (;;) {
      skipSpace();
      const top = stack[stack.length - 1];
      if (!top) return i === text.length ? { offsets } : fail();
      if (text[i] === ',') {
        i += 1;
        top.count += 1;
        if (top.kind === 'object' && !readKey(top)) return fail();
        break;
      }
      if (text[i] === (top.kind === 'object' ? '}' : ']')) {
        i += 1;
        stack.pop();
        continue;
      }
      return fail();
    }
  }
}
