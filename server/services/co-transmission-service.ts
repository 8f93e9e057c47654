/**
 * Co-transmission groups of a filing's current version: which transmitters can be on together,
 * in every use position or in one. Every member reads; the specialist (who edits the device
 * data) replaces them all in one transaction. A save that names an older revision (If-Match) is
 * refused with the current groups, as wizard steps are.
 */
import type { Db } from '../../db/client';
import { zCoTransmissionBody, type CoTransmissionDto, type CoTransmissionGroup } from '../../constants/schemas/co-transmission';
import { forbidden, unprocessable } from '../http-error';
import { zodFieldErrors } from '../middleware/validate';
import * as repo from '../repos/filings-repo';
import { addVersionEditor } from '../repos/review-repo';
import { recordAudit } from './audit';
import { canEdit, loadFiling, matchesRevision, requireEditable, stepRevision, type FilingActor } from './filings-service';

export function readCoTransmission(db: Db, actor: FilingActor, filingId: number): CoTransmissionDto {
  const row = loadFiling(db, actor, filingId);
  const groups = repo.readCoTransmissionGroups(db, row.version.id);
  return { version: row.version.number, groups, revision: stepRevision(groups) };
}

/** Replaces every group of the current version; ids must name its transmitters and use positions. */
export type ReplaceResult = { stale: false; saved: CoTransmissionDto } | { stale: true; current: { groups: CoTransmissionGroup[]; revision: string } };

export function replaceCoTransmission(db: Db, actor: FilingActor, filingId: number, body: unknown, ifMatch?: string): ReplaceResult {
  if (!canEdit(actor)) throw forbidden('Only a compliance specialist can change which transmitters are on together. This needs the specialist role.');
  const row = loadFiling(db, actor, filingId);
  requireEditable(row);
  const parsed = zCoTransmissionBody.safeParse(body);
  if (!parsed.success) {
    const fields = zodFieldErrors(parsed.error);
    throw unprocessable(`${Object.keys(fields).length} field(s) need fixing; nothing was saved.`, fields);
  }
  const versionId = row.version.id;
  const current = repo.readCoTransmissionGroups(db, versionId);
  const revision = stepRevision(current);
  // Synchronous from here to the write (better-sqlite3): no other save can land in between.
  if (ifMatch && !matchesRevision(ifMatch, revision) && stepRevision(parsed.data.groups) !== revision) {
    return { stale: true, current: { groups: current, revision } };
  }
  const transmitters = new Set(repo.readRadios(db, versionId).transmitters.map((t) => t.id));
  const positions = new Set(repo.readUsePositions(db, versionId).usePositions.map((p) => p.id));
  const fields: Record<string, string> = {};
  const list = (s: Set<string>) => (s.size ? [...s].slice(0, 12).join(', ') : 'none yet');
  parsed.data.groups.forEach((g, i) => {
    if (g.usePositionId !== null && !positions.has(g.usePositionId)) fields[`groups.${i}.usePositionId`] = `No use position “${g.usePositionId}”; this filing has ${list(positions)}.`;
    const unknown = g.transmitterIds.filter((t) => !transmitters.has(t));
    if (unknown.length) fields[`groups.${i}.transmitterIds`] = `No transmitter ${unknown.map((t) => `“${t}”`).join(', ')} under Radios; this filing has ${list(transmitters)}.`;
  });
  if (Object.keys(fields).length) throw unprocessable(`${Object.keys(fields).length} group(s) name ids this filing does not have; nothing was saved.`, fields);
  if (stepRevision(parsed.data.groups) !== revision) {
    db.transaction((tx) => {
      repo.writeCoTransmissionGroups(tx, versionId, parsed.data.groups);
      repo.touchFiling(tx, filingId);
      addVersionEditor(tx, versionId, actor.id);
      recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.id,
        action: 'filing.co-transmission-save',
        targetType: 'filing',
        targetId: filingId,
        details: { version: row.version.number, groups: parsed.data.groups.length },
      });
    });
  }
  return { stale: false, saved: readCoTransmission(db, actor, filingId) };
}
