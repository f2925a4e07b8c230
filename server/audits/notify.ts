import type { Knex } from 'knex';
import type { Role } from '../../lib/schemas/roles';
import type { Mailer } from '../mail/mailer';

export interface AuditNotifier {
  toRole(role: Role, subject: string, text: string): Promise<void>;
  toUser(userId: number, subject: string, text: string): Promise<void>;
}

/**
 * E-mail through the configured relay (the local fake in development). A
 * message that cannot be sent is logged, never allowed to undo the action
 * that caused it.
 */
export function mailNotifier(db: Knex, mailer: Mailer, log: (msg: string, err?: unknown) => void): AuditNotifier {
  const send = async (to: string[], subject: string, text: string) => {
    for (const address of to) {
      await mailer.send({ to: address, subject, text }).catch((err) => log(`notification to ${address} not sent`, err));
    }
  };
  return {
    async toRole(role, subject, text) {
      const rows = await db('users as u').join('user_roles as r', 'r.user_id', 'u.id').where({ 'r.role': role, 'u.active': true }).select('u.email');
      await send(rows.map((r) => r.email), subject, text);
    },
    async toUser(userId, subject, text) {
      const row = await db('users').where({ id: userId, active: true }).first('email');
      if (row) await send([row.email], subject, text);
    },
  };
}

export const silentNotifier: AuditNotifier = { toRole: async () => {}, toUser: async () => {} };
