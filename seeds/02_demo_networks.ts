import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { demoNetworks } from './data/demo';

/** Demo networks as first versions; runs only on an empty networks table. */
export async function seed(knex: Knex): Promise<void> {
  const existing = await knex('networks').count<{ n: number }[]>({ n: '*' });
  if (Number(existing[0].n) > 0) return;
  const analyst = await knex('users').where({ email: 'analyst@gannet-sound.test' }).first('id');
  for (const net of demoNetworks) {
    const text = readFileSync(path.join(__dirname, 'data', net.file), 'utf8');
    const edges = text
      .trim()
      .split(/\r?\n/)
      .slice(1)
      .map((line) => {
        const [source, target, weight] = line.split(',');
        return { source, target, weight: Number(weight) };
      });
    const nodes = [...new Set(edges.flatMap((e) => [e.source, e.target]))];
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
