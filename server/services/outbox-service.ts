/** The mail outbox of one organisation (what the local mail catcher received for it). */
import type { Db } from '../../db/client';
import { notFound } from '../http-error';
import { findOrganisationMail, listOrganisationMail, type MailRow } from '../repos/mail-repo';

export type { MailRow };

export function listOutbox(db: Db, organisationId: number, limit: number): MailRow[] {
  return listOrganisationMail(db, organisationId, limit);
}

export function getOutboxMessage(db: Db, organisationId: number, id: number): MailRow {
  const row = findOrganisationMail(db, organisationId, id);
  if (!row) throw notFound('No such message.');
  return row;
}
