/**
 * The promise's outcome, or a rejection after `ms`. Redis commands wait out
 * reconnects without limit (BullMQ asks for that), so every wait for Redis that
 * a person or a start-up is blocked on goes through here. The losing promise
 * is not cancelled: it settles later, unread.
 */
export function withTimeout<T>(p: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout;
  return Promise.race([
    p,
    new Promise<T>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`no answer within ${ms / 1000} s`)), ms);
    }),
  ]).finally(() => clearTimeout(timer));
}
