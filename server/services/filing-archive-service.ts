/**
 * Archiving a filing: its owner (who created it) or an admin puts it away and takes it back. An
 * archived filing leaves the default filings list and is read-only — every change is refused with
 * a 409 that says to restore it first — until it is restored. Both are audited.
 */
import type { Db } from '../../db/client';
import { conflict, forbidden } from '../http-error';
import * as repo from '../repos/filings-repo';
import { recordAudit } from './audit';
import { loadFiling, type FilingActor } from './filings-service';

/** The sentence every refused change of an archived filing carries. */
export const ARCHIVED_READ_ONLY_MESSAGE = 'This filing is archived and read-only. Its owner or an admin can restore it to make changes.';

function requireOwnerOrAdmin(actor: FilingActor, row: repo.FilingRow) {
  if (row.filing.ownerUserId !== actor.id && !actor.roles.includes('admin')) {
    throw forbidden('Only the filing’s owner (who created it) or an admin can archive or restore it.');
  }
}

function deviceLabel(row: repo.FilingRow) {
  return `${row.device.name} ${row.device.model}`.trim();
}

export function archiveFiling(db: Db, actor: FilingActor, filingId: number) {
  const row = loadFiling(db, actor, filingId);
  requireOwnerOrAdmin(actor, row);
  if (row.filing.archivedAt) throw conflict(`“${deviceLabel(row)}” is already archived.`);
  db.transaction((tx) => {
    repo.setArchived(tx, filingId, {
      archivedAt: new Date().toISOString(),
      archivedByUserId: actor.id,
    });
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'filing.archive',
      targetType: 'filing',
      targetId: filingId,
      details: { device: row.device.name, model: row.device.model },
    });
  });
}

export function restoreFiling(db: Db, actor: FilingActor, filingId: number) {
  const row = loadFiling(db, actor, filingId);
  requireOwnerOrAdmin(actor, row);
  if (!row.filing.archivedAt) throw conflict(`“${deviceLabel(row)}” is not archived.`);
  db.transaction((tx) => {
    repo.setArchived(tx, filingId, {
      archivedAt: null,
      archivedByUserId: null,
    });
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'filing.restore',
      targetType: 'filing',
      targetId: filingId,
      details: { device: row.device.name, model: row.device.model },
    });
  });
}

/** Refuses a change to an archived filing of the actor's organisation (409 with the reason); other filings pass. */
export function refuseChangeIfArchived(db: Db, organisationId: number, filingId: number) {
  if (repo.isArchived(db, organisationId, filingId)) throw conflict(ARCHIVED_READ_ONLY_MESSAGE);
}
