import type { Knex } from 'knex';
import { detectFormat, parseEdgeList, type EdgeList, type ImportFormat } from '../../lib/formats';
import type {
  ImportResult,
  NetworkDetail,
  NetworkListItem,
  VersionDetail,
  VersionDiff,
  VersionInfo,
} from '../../lib/schemas/network';
import { importRequestSchema, versionSummarySchema } from '../../lib/schemas/network';
import type { RequestUser } from '../auth/require-roles';
import { HttpError } from '../http/errors';
import * as repo from './repo';
import type { SummaryQueue } from './summaries';

export interface NetworkDeps {
  db: Knex;
  summaries: SummaryQueue;
  limits: { maxNodes: number; maxEdges: number };
}

type ImportInput = ReturnType<typeof importRequestSchema.parse>;

/**
 * Parses and validates first, then stores the network (or its next version)
 * in one transaction: a rejected import stores nothing. The spectrum summary
 * is computed afterwards on the worker pool.
 */
export async function importNetwork(deps: NetworkDeps, user: RequestUser, input: ImportInput, text: string): Promise<ImportResult> {
  const format = chooseFormat(input.format, text, input.fileName);
  const parsed = parseEdgeList(text, { ...input.options, format, limits: deps.limits });
  if (!parsed.ok) {
    const n = parsed.problems.length;
    throw new HttpError(422, 'import-rejected', `The file was not imported: ${n} problem${n === 1 ? '' : 's'} to fix.`, undefined, parsed.problems);
  }
  if (parsed.edgeList.nodes.length < 2) {
    throw new HttpError(422, 'import-rejected', 'A network needs at least two nodes and one edge.');
  }
  const stored = await deps.db.transaction(async (trx) => {
    let networkId = input.networkId;
    if (networkId) {
      if (!(await repo.findNetwork(trx, networkId))) throw new HttpError(404, 'not-found', `Network ${networkId} does not exist.`);
    } else {
      if (await repo.findNetworkByName(trx, input.name!)) {
        throw new HttpError(409, 'name-taken', `A network named "${input.name}" already exists; import into it as a new version, or choose another name.`, { name: 'already in use' });
      }
      networkId = await repo.insertNetwork(trx, { name: input.name!, description: input.description, convention: input.convention, createdBy: user.id });
    }
    const v = await repo.insertVersion(trx, { networkId, edgeList: parsed.edgeList, sourceName: input.fileName ?? 'pasted text', createdBy: user.id });
    return { networkId, ...v };
  });
  void deps.summaries.schedule(stored.id);
  return { networkId: stored.networkId, version: stored.version, warnings: parsed.warnings };
}

function chooseFormat(claimed: ImportFormat | undefined, text: string, fileName?: string): ImportFormat {
  if (claimed) return claimed;
  const d = detectFormat(text, fileName);
  if (d.format) return d.format;
  throw new HttpError(422, 'format-unknown', 'Could not tell the file format; choose CSV, TSV, JSON or GraphML.', { format: 'required' });
}

export async function listNetworks(db: Knex, q: string | undefined, sort: 'name' | 'updated' | 'nodes' | 'lambda2'): Promise<NetworkListItem[]> {
  const rows = await repo.listNetworksWithLatest(db, q);
  const items = rows.map((r) => toListItem(r, r.latest));
  const by: Record<typeof sort, (a: NetworkListItem, b: NetworkListItem) => number> = {
    name: (a, b) => a.name.localeCompare(b.name),
    updated: (a, b) => b.latest.createdAt.localeCompare(a.latest.createdAt) || b.id - a.id,
    nodes: (a, b) => b.latest.nodeCount - a.latest.nodeCount,
    lambda2: (a, b) => (b.latest.lambda2Re ?? -Infinity) - (a.latest.lambda2Re ?? -Infinity),
  };
  return items.sort(by[sort]);
}

export async function networkDetail(db: Knex, id: number): Promise<NetworkDetail> {
  const net = await repo.findNetwork(db, id);
  if (!net) throw new HttpError(404, 'not-found', `Network ${id} does not exist.`);
  const versions = (await repo.listVersions(db, id)).map(toVersionInfo);
  return { ...toListItem(net, null), latest: versions[0], versions };
}

export async function versionDetail(db: Knex, networkId: number, version: number): Promise<VersionDetail> {
  const net = await repo.findNetwork(db, networkId);
  const row = net && (await repo.findVersion(db, networkId, version));
  if (!net || !row) throw new HttpError(404, 'not-found', `Network ${networkId} has no version ${version}.`);
  const list: EdgeList = JSON.parse(row.edges_json);
  const summary = row.summary_json ? versionSummarySchema.parse(JSON.parse(row.summary_json)) : null;
  return { ...toVersionInfo(row), networkId, convention: net.convention, summary, nodes: list.nodes, edges: list.edges };
}

/** Edges added, removed and re-weighted between two versions, keyed by source→target. */
export async function diffVersions(db: Knex, networkId: number, from: number, to: number): Promise<VersionDiff> {
  const [a, b] = await Promise.all([repo.findVersion(db, networkId, from), repo.findVersion(db, networkId, to)]);
  if (!a || !b) throw new HttpError(404, 'not-found', `Network ${networkId} has no version ${!a ? from : to}.`);
  return diffEdgeLists(JSON.parse(a.edges_json), JSON.parse(b.edges_json), from, to);
}

export function diffEdgeLists(before: EdgeList, after: EdgeList, from: number, to: number): VersionDiff {
  const key = (e: { source: string; target: string }) => `${e.source}\u0000${e.target}`;
  const old = new Map(before.edges.map((e) => [key(e), e]));
  const now = new Map(after.edges.map((e) => [key(e), e]));
  const diff: VersionDiff = { from, to, added: [], removed: [], reweighted: [] };
  for (const [k, e] of now) {
    const o = old.get(k);
    if (!o) diff.added.push(e);
    else if (o.weight !== e.weight) diff.reweighted.push({ source: e.source, target: e.target, before: o.weight, after: e.weight });
  }
  for (const [k, e] of old) if (!now.has(k)) diff.removed.push(e);
  return diff;
}

function toVersionInfo(v: repo.VersionRow): VersionInfo {
  return {
    version: v.version,
    nodeCount: v.node_count,
    edgeCount: v.edge_count,
    sourceName: v.source_name,
    createdAt: String(v.created_at),
    createdBy: v.created_by_name,
    summaryState: v.summary_state,
    summaryError: v.summary_error,
    lambda2Re: v.lambda2_re,
  };
}

function toListItem(n: repo.NetworkRow, latest: repo.VersionRow | null): NetworkListItem {
  return {
    id: n.id,
    name: n.name,
    description: n.description,
    convention: n.convention,
    createdAt: String(n.created_at),
    latest: latest ? toVersionInfo(latest) : (undefined as unknown as VersionInfo),
  };
}
