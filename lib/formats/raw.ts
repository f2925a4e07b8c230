/**
 * What each format reader hands to the shared validation: rows still in their
 * raw form (text weights, unchecked names) plus where they came from. Readers
 * report only what is specific to their syntax; everything that applies to
 * every format is checked once, in validate.ts.
 */
import type { Where } from './problems';

/** A weight as read: text (CSV, GraphML, JSON strings) or an already-parsed JSON number. */
export type RawWeight = { text: string } | { value: number };

export type RawEdge = {
  where: Where;
  /** undefined: the reader already reported why there is no usable name. */
  source: string | undefined;
  target: string | undefined;
  /** undefined: the reader already reported the missing weight. */
  weight: RawWeight | undefined;
  /** Enter this edge in both directions (an undirected edge the caller chose to accept). */
  bothWays: boolean;
};

export type RawNode = { where: Where; name: string | undefined };

export type RawImport = {
  edges: RawEdge[];
  /** Present when the file declares its nodes (JSON `nodes`, GraphML `<node>`). */
  nodes?: RawNode[];
  /** A fatal structural fault: the rows, if any, are not worth validating. */
  fatal: boolean;
};
