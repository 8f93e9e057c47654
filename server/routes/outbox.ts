/**
 * The mail outbox, for admins: what the local mail catcher received for their organisation.
 * With real SMTP there is no outbox (mail is not kept), and these routes answer 404.
 */
import { Router } from 'express';
import type { AppContext } from '../context';
import { notFound } from '../http-error';
import { requireRole } from '../middleware/auth';
import { parseIdParam } from '../middleware/validate';
import { getOutboxMessage, listOutbox, type MailRow } from '../services/outbox-service';

const LIST_LIMIT = 200;

const toDto = (m: MailRow) => ({
  id: m.id,
  receivedAt: m.receivedAt,
  from: m.fromAddress,
  to: m.toAddress,
  subject: m.subject,
  text: m.text,
  html: m.html,
});

export function outboxRoutes({ db, config }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.use((_req, _res, next) => {
    next(config.mail.smtp ? notFound('There is no outbox: mail goes out through the configured SMTP server and is not kept.') : undefined);
  });
  router.get('/', (req, res) => {
    res.json({ messages: listOutbox(db, req.user!.organisation.id, LIST_LIMIT).map(toDto) });
  });
  router.get('/:id', (req, res) => {
    const row = getOutboxMessage(db, req.user!.organisation.id, parseIdParam(req.params.id, 'No such message.'));
    res.json({ message: toDto(row) });
  });
  return router;
}
