import type { Knex } from 'knex';
import type { EdgeList } from '../../lib/formats';

/** SQL for networks and their versions; no rules here, only storage. */

export interface VersionRow {
  id: number;
  network_id: number;
  version: number;
  node_count: number;
  edge_count: number;
  edges_json: string;
  summary_json: string | null;
  summary_state: 'pending' | 'ready' | 'failed';
  summary_error: string | null;
  lambda2_re: number | null;
  source_name: string;
  created_at: string;
  created_by_name: string | null;
}

export interface NetworkRow {
  id: number;
  name: string;
  description: string;
  convention: 'in' | 'out';
  created_at: string;
  updated_at: string | null;
}

const versionColumns = [
  'v.id', 'v.network_id', 'v.version', 'v.node_count', 'v.edge_count', 'v.summary_state', 'v.summary_error',
  'v.lambda2_re', 'v.source_name', 'v.created_at', 'u.display_name as created_by_name',
];

function versions(db: Knex) {
  return db('network_versions as v').leftJoin('users as u', 'u.id', 'v.created_by');
}

export async function listNetworksWithLatest(db: Knex, q?: string): Promise<Array<NetworkRow & { latest: VersionRow }>> {
  const query = db('networks as n').select('n.*');
  if (q) {
    // Search text is literal: % and _ typed by a user match themselves.
    const pattern = `%${q.replace(/[%_\\]/g, (c) => '\\' + c)}%`;
    query.whereRaw("(n.name like ? escape '\\' or n.description like ? escape '\\')", [pattern, pattern]);
  }
  const nets: NetworkRow[] = await query;
  if (nets.length === 0) return [];
  const latest: VersionRow[] = await versions(db)
    .select(versionColumns)
    .whereIn('v.network_id', nets.map((n) => n.id))
    .whereRaw('v.version = (select max(version) from network_versions where network_id = v.network_id)');
  const byNetwork = new Map(latest.map((v) => [v.network_id, v]));
  return nets.filter((n) => byNetwork.has(n.id)).map((n) => ({ ...n, latest: byNetwork.get(n.id)! }));
}

export async function findNetwork(db: Knex, id: number): Promise<NetworkRow | undefined> {
  return db('networks').where({ id }).first();
}

export async function findNetworkByName(db: Knex, name: string): Promise<NetworkRow | undefined> {
  return db('networks').whereRaw('lower(name) = lower(?)', [name]).first();
}

export async function listVersions(db: Knex, networkId: number): Promise<VersionRow[]> {
  return versions(db).select(versionColumns).where('v.network_id', networkId).orderBy('v.version', 'desc');
}

export async function findVersion(db: Knex, networkId: number, version: number): Promise<VersionRow | undefined> {
  return versions(db)
    .select([...versionColumns, 'v.edges_json', 'v.summary_json'])
    .where({ 'v.network_id': networkId, 'v.version': version })
    .first();
}

export async function findVersionById(db: Knex, id: number): Promise<(VersionRow & { convention: 'in' | 'out' }) | undefined> {
  return versions(db)
    .join('networks as n', 'n.id', 'v.network_id')
    .select([...versionColumns, 'v.edges_json', 'n.convention'])
    .where('v.id', id)
    .first();
}

export async function insertNetwork(
  trx: Knex,
  row: { name: string; description: string; convention: 'in' | 'out'; createdBy: number | null },
): Promise<number> {
  const [r] = await trx('networks')
    .insert({ name: row.name, description: row.description, convention: row.convention, created_by: row.createdBy, updated_at: trx.fn.now() })
    .returning('id');
  return typeof r === 'object' ? r.id : r;
}

export async function insertVersion(
  trx: Knex,
  row: { networkId: number; edgeList: EdgeList; sourceName: string; createdBy: number | null },
): Promise<{ id: number; version: number }> {
  const last = await trx('network_versions').where({ network_id: row.networkId }).max<{ v: number | null }>({ v: 'version' }).first();
  const version = (last?.v ?? 0) + 1;
  const [r] = await trx('network_versions')
    .insert({
      network_id: row.networkId,
      version,
      node_count: row.edgeList.nodes.length,
      edge_count: row.edgeList.edges.length,
      edges_json: JSON.stringify(row.edgeList),
      source_name: row.sourceName,
      created_by: row.createdBy,
    })
    .returning('id');
  await trx('networks').where({ id: row.networkId }).update({ updated_at: trx.fn.now() });
  return { id: typeof r === 'object' ? r.id : r, version };
}

export async function storeSummary(
  db: Knex,
  versionId: number,
  result: { state: 'ready'; summaryJson: string; lambda2Re: number } | { state: 'failed'; error: string },
): Promise<void> {
  await db('network_versions')
    .where({ id: versionId })
    .update(
      result.state === 'ready'
        ? { summary_state: 'ready', summary_json: result.summaryJson, lambda2_re: result.lambda2Re, summary_error: null }
        : { summary_state: 'failed', summary_error: result.error },
    );
}

export async function pendingSummaryIds(db: Knex): Promise<number[]> {
  return (await db('network_versions').where({ summary_state: 'pending' }).select('id')).map((r) => r.id);
}
