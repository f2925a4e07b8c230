import { createHash } from 'node:crypto';

/** The fields of one trail event that its hash covers (everything but id and hash). */
export interface TrailEventFields {
  at: string;
  actorId: number | null;
  action: string;
  subjectType: string;
  subjectId: string | null;
  oldValue: string | null;
  newValue: string | null;
  reason: string | null;
}

/** The hash every chain starts from. */
export const genesisHash = '0'.repeat(64);

/**
 * SHA-256 over the previous hash and the event's fields in a fixed order, so
 * changing, removing or reordering any event breaks every hash after it.
 */
export function chainHash(prevHash: string, e: TrailEventFields): string {
  const canonical = JSON.stringify([
    prevHash,
    e.at,
    e.actorId,
    e.action,
    e.subjectType,
    e.subjectId,
    e.oldValue,
    e.newValue,
    e.reason,
  ]);
  return createHash('sha256').update(canonical, 'utf8').digest('hex');
}

/** Index of the first event whose link or hash does not hold, or -1 when the chain is intact. */
export function firstBrokenLink(events: Array<TrailEventFields & { prevHash: string; hash: string }>): number {
  let prev = genesisHash;
  for (let i = 0; i < events.length; i += 1) {
    const e = events[i];
    if (e.prevHash !== prev || chainHash(prev, e) !== e.hash) return i;
    prev = e.hash;
  }
  return -1;
}
