import { forceCenter, forceCollide, forceLink, forceManyBody, forceSimulation, type SimulationNodeDatum } from 'd3-force';

export interface LaidOutNode extends SimulationNodeDatum {
  id: string;
  x: number;
  y: number;
}

export interface GraphLayout {
  nodes: LaidOutNode[];
  edges: { source: LaidOutNode; target: LaidOutNode; weight: number }[];
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
}

/**
 * A force-directed layout computed in one go (no animation): a fixed number
 * of ticks, scaled down for big networks so the page stays responsive. The
 * start positions are a circle, so the same network always lays out the same.
 */
export function layoutGraph(nodeIds: string[], edges: { source: string; target: string; weight: number }[]): GraphLayout {
  const n = nodeIds.length;
  const nodes: LaidOutNode[] = nodeIds.map((id, i) => ({
    id,
    x: Math.cos((2 * Math.PI * i) / n) * 10 * Math.sqrt(n),
    y: Math.sin((2 * Math.PI * i) / n) * 10 * Math.sqrt(n),
  }));
  const byId = new Map(nodes.map((d) => [d.id, d]));
  const links = edges.map((e) => ({ source: byId.get(e.source)!, target: byId.get(e.target)!, weight: e.weight }));
  const sim = forceSimulation(nodes)
    .force('charge', forceManyBody().strength(-60).distanceMax(400))
    .force('link', forceLink(links.map((l) => ({ source: l.source, target: l.target }))).distance(40).strength(0.4))
    .force('collide', forceCollide(9))
    .force('center', forceCenter(0, 0))
    .stop();
  const ticks = n > 1000 ? 60 : n > 300 ? 150 : 300;
  sim.tick(ticks);
  const xs = nodes.map((d) => d.x), ys = nodes.map((d) => d.y);
  return {
    nodes,
    edges: links,
    bounds: { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) },
  };
}

/** The arrowhead triangle for an edge, its tip `gap` short of the target's centre. */
export function arrowHead(sx: number, sy: number, tx: number, ty: number, gap: number, size: number): string {
  const dx = tx - sx, dy = ty - sy;
  const len = Math.hypot(dx, dy) || 1;
  const ux = dx / len, uy = dy / len;
  const px = tx - ux * gap, py = ty - uy * gap;
  const bx = px - ux * size, by = py - uy * size;
  const half = size * 0.5;
  return `${px},${py} ${bx - uy * half},${by + ux * half} ${bx + uy * half},${by - ux * half}`;
}
