/** Errors the engine throws on purpose. Both carry a stable `code` so callers need not match messages. */

/** The network handed to the engine cannot be analysed (unknown node, negative or non-finite weight, …). */
export class SpectralInputError extends Error {
  readonly code = 'spectral-input';
  constructor(message: string) {
    super(message);
    this.name = 'SpectralInputError';
  }
}

/** A sweep stopped because its `isCancelled` hook returned true. */
export class SweepCancelledError extends Error {
  readonly code = 'sweep-cancelled';
  /** Edges finished before the sweep stopped. */
  readonly done: number;
  readonly total: number;
  constructor(done: number, total: number) {
    super(`sweep cancelled after ${done} of ${total} edges`);
    this.name = 'SweepCancelledError';
    this.done = done;
    this.total = total;
  }
}
