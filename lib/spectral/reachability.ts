/**
 * Who can reach whom, found by a graph search rather than read off the spectrum.
 *
 * Consensus is reached from any start exactly when some node's information reaches every node
 * (a spanning tree rooted there, oriented the way information flows). Then 0 is a simple eigenvalue
 * and Re λ2 > 0. Otherwise the network splits into several "leader groups" — strongly connected
 * groups that hear nobody outside themselves — each of which contributes its own zero eigenvalue,
 * and λ2 = 0: the groups never agree. Weight-0 probe edges carry no information and are ignored.
 */
import type { Reachability } from './types';
import type { EdgeSlot } from './laplacian';

/**
 * Information flows from the heard node (col) to the listener (row), whatever the convention,
 * so the search follows col → row.
 */
function flowAdjacency(n: number, slots: EdgeSlot[], weights: number[]): number[][] {
  const out: number[][] = Array.from({ length: n }, () => []);
  slots.forEach(({ row, col }, k) => {
    if (weights[k] > 0 && row !== col) out[col].push(row);
  });
  return out;
}

/** Strongly connected components (iterative Tarjan). Returns a component id per node. */
function strongComponents(adj: number[][]): { comp: number[]; count: number } {
  const n = adj.length;
  const order = new Array<number>(n).fill(-1);
  const low = new Array<number>(n).fill(0);
  const onStack = new Array<boolean>(n).fill(false);
  const comp = new Array<number>(n).fill(-1);
  const stack: number[] = [];
  let counter = 0;
  let count = 0;
  for (let start = 0; start < n; start++) {
    if (order[start] !== -1) continue;
    const frames: { v: number; next: number }[] = [{ v: start, next: 0 }];
    order[start] = low[start] = counter++;
    stack.push(start);
    onStack[start] = true;
    while (frames.length > 0) {
      const frame = frames[frames.length - 1];
      const v = frame.v;
      if (frame.next < adj[v].length) {
        const w = adj[v][frame.next++];
        if (order[w] === -1) {
          order[w] = low[w] = counter++;
          stack.push(w);
          onStack[w] = true;
          frames.push({ v: w, next: 0 });
        } else if (onStack[w]) {
          low[v] = Math.min(low[v], order[w]);
        }
        continue;
      }
      frames.pop();
      if (frames.length > 0) {
        const parent = frames[frames.length - 1].v;
        low[parent] = Math.min(low[parent], low[v]);
      }
      if (low[v] === order[v]) {
        let w: number;
        do {
          w = stack.pop() as number;
          onStack[w] = false;
          comp[w] = count;
        } while (w !== v);
        count += 1;
      }
    }
  }
  return { comp, count };
}

function reachFrom(adj: number[][], starts: number[]): boolean[] {
  const seen = new Array<boolean>(adj.length).fill(false);
  const queue = [...starts];
  for (const s of starts) seen[s] = true;
  while (queue.length > 0) {
    const v = queue.pop() as number;
    for (const w of adj[v]) {
      if (!seen[w]) {
        seen[w] = true;
        queue.push(w);
      }
    }
  }
  return seen;
}

/**
 * Leader groups are the strong components with no inflow from other components. The network is
 * rooted iff there is exactly one; its members are then the roots. If there are several, the group
 * that reaches the most nodes is taken as the main one and everything it does not reach is cut off.
 */
export function analyseReachability(nodes: string[], slots: EdgeSlot[], weights: number[]): Reachability {
  const n = nodes.length;
  const adj = flowAdjacency(n, slots, weights);
  const { comp, count } = strongComponents(adj);
  const hasInflow = new Array<boolean>(count).fill(false);
  for (let v = 0; v < n; v++) {
    for (const w of adj[v]) if (comp[v] !== comp[w]) hasInflow[comp[w]] = true;
  }
  const groups: number[][] = [];
  const groupOfComp = new Map<number, number>();
  for (let v = 0; v < n; v++) {
    const c = comp[v];
    if (hasInflow[c]) continue;
    if (!groupOfComp.has(c)) {
      groupOfComp.set(c, groups.length);
      groups.push([]);
    }
    groups[groupOfComp.get(c) as number].push(v);
  }
  const leaderGroups = groups.map((g) => g.map((v) => nodes[v]));
  if (groups.length === 1) {
    return { rooted: true, roots: leaderGroups[0], cutOff: [], leaderGroups };
  }
  let best: boolean[] = [];
  let bestCount = -1;
  let bestSize = -1;
  for (const g of groups) {
    const seen = reachFrom(adj, g);
    const reached = seen.filter(Boolean).length;
    if (reached > bestCount || (reached === bestCount && g.length > bestSize)) {
      best = seen;
      bestCount = reached;
      bestSize = g.length;
    }
  }
  const cutOff = nodes.filter((_, v) => !best[v]);
  return { rooted: false, roots: [], cutOff, leaderGroups };
}
