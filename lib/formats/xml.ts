/**
 * The XML layer under the GraphML reader. Safety first: a DOCTYPE or ENTITY
 * declaration is refused before any parser sees the text, so there is no
 * entity expansion ("billion laughs") and no external entity fetch to defend
 * against. Only XML's five predefined entities and numeric character
 * references are decoded, by hand, after parsing.
 */
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { LineIndex } from './lines';
import { atLine, quote, type ProblemList } from './problems';

export type XmlElement = Record<string, unknown>;

/** Element names that may repeat in GraphML; always read as lists so one and many look alike. */
const LIST_ELEMENTS = new Set(['key', 'graph', 'node', 'edge', 'data', 'hyperedge', 'port']);

const META = XMLParser.getMetaDataSymbol() as unknown as symbol;

export type ParsedXml = { root: string; doc: XmlElement; lines: LineIndex };

/** Parse well-formed, declaration-free XML; report and return undefined otherwise. */
export function parseXml(text: string, problems: ProblemList): ParsedXml | undefined {
  const lines = new LineIndex(text);
  const declaration = /<!\s*(DOCTYPE|ENTITY)\b/i.exec(text);
  if (declaration) {
    problems.report(
      'entity-declaration',
      atLine(lines.lineAt(declaration.index)),
      `the file contains a <!${declaration[1].toUpperCase()}> declaration; Hairline does not read DTDs or entity definitions. Delete the declaration and import again`,
    );
    return undefined;
  }
  const valid = XMLValidator.validate(text, { allowBooleanAttributes: false });
  if (valid !== true) {
    const where = typeof valid.err.line === 'number' ? atLine(valid.err.line) : undefined;
    problems.report('malformed', where, `the XML is not well-formed here (${valid.err.msg}); fix the markup or export the file again`);
    return undefined;
  }
  let doc: XmlElement;
  try {
    const parser = new XMLParser({
      ignoreAttributes: false,
      attributeNamePrefix: '@_',
      removeNSPrefix: true,
      processEntities: false,
      htmlEntities: false,
      parseTagValue: false,
      parseAttributeValue: false,
      ignoreDeclaration: true,
      ignorePiTags: true,
      captureMetaData: true,
      isArray: (name, _path, _leaf, isAttribute) => !isAttribute && LIST_ELEMENTS.has(name),
    });
    doc = parser.parse(text) as XmlElement;
  } catch (err) {
    // The validator passed, so this is a limit such as nesting depth; still the user's file to fix.
    const detail = err instanceof Error ? err.message : String(err);
    const advice = /nest/i.test(detail) ? 'GraphML needs only a few levels of nesting' : 'check the markup';
    problems.report('malformed', undefined, `the XML could not be read (${detail}); ${advice}, and export the network again`);
    return undefined;
  }
  const root = Object.keys(doc).find((k) => !k.startsWith('?') && !k.startsWith('#')) ?? '';
  return { root, doc, lines };
}

/** Line where an element starts, when the parser recorded it. */
export function elementLine(element: unknown, lines: LineIndex): number | undefined {
  if (typeof element !== 'object' || element === null) return undefined;
  const meta = (element as Record<symbol, { startIndex?: number } | undefined>)[META];
  return typeof meta?.startIndex === 'number' ? lines.lineAt(meta.startIndex) : undefined;
}

export function attr(element: XmlElement, name: string): string | undefined {
  const value = element[`@_${name}`];
  return typeof value === 'string' ? value : undefined;
}

export function children(element: XmlElement, name: string): XmlElement[] {
  const value = element[name];
  if (!Array.isArray(value)) return [];
  // Elements holding only text come back as strings; wrap them so callers see one shape.
  return value.map((v) => (typeof v === 'object' && v !== null ? (v as XmlElement) : { '#text': String(v) }));
}

export function textOf(element: XmlElement | string | undefined): string {
  if (element === undefined) return '';
  if (typeof element === 'string') return element;
  const t = element['#text'];
  return typeof t === 'string' || typeof t === 'number' ? String(t) : '';
}

const PREDEFINED: Record<string, string> = { lt: '<', gt: '>', amp: '&', apos: "'", quot: '"' };

/** Decode predefined and numeric references; anything else is an undeclared entity and is reported. */
export function decodeXml(raw: string): { text: string; unknown?: string } {
  if (!raw.includes('&')) return { text: raw };
  let unknown: string | undefined;
  const text = raw.replace(/&(#x[0-9a-fA-F]+|#[0-9]+|[A-Za-z_][\w.-]*);/g, (whole, ref: string) => {
    if (ref.startsWith('#')) {
      const code = ref[1] === 'x' ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10);
      if (code > 0 && code <= 0x10ffff) return String.fromCodePoint(code);
      unknown ??= whole;
      return whole;
    }
    if (Object.hasOwn(PREDEFINED, ref)) return PREDEFINED[ref];
    unknown ??= whole;
    return whole;
  });
  return unknown === undefined ? { text } : { text, unknown: quote(unknown) };
}
