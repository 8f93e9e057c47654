/** The mail outbox, for admins: what Fieldfile sent (or what the local catcher received). */
import { Router } from 'express';
import { desc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { mailMessages } from '../../db/schema';
import type { AppContext } from '../context';
import { notFound } from '../http-error';
import { requireRole } from '../middleware/auth';
import { parseWith } from '../middleware/validate';

const LIST_LIMIT = 200;

const toDto = (m: typeof mailMessages.$inferSelect) => ({
  id: m.id,
  receivedAt: m.receivedAt,
  from: m.fromAddress,
  to: m.toAddress,
  subject: m.subject,
  text: m.text,
  html: m.html,
});

export function outboxRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (_req, res) => {
    const rows = db.select().from(mailMessages).orderBy(desc(mailMessages.id)).limit(LIST_LIMIT).all();
    res.json({ messages: rows.map(toDto) });
  });
  router.get('/:id', (req, res) => {
    const id = parseWith(z.coerce.number().int().positive(), req.params.id);
    const row = db.select().from(mailMessages).where(eq(mailMessages.id, id)).get();
    if (!row) throw notFound('No such message.');
    res.json({ message: toDto(row) });
  });
  return router;
}
