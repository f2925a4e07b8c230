import type { Me } from '../../lib/schemas/auth';
import { HttpError } from '../http/errors';
import { recordEvent } from '../trail/service';
import type { AccountDeps } from './deps';
import { createLink, spendLink } from './links';
import { hashPassword, verifyPassword } from './passwords';
import {
  backoffOf,
  clearBackoff,
  deleteSessionsOf,
  findUserByEmail,
  findUserById,
  rolesOf,
  saveBackoff,
  setPasswordHash,
  type UserRow,
} from './repo';

/** Failures allowed before an address starts cooling off, and the pause that then doubles. */
export const backoff = { freeFailures: 5, firstPauseMs: 30_000, maxPauseMs: 15 * 60_000 };

const wrongCredentials = () =>
  new HttpError(401, 'wrong-credentials', 'That e-mail and password do not match an active account.');

export async function toMe(deps: AccountDeps, user: UserRow): Promise<Me> {
  return { id: user.id, email: user.email, displayName: user.display_name, roles: await rolesOf(deps.db, user.id) };
}

/**
 * Checks an e-mail and password. Every failure is written to the trail; after
 * `freeFailures` failures in a row an address is paused, and each further
 * failure doubles the pause. The same message answers unknown addresses,
 * wrong passwords and deactivated accounts.
 */
export async function signIn(deps: AccountDeps, email: string, password: string): Promise<Me> {
  const { db } = deps;
  const now = deps.now();
  const state = await backoffOf(db, email);
  if (state.blockedUntil > now) {
    const seconds = Math.ceil((state.blockedUntil - now) / 1000);
    await recordEvent(db, { actorId: null, action: 'sign-in.failed', subjectType: 'account', subjectId: email, reason: 'paused after repeated failures' }, now);
    throw new HttpError(429, 'sign-in-paused', `Too many failed sign-ins for this address. Try again in ${seconds} s.`);
  }
  const user = await findUserByEmail(db, email);
  const ok = await verifyPassword(user?.password_hash ?? null, password);
  const active = Boolean(user?.active);
  if (!user || !ok || !active) {
    const failures = state.failures + 1;
    const over = failures - backoff.freeFailures;
    const pause = over >= 0 ? Math.min(backoff.firstPauseMs * 2 ** over, backoff.maxPauseMs) : 0;
    await saveBackoff(db, email, failures, pause ? now + pause : 0);
    const reason = !user ? 'unknown address' : !user.password_hash ? 'invitation not accepted' : !ok ? 'wrong password' : 'account deactivated';
    await recordEvent(db, { actorId: null, action: 'sign-in.failed', subjectType: 'account', subjectId: email, reason }, now);
    throw wrongCredentials();
  }
  await clearBackoff(db, email);
  return toMe(deps, user);
}

/** Changes the signed-in person's password and ends their other sessions. */
export async function changePassword(deps: AccountDeps, userId: number, current: string, next: string, keepSid: string): Promise<void> {
  const user = await findUserById(deps.db, userId);
  if (!user || !(await verifyPassword(user.password_hash, current))) {
    throw new HttpError(422, 'invalid', 'Some fields need another look.', { currentPassword: 'This is not your current password.' });
  }
  await setPasswordHash(deps.db, userId, await hashPassword(next));
  await deleteSessionsOf(deps.db, userId, keepSid);
  await recordEvent(deps.db, { actorId: userId, action: 'password.changed', subjectType: 'user', subjectId: userId }, deps.now());
}

/** Sets the first password from an invitation link. */
export async function acceptInvitation(deps: AccountDeps, token: string, password: string): Promise<{ email: string }> {
  const hash = await hashPassword(password);
  const now = deps.now();
  return deps.db.transaction(async (trx) => {
    const userId = await spendLink(trx, 'invitation', token, now);
    const user = await findUserById(trx, userId);
    if (!user || !user.active) throw new HttpError(409, 'account-inactive', 'This account has been deactivated.');
    await setPasswordHash(trx, userId, hash);
    await recordEvent(trx, { actorId: userId, action: 'invitation.accepted', subjectType: 'user', subjectId: userId }, now);
    return { email: user.email };
  });
}

/**
 * Sends a reset link when the address belongs to an active account with a
 * password; answers the same either way so addresses cannot be probed.
 */
export async function requestReset(deps: AccountDeps, email: string, base: string): Promise<void> {
  const user = await findUserByEmail(deps.db, email);
  if (!user || !user.active || !user.password_hash) return;
  const now = deps.now();
  const secret = await createLink(deps.db, 'reset', user.id, null, now);
  await recordEvent(deps.db, { actorId: null, action: 'password.reset-requested', subjectType: 'user', subjectId: user.id }, now);
  await deps.mailer.send({
    to: user.email,
    subject: 'Hairline: choose a new password',
    text: [
      `Hello ${user.display_name},`,
      '',
      'Someone asked to reset the password of your Hairline account. To choose a new one, open:',
      '',
      `${base}/reset-password#token=${secret}`,
      '',
      'The link works once, for one hour. If you did not ask, ignore this message; your password stays as it is.',
    ].join('\n'),
  });
}

/** Sets a new password from a reset link and ends the account's sessions. */
export async function completeReset(deps: AccountDeps, token: string, password: string): Promise<{ email: string }> {
  const hash = await hashPassword(password);
  const now = deps.now();
  const result = await deps.db.transaction(async (trx) => {
    const userId = await spendLink(trx, 'reset', token, now);
    const user = await findUserById(trx, userId);
    if (!user || !user.active) throw new HttpError(409, 'account-inactive', 'This account has been deactivated.');
    await setPasswordHash(trx, userId, hash);
    await deleteSessionsOf(trx, userId);
    await recordEvent(trx, { actorId: userId, action: 'password.reset', subjectType: 'user', subjectId: userId }, now);
    return { email: user.email, userId };
  });
  await clearBackoff(deps.db, result.email);
  return { email: result.email };
}
