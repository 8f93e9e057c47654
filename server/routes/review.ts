/**
 * Readiness, review and signing of a filing, under /api/filings/:id. Every member reads; the
 * service decides who may act (specialists ask for review and answer comments, approvers
 * comment, return and sign, admins read) and answers 403 or 409 with the reason.
 */
import { Router } from 'express';
import { z } from 'zod';
import { zNewThread, zReply, zReturn, zSign } from '../../constants/schemas/review';
import type { AppContext } from '../context';
import { requireAuth } from '../middleware/auth';
import { parseWith } from '../middleware/validate';
import * as review from '../services/review-service';
import { compareVersions } from '../services/compare-service';

const zId = z.coerce.number({ error: 'The filing id must be a number.' }).int().positive();
const zNumber = z.coerce.number({ error: 'The version must be a number.' }).int().positive();
const zThreadId = z.coerce.number({ error: 'The thread id must be a number.' }).int().positive();

const actorOf = (user: Express.User): review.ReviewActor => ({ id: user.id, organisationId: user.organisation.id, roles: user.roles, name: user.name });

export function reviewRoutes(ctx: AppContext): Router {
  const { db } = ctx;
  const router = Router();
  router.use(requireAuth);
  const id = (p: unknown) => parseWith(zId, p);

  router.get('/:id/readiness', (req, res) => {
    const version = req.query.version === undefined ? undefined : parseWith(zNumber, req.query.version);
    res.json(review.getReadiness(db, actorOf(req.user!), id(req.params.id), version));
  });

  router.get('/:id/review', (req, res) => {
    res.json({ review: review.getReview(db, actorOf(req.user!), id(req.params.id)) });
  });

  router.get('/:id/timeline', (req, res) => {
    res.json({ entries: review.getTimeline(db, actorOf(req.user!), id(req.params.id)) });
  });

  router.post('/:id/review/request', async (req, res) => {
    res.json({ review: await review.requestReview(ctx, actorOf(req.user!), id(req.params.id)) });
  });

  router.post('/:id/review/return', async (req, res) => {
    const input = parseWith(zReturn, req.body ?? {});
    res.json({ review: await review.returnVersion(ctx, actorOf(req.user!), id(req.params.id), input) });
  });

  router.post('/:id/review/sign', async (req, res) => {
    const input = parseWith(zSign, req.body ?? {});
    res.json({ review: await review.signVersion(ctx, actorOf(req.user!), id(req.params.id), input) });
  });

  router.post('/:id/review/threads', (req, res) => {
    const input = parseWith(zNewThread, req.body ?? {});
    res.status(201).json({ thread: review.addThread(db, actorOf(req.user!), id(req.params.id), input) });
  });

  router.post('/:id/review/threads/:threadId/replies', (req, res) => {
    const input = parseWith(zReply, req.body ?? {});
    res.status(201).json({ thread: review.replyToThread(db, actorOf(req.user!), id(req.params.id), parseWith(zThreadId, req.params.threadId), input) });
  });

  router.post('/:id/review/threads/:threadId/resolve', (req, res) => {
    res.json({ thread: review.resolveThread(db, actorOf(req.user!), id(req.params.id), parseWith(zThreadId, req.params.threadId), true) });
  });

  router.post('/:id/review/threads/:threadId/reopen', (req, res) => {
    res.json({ thread: review.resolveThread(db, actorOf(req.user!), id(req.params.id), parseWith(zThreadId, req.params.threadId), false) });
  });

  router.post('/:id/versions', (req, res) => {
    const number = review.startNextVersion(db, actorOf(req.user!), id(req.params.id));
    res.status(201).json({ version: number });
  });

  router.post('/:id/versions/:number/verify', (req, res) => {
    res.json({ verification: review.verifyVersion(db, actorOf(req.user!), id(req.params.id), parseWith(zNumber, req.params.number)) });
  });

  router.get('/:id/compare', (req, res) => {
    const q = parseWith(z.object({ from: zNumber, to: zNumber }), req.query);
    res.json({ comparison: compareVersions(db, actorOf(req.user!), id(req.params.id), q.from, q.to) });
  });

  return router;
}
