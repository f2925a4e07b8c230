import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { parseEdgeList } from '../lib/formats';
import { demoNetworks } from './data/demo';

/**
 * Demo networks as first versions, read through the same parser an upload
 * uses; runs only on an empty networks table.
 */
export async function seed(knex: Knex): Promise<void> {
  const existing = await knex('networks').count<{ n: number }[]>({ n: '*' });
  if (Number(existing[0].n) > 0) return;
  const analyst = await knex('users').where({ email: 'analyst@gannet-sound.test' }).first('id');
  for (const net of demoNetworks) {
    const text = readFileSync(path.join(__dirname, 'data', net.file), 'utf8');
    const parsed = parseEdgeList(text, { format: 'csv' });
    if (!parsed.ok) throw new Error(`demo network ${net.file}: ${parsed.problems[0].message}`);
    const { nodes, edges } = parsed.edgeList;
    const [row] = await knex('networks')
      .insert({ name: net.name, description: net.description, convention: 'in', created_by: analyst?.id ?? null })
      .returning('id');
    const networkId = typeof row === 'object' ? row.id : row;
    await knex('network_versions').insert({
      network_id: networkId,
      version: 1,
      node_count: nodes.length,
      edge_count: edges.length,
      edges_json: JSON.stringify({ nodes, edges }),
      source_name: net.file,
      created_by: analyst?.id ?? null,
    });
  }
}
