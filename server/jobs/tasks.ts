import { summariseNetwork, type SpectralNetwork } from '../../lib/spectral';
import type { Convention } from '../../lib/schemas/network';

/**
 * The work that runs on the worker pool, off the event loop. Tasks are plain
 * data in and out (structured clone), so the same code runs in-process too.
 */
export type Task = { kind: 'summary'; network: SpectralNetwork; convention: Convention };

export function runTask(task: Task): unknown {
  switch (task.kind) {
    case 'summary':
      return summariseNetwork(task.network, { convention: task.convention });
    default:
      throw new Error(`unknown task ${(task as { kind: string }).kind}`);
  }
}
