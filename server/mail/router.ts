import { Router } from 'express';
import type { OutboxMessage } from '../../lib/schemas/outbox';
import { requireRoles } from '../auth/require-roles';
import { sessionOnly } from '../auth/session-only';
import type { AccountDeps } from '../auth/deps';
import { latestMessages } from './repo';

/** GET /outbox — admin: the newest messages the local mail fake received. */
export function outboxRouter({ db }: AccountDeps): Router {
  const router = Router();
  router.get('/outbox', requireRoles('admin'), sessionOnly, async (_req, res) => {
    const rows = await latestMessages(db, 100);
    const messages: OutboxMessage[] = rows.map((r) => ({
      id: r.id,
      receivedAt: new Date(Number(r.received_at_ms)).toISOString(),
      from: r.mail_from,
      to: JSON.parse(r.rcpt_to),
      subject: r.subject,
      text: r.text_body,
    }));
    res.json({ messages });
  });
  return router;
}
