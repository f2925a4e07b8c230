import { analyseBaseline, auditEdge, summariseNetwork, type EdgeResult, type SpectralBaseline, type SpectralNetwork, type SpectralOptions } from '../../lib/spectral';
import type { Convention } from '../../lib/schemas/network';

/**
 * The work that runs on the worker pool, off the event loop. Tasks are plain
 * data in and out (structured clone), so the same code runs in-process too.
 */
export type Task =
  | { kind: 'summary'; network: SpectralNetwork; convention: Convention }
  | { kind: 'audit-baseline'; network: SpectralNetwork; options: SpectralOptions }
  | { kind: 'audit-chunk'; network: SpectralNetwork; baseline: SpectralBaseline; options: SpectralOptions; edgeIndices: number[] };

export function runTask(task: Task): unknown {
  switch (task.kind) {
    case 'summary':
      return summariseNetwork(task.network, { convention: task.convention });
    case 'audit-baseline':
      return analyseBaseline(task.network, task.options);
    case 'audit-chunk':
      return task.edgeIndices.map((i): EdgeResult => auditEdge(task.network, task.baseline, i, task.options));
    default:
      throw new Error(`unknown task ${(task as { kind: string }).kind}`);
  }
}
