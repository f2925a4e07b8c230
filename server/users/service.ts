import type { Role } from '../../lib/schemas/roles';
import type { UserSummary } from '../../lib/schemas/users';
import type { AccountDeps } from '../auth/deps';
import { createLink } from '../auth/links';
import { deleteSessionsOf, findUserByEmail, findUserById, rolesOf } from '../auth/repo';
import { HttpError } from '../http/errors';
import { recordEvent } from '../trail/service';
import { insertUser, listUsers, removeUnsentInvitation, replaceRoles, setActive } from './repo';

export async function allUsers(deps: AccountDeps): Promise<UserSummary[]> {
  return (await listUsers(deps.db)).map((r) => {
    const active = Boolean(r.active);
    return {
      id: r.id,
      email: r.email,
      displayName: r.display_name,
      roles: (r.roles ? r.roles.split(',') : []).sort() as Role[],
      active,
      status: !active ? 'deactivated' : r.has_password ? 'active' : 'invited',
    };
  });
}

async function summaryOf(deps: AccountDeps, userId: number): Promise<UserSummary> {
  return (await allUsers(deps)).find((u) => u.id === userId)!;
}

/**
 * Creates the account without a password and e-mails a single-use link to
 * set one. If the mail cannot be sent the account is removed again, so the
 * admin can simply retry.
 */
export async function invite(
  deps: AccountDeps,
  adminId: number,
  input: { email: string; displayName: string; roles: Role[] },
  base: string,
): Promise<UserSummary> {
  if (await findUserByEmail(deps.db, input.email)) {
    throw new HttpError(409, 'email-taken', 'Someone with this e-mail address already has an account.', { email: 'Already has an account.' });
  }
  const now = deps.now();
  const { userId, secret } = await deps.db.transaction(async (trx) => {
    const id = await insertUser(trx, input.email, input.displayName);
    await replaceRoles(trx, id, input.roles);
    return { userId: id, secret: await createLink(trx, 'invitation', id, adminId, now) };
  });
  try {
    await deps.mailer.send({
      to: input.email,
      subject: 'Hairline: you have been invited',
      text: [
        `Hello ${input.displayName},`,
        '',
        `You have been given a Hairline account (${input.roles.join(', ')}). To choose your password, open:`,
        '',
        `${base}/invitation#token=${secret}`,
        '',
        'The link works once, for three days.',
      ].join('\n'),
    });
  } catch (err) {
    await removeUnsentInvitation(deps.db, userId);
    if (err instanceof HttpError) throw err;
    throw new HttpError(503, 'mail-failed', 'The invitation e-mail could not be sent, so no account was created. Try again.');
  }
  await recordEvent(deps.db, { actorId: adminId, action: 'user.invited', subjectType: 'user', subjectId: userId, newValue: { email: input.email, roles: input.roles } }, now);
  return summaryOf(deps, userId);
}

/** Replaces a person's roles; an admin cannot take the admin role from themself. */
export async function changeRoles(deps: AccountDeps, adminId: number, userId: number, roles: Role[]): Promise<UserSummary> {
  const user = await findUserById(deps.db, userId);
  if (!user) throw new HttpError(404, 'not-found', 'Nobody has that id.');
  if (userId === adminId && !roles.includes('admin')) {
    throw new HttpError(409, 'own-admin-role', 'You cannot remove your own admin role; ask another admin.');
  }
  const before = await rolesOf(deps.db, userId);
  if (before.join(',') !== roles.join(',')) {
    const now = deps.now();
    await deps.db.transaction(async (trx) => {
      await replaceRoles(trx, userId, roles);
      await recordEvent(trx, { actorId: adminId, action: 'user.roles-changed', subjectType: 'user', subjectId: userId, oldValue: before, newValue: roles }, now);
    });
  }
  return summaryOf(deps, userId);
}

/** Deactivates a person: they can no longer sign in, and their sessions end now. */
export async function deactivate(deps: AccountDeps, adminId: number, userId: number, reason: string): Promise<UserSummary> {
  const user = await findUserById(deps.db, userId);
  if (!user) throw new HttpError(404, 'not-found', 'Nobody has that id.');
  if (userId === adminId) throw new HttpError(409, 'own-account', 'You cannot deactivate your own account.');
  if (user.active) {
    const now = deps.now();
    await deps.db.transaction(async (trx) => {
      await setActive(trx, userId, false);
      await deleteSessionsOf(trx, userId);
      await recordEvent(trx, { actorId: adminId, action: 'user.deactivated', subjectType: 'user', subjectId: userId, reason }, now);
    });
  }
  return summaryOf(deps, userId);
}
