/**
 * For the import form: which edge keys a GraphML file declares, so the user
 * can pick the weight from a list instead of typing an id.
 */
import { edgeKeys, readKeys } from './graphml-keys';
import { normaliseText } from './lines';
import { ProblemList } from './problems';
import { parseXml, type XmlElement } from './xml';
import type { ImportProblem } from './types';

export type GraphmlKeyChoice = { id: string; name?: string; hasDefault: boolean };

export function listGraphmlEdgeKeys(text: string): { ok: true; keys: GraphmlKeyChoice[] } | { ok: false; problems: ImportProblem[] } {
  const problems = new ProblemList();
  const parsed = parseXml(normaliseText(text), problems);
  if (!parsed) return { ok: false, problems: problems.list() };
  const root = parsed.doc[parsed.root];
  const graphml = (Array.isArray(root) ? root[0] : root) as XmlElement | undefined;
  if (parsed.root !== 'graphml' || typeof graphml !== 'object' || graphml === null) {
    return { ok: false, problems: [{ code: 'wrong-format', message: `This XML file's root element is <${parsed.root}>, not <graphml>` }] };
  }
  const keys = edgeKeys(readKeys(graphml)).map((k) => {
    const choice: GraphmlKeyChoice = { id: k.id, hasDefault: k.defaultValue !== undefined };
    if (k.name !== undefined) choice.name = k.name;
    return choice;
  });
  return { ok: true, keys };
}
