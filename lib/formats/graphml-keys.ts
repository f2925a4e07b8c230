/**
 * GraphML <key> declarations and the user's choice of which one is the weight.
 * The choice is never guessed: a file may carry several numeric edge
 * attributes (capacity, delay, gain), and analysing the wrong one would give a
 * plausible-looking but meaningless spectrum.
 */
import { quote, type ProblemList } from './problems';
import { attr, children, decodeXml, textOf, type XmlElement } from './xml';

export type GraphmlKey = { id: string; for: string; name?: string; defaultValue?: string };

export function readKeys(graphml: XmlElement): GraphmlKey[] {
  const keys: GraphmlKey[] = [];
  for (const key of children(graphml, 'key')) {
    const id = attr(key, 'id');
    if (id === undefined) continue; // an id-less key cannot be referenced by any <data>, so it cannot be the weight
    const name = attr(key, 'attr.name');
    const def = key.default;
    keys.push({
      id,
      // GraphML's default for the `for` attribute is "all".
      for: attr(key, 'for') ?? 'all',
      name: name === undefined ? undefined : decodeXml(name).text,
      defaultValue: def === undefined ? undefined : decodeXml(textOf(def as XmlElement | string)).text,
    });
  }
  return keys;
}

/** The keys an edge can carry, for the import form to offer as choices. */
export function edgeKeys(keys: GraphmlKey[]): GraphmlKey[] {
  return keys.filter((k) => k.for === 'edge' || k.for === 'all');
}

function describeKey(k: GraphmlKey): string {
  return k.name === undefined ? `id ${quote(k.id)}` : `id ${quote(k.id)} (attr.name ${quote(k.name)})`;
}

export function chooseWeightKey(keys: GraphmlKey[], wanted: string | undefined, problems: ProblemList): GraphmlKey | undefined {
  const forEdges = edgeKeys(keys);
  const offered = forEdges.length
    ? `this file declares these edge keys: ${forEdges.map(describeKey).join('; ')}`
    : 'this file declares no <key for="edge">, so its edges carry no weight; add a weight attribute to the export';
  if (wanted === undefined || wanted.trim() === '') {
    problems.report('missing-weight-key', undefined, `choose which edge key holds the weight — ${offered}`);
    return undefined;
  }
  const byId = forEdges.find((k) => k.id === wanted);
  if (byId) return byId;
  const byName = forEdges.filter((k) => k.name === wanted);
  if (byName.length === 1) return byName[0];
  if (byName.length > 1) {
    problems.report(
      'ambiguous-weight-key',
      undefined,
      `${byName.length} edge keys have attr.name ${quote(wanted)} (${byName.map(describeKey).join('; ')}); choose one of them by its id`,
    );
    return undefined;
  }
  const loose = forEdges.filter((k) => k.id.toLowerCase() === wanted.toLowerCase() || k.name?.toLowerCase() === wanted.toLowerCase());
  if (loose.length === 1) return loose[0];
  const elsewhere = keys.find((k) => k.id === wanted || k.name === wanted);
  const why = elsewhere
    ? `key ${describeKey(elsewhere)} is declared for ${elsewhere.for} elements, not edges`
    : `no edge key has id or attr.name ${quote(wanted)}`;
  problems.report('missing-weight-key', undefined, `${why}; ${offered}`);
  return undefined;
}
