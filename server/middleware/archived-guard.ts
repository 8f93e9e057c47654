/**
 * An archived filing is read-only: every state-changing request under /api/filings/:id is refused
 * with a 409 that says to restore it first — except archiving (which answers that it already is) and restoring it, verifying a version's signature
 * and building a version's package (exports that change none of its data). Mounted before the filing
 * routers, so no write route can forget it. Callers not signed in, or asking about another
 * organisation's filing, pass through to the routers' own 401/404.
 */
import type { RequestHandler } from 'express';
import type { Db } from '../../db/client';
import { refuseChangeIfArchived } from '../services/filing-archive-service';

const READ_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
/** Paths under /filings/:id that stay open on an archived filing. */
const OPEN_WHEN_ARCHIVED = [/^\/(archive|restore)\/?$/, /^\/versions\/\d+\/verify\/?$/, /^\/versions\/\d+\/package\/?$/];

export function refuseChangesToArchivedFilings(db: Db): RequestHandler {
  return (req, _res, next) => {
    const filingId = Number(req.params.id);
    if (READ_METHODS.has(req.method) || !req.user || !/^\d+$/.test(String(req.params.id)) || OPEN_WHEN_ARCHIVED.some((p) => p.test(req.path))) {
      next();
      return;
    }
    refuseChangeIfArchived(db, req.user.organisation.id, filingId);
    next();
  };
}
