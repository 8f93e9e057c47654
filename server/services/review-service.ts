/**
 * Review and signing of a filing's latest version: the state machine (REVIEW_TRANSITIONS), the
 * comment threads, signing with a fresh password check and the content hash, verifying a
 * signature, starting the next version, the filing's timeline, and the hand-off e-mails.
 * Every change is audited in the same transaction; mail goes out after it commits.
 */
import type { Db } from '../../db/client';
import type { AppContext } from '../context';
import { STEP_LABELS, type VersionState, type WizardStep } from '../../constants/schemas/filings';
import {
  REVIEW_TRANSITIONS,
  SIGNING_STATEMENT,
  type NewThreadInput,
  type ReplyInput,
  type ReturnInput,
  type ReviewAction,
  type ReviewDto,
  type ReviewThreadDto,
  type SignInput,
  type TimelineEntryDto,
  type VerifyDto,
  type VersionDto,
} from '../../constants/schemas/review';
import type { ReadinessChecklist } from '../../calc/readiness';
import { WRONG_PASSWORD_CODE } from '../../constants/schemas/errors';
import { renderReturnedMail, renderReviewRequestedMail, renderSignedMail } from '../../templates/mail/review';
import { conflict, forbidden, HttpError, notFound, unprocessable } from '../http-error';
import { carryEvidenceForward } from '../repos/evidence-repo';
import * as filingsRepo from '../repos/filings-repo';
import { copyLabData } from '../repos/lab-repo';
import * as repo from '../repos/review-repo';
import { recordAudit } from './audit';
import type { FilingActor } from './filings-service';
import { verifyPassword } from './passwords';
import { readVersionData, screeningInputOf, versionReadiness } from './readiness-service';
import { storeScreeningOf } from './screening-service';
import { CONTENT_FORMAT, versionContentSha256 } from './version-content';

/** What review actions need from the app (the seed passes its own, with no mail). */
export type ReviewContext = Pick<AppContext, 'db' | 'config' | 'mailer' | 'onVersionSigned'>;

export interface ReviewActor extends FilingActor {
  name: string;
}

interface Loaded {
  row: filingsRepo.FilingRow;
  version: repo.VersionRow;
}

function load(db: Db, actor: FilingActor, filingId: number): Loaded {
  const row = filingsRepo.findFiling(db, actor.organisationId, filingId);
  if (!row) throw notFound('No such filing in your organisation.');
  return { row, version: row.version };
}

function loadVersion(db: Db, actor: FilingActor, filingId: number, number: number): Loaded {
  const { row } = load(db, actor, filingId);
  const version = repo.findVersion(db, filingId, number);
  if (!version) throw notFound(`This filing has no version ${number}.`);
  return { row, version };
}

const stateOf = (v: repo.VersionRow) => v.state as VersionState;
const stateWord = (s: VersionState) => ({ draft: 'a draft', 'in-review': 'in review', returned: 'returned', signed: 'signed' })[s];

/** Why the actor may not take the action now, or null when they may. */
function refusal(action: ReviewAction, actor: FilingActor, state: VersionState): { status: 403 | 409; reason: string } | null {
  const t = REVIEW_TRANSITIONS[action];
  if (!actor.roles.includes(t.role)) {
    const who = t.role === 'approver' ? 'an approver' : 'a compliance specialist';
    return { status: 403, reason: `Only ${who} can do this (it needs the ${t.role} role).` };
  }
  if (!t.from.includes(state)) return { status: 409, reason: `The version is ${stateWord(state)}; this can be done only when it is ${t.from.map(stateWord).join(' or ')}.` };
  return null;
}

function requireAllowed(action: ReviewAction, actor: FilingActor, state: VersionState) {
  const r = refusal(action, actor, state);
  if (r) throw r.status === 403 ? forbidden(r.reason) : conflict(r.reason);
}

const blockingItems = (c: ReadinessChecklist) => c.items.filter((i) => i.status === 'fail' && i.severity === 'blocks-signing');

function refuseWhenBlocked(checklist: ReadinessChecklist, what: string) {
  const blocking = blockingItems(checklist);
  if (!blocking.length) return;
  throw new HttpError(
    409,
    'not_ready',
    `${what}: ${blocking.length} checklist item${blocking.length === 1 ? '' : 's'} block${blocking.length === 1 ? 's' : ''} it — ${blocking.map((i) => i.title).join('; ')}.`,
    Object.fromEntries(blocking.map((i) => [i.id, `${i.title}. ${i.fix}`])),
  );
}

function audit(db: Db, actor: FilingActor, filingId: number, action: string, details: Record<string, unknown>) {
  recordAudit(db, { organisationId: actor.organisationId, actorUserId: actor.id, action, targetType: 'filing', targetId: filingId, details });
}

// --- reading ---------------------------------------------------------------------------------

function versionDto(v: repo.VersionRow, s: repo.SignatureRow | null | undefined): VersionDto {
  return {
    id: v.id,
    number: v.number,
    state: stateOf(v),
    createdAt: v.createdAt,
    signature: s
      ? {
          signer: { id: s.signerUserId, name: s.signerName, role: s.signerRole },
          signedAt: s.signedAt,
          statement: s.statement,
          contentFormat: s.contentFormat,
          contentSha256: s.contentSha256,
        }
      : null,
  };
}

function threadDtos(db: Db, versionId: number): ReviewThreadDto[] {
  return repo.listThreads(db, versionId).map(({ thread, authorName, comments }) => ({
    id: thread.id,
    step: thread.step,
    rowRef: thread.rowRef,
    state: thread.state,
    createdBy: { id: thread.createdByUserId, name: authorName },
    createdAt: thread.createdAt,
    resolvedAt: thread.resolvedAt,
    comments: comments.map((c) => ({ id: c.comment.id, author: { id: c.comment.authorUserId, name: c.authorName }, body: c.comment.body, createdAt: c.comment.createdAt })),
  }));
}

export function getReview(db: Db, actor: FilingActor, filingId: number): ReviewDto {
  const { row, version } = load(db, actor, filingId);
  const versions = repo.listVersions(db, filingId).map((r) => versionDto(r.version, r.signature));
  const state = stateOf(version);
  const allowed = (action: ReviewAction) => {
    const r = refusal(action, actor, state);
    return r ? { allowed: false, reason: r.reason } : { allowed: true };
  };
  const can: ReviewDto['can'] = {
    'request-review': allowed('request-review'),
    return: allowed('return'),
    sign: allowed('sign'),
    'start-next-version': allowed('start-next-version'),
    comment: commentRefusal(actor, state) ?? { allowed: true },
    reply: replyRefusal(actor, state) ?? { allowed: true },
    resolve: resolveRefusal(actor, state) ?? { allowed: true },
  };
  if (can.sign.allowed && repo.versionEditorIds(db, version.id).includes(actor.id)) {
    can.sign = { allowed: false, reason: 'You changed this version’s data, so another approver signs it.' };
  }
  return {
    filingId: row.filing.id,
    version: versions.find((v) => v.id === version.id)!,
    versions,
    threads: threadDtos(db, version.id),
    can,
    signingStatement: SIGNING_STATEMENT,
  };
}

export function getReadiness(db: Db, actor: FilingActor, filingId: number, number?: number) {
  const { row, version } = number === undefined ? load(db, actor, filingId) : loadVersion(db, actor, filingId, number);
  const { checklist } = versionReadiness(db, version, row.filing.deviceId);
  return {
    filingId,
    version: version.number,
    state: stateOf(version),
    ...checklist,
    cautions: [
      'The checklist is computed from the data entered in Fieldfile; it does not replace the lab’s report or the certifying body’s review.',
      'The certifying body and accredited labs decide; follow the applicable regulations and local codes.',
    ],
  };
}

export function getTimeline(db: Db, actor: FilingActor, filingId: number): TimelineEntryDto[] {
  load(db, actor, filingId);
  return repo.filingTimeline(db, actor.organisationId, filingId).map((r) => ({
    id: r.entry.id,
    at: r.entry.at,
    action: r.entry.action,
    actorName: r.actorName,
    details: r.entry.details ?? null,
  }));
}

// --- mail ------------------------------------------------------------------------------------

async function sendAll(ctx: ReviewContext, actor: FilingActor, filingId: number, mails: { to: string; subject: string; text: string; html: string }[]) {
  for (const m of mails) {
    try {
      await ctx.mailer.send({ ...m, organisationId: actor.organisationId });
    } catch (err) {
      console.error('[fieldfile] review mail failed', err);
      audit(ctx.db, actor, filingId, 'mail.failed', { to: m.to, subject: m.subject });
    }
  }
}

const reviewLink = (ctx: ReviewContext, filingId: number) => `${ctx.config.publicUrl}/filings/${filingId}/review`;

function filingPeople(db: Db, row: filingsRepo.FilingRow, versionId: number, extra: number[]) {
  const ids = [...new Set([row.filing.ownerUserId, ...repo.versionEditorIds(db, versionId), ...extra])];
  return repo.usersByIds(db, ids).filter((u) => u.active);
}

// --- transitions -----------------------------------------------------------------------------

export async function requestReview(ctx: ReviewContext, actor: ReviewActor, filingId: number) {
  const { db } = ctx;
  const { row, version } = load(db, actor, filingId);
  requireAllowed('request-review', actor, stateOf(version));
  refuseWhenBlocked(versionReadiness(db, version, row.filing.deviceId).checklist, 'This version cannot go to review yet');
  db.transaction((tx) => {
    if (!repo.changeVersionState(tx, version.id, stateOf(version), 'in-review')) throw conflict('Someone changed this version’s state just now; reload and try again.');
    audit(tx, actor, filingId, 'version.review-requested', { version: version.number, from: version.state });
  });
  const link = reviewLink(ctx, filingId);
  await sendAll(
    ctx,
    actor,
    filingId,
    repo
      .membersWithRole(db, actor.organisationId, 'approver')
      .filter((u) => u.id !== actor.id)
      .map((u) => ({
        to: u.email,
        ...renderReviewRequestedMail({ recipientName: u.name, deviceName: row.device.name, model: row.device.model, version: version.number, actorName: actor.name, link }),
      })),
  );
  return getReview(db, actor, filingId);
}

export async function returnVersion(ctx: ReviewContext, actor: ReviewActor, filingId: number, input: ReturnInput) {
  const { db } = ctx;
  const { row, version } = load(db, actor, filingId);
  requireAllowed('return', actor, stateOf(version));
  const open = threadDtos(db, version.id).filter((t) => t.state === 'open');
  if (!open.length && !input.message) {
    throw unprocessable('Say what needs changing: leave a comment on a step or write a note.', { message: 'Write what needs changing, or comment on a step first.' });
  }
  db.transaction((tx) => {
    if (input.message) {
      const thread = repo.insertThread(tx, { versionId: version.id, step: 'overview', rowRef: null, createdByUserId: actor.id });
      repo.insertComment(tx, { threadId: thread.id, authorUserId: actor.id, body: input.message });
    }
    if (!repo.changeVersionState(tx, version.id, 'in-review', 'returned')) throw conflict('Someone changed this version’s state just now; reload and try again.');
    audit(tx, actor, filingId, 'version.returned', { version: version.number, openComments: open.length + (input.message ? 1 : 0) });
  });
  const threads = threadDtos(db, version.id)
    .filter((t) => t.state === 'open')
    .map((t) => ({ where: threadWhere(t), comments: t.comments.map((c) => ({ author: c.author.name, body: c.body })) }));
  const link = reviewLink(ctx, filingId);
  const people = filingPeople(db, row, version.id, []).filter((u) => u.id !== actor.id);
  await sendAll(
    ctx,
    actor,
    filingId,
    people.map((u) => ({
      to: u.email,
      ...renderReturnedMail({ recipientName: u.name, deviceName: row.device.name, model: row.device.model, version: version.number, actorName: actor.name, link, note: input.message, threads }),
    })),
  );
  return getReview(db, actor, filingId);
}

const threadWhere = (t: Pick<ReviewThreadDto, 'step' | 'rowRef'>) => {
  const step = t.step === 'overview' ? 'Overview' : (STEP_LABELS[t.step as WizardStep] ?? t.step);
  return t.rowRef ? `${step}, row ${t.rowRef}` : step;
};

/** How many wrong passwords this approver has given when signing this version (for the audit record). */
function wrongPasswordCount(db: Db, actor: FilingActor, filingId: number, versionNumber: number) {
  return repo
    .filingTimeline(db, actor.organisationId, filingId)
    .filter((r) => r.entry.action === 'version.sign-refused' && r.entry.actorUserId === actor.id && (r.entry.details as { version?: number } | null)?.version === versionNumber).length;
}

export async function signVersion(ctx: ReviewContext, actor: ReviewActor, filingId: number, input: SignInput) {
  const { db } = ctx;
  const { row, version } = load(db, actor, filingId);
  requireAllowed('sign', actor, stateOf(version));
  if (repo.versionEditorIds(db, version.id).includes(actor.id)) {
    throw forbidden('You changed this version’s data, so another approver must sign it (separation of duties).');
  }
  // A fresh check of the password, not the session: signing is a deliberate act.
  const hash = repo.passwordHashOf(db, actor.id);
  if (!hash || !(await verifyPassword(input.password, hash))) {
    const attempt = wrongPasswordCount(db, actor, filingId, version.number) + 1;
    audit(db, actor, filingId, 'version.sign-refused', { version: version.number, reason: 'wrong password', attempt });
    throw new HttpError(401, WRONG_PASSWORD_CODE, 'That password is not right; the version was not signed.', { password: 'That password is not right.' });
  }
  const { checklist } = versionReadiness(db, version, row.filing.deviceId);
  refuseWhenBlocked(checklist, 'This version cannot be signed');
  const screeningInput = screeningInputOf(readVersionData(db, version, row.filing.deviceId));

  const signature = db.transaction((tx) => {
    const current = repo.findVersion(tx, filingId, version.number)!;
    if (current.state !== 'in-review') throw conflict(`Version ${version.number} is ${stateWord(stateOf(current))} now; it was not signed again.`);
    // The screening the approver read is stored with the version, so the hash covers it.
    if (screeningInput) storeScreeningOf(tx, version.id, screeningInput);
    const contentSha256 = versionContentSha256(tx, version.id);
    const s = repo.insertSignature(tx, {
      versionId: version.id,
      signerUserId: actor.id,
      signerName: actor.name,
      signerRole: 'approver',
      signedAt: new Date().toISOString(),
      statement: SIGNING_STATEMENT,
      contentFormat: CONTENT_FORMAT,
      contentSha256,
      checklist: JSON.stringify(checklist),
    });
    if (!repo.changeVersionState(tx, version.id, 'in-review', 'signed')) throw conflict('Someone signed or returned this version just now.');
    audit(tx, actor, filingId, 'version.signed', { version: version.number, contentSha256, warnings: checklist.counts.warnings });
    return s;
  });

  // The signed package is built from here on; signing stands even if queuing the build fails
  // (the approver or specialist can start it from the filing).
  try {
    ctx.onVersionSigned?.({ organisationId: actor.organisationId, filingId, versionNumber: version.number, signerUserId: actor.id });
  } catch (err) {
    console.error('[fieldfile] queuing the signed package failed', err);
    audit(db, actor, filingId, 'package.build-not-queued', { version: version.number });
  }

  const link = reviewLink(ctx, filingId);
  await sendAll(
    ctx,
    actor,
    filingId,
    filingPeople(db, row, version.id, [actor.id]).map((u) => ({
      to: u.email,
      ...renderSignedMail({
        recipientName: u.name,
        deviceName: row.device.name,
        model: row.device.model,
        version: version.number,
        actorName: actor.name,
        link,
        signedAt: signature.signedAt.slice(0, 16).replace('T', ' ') + ' UTC',
        contentSha256: signature.contentSha256,
      }),
    })),
  );
  return getReview(db, actor, filingId);
}

/** Recomputes a signed version's hash and says whether it still matches the signature. */
export function verifyVersion(db: Db, actor: FilingActor, filingId: number, number: number): VerifyDto {
  const { version } = loadVersion(db, actor, filingId, number);
  const signature = repo.findSignature(db, version.id);
  if (!signature) throw conflict(`Version ${number} is not signed; there is nothing to verify.`);
  const currentSha256 = versionContentSha256(db, version.id);
  const matches = currentSha256 === signature.contentSha256 && signature.contentFormat === CONTENT_FORMAT;
  const verifiedAt = new Date().toISOString();
  audit(db, actor, filingId, 'version.verified', { version: number, matches });
  return { version: number, matches, signedSha256: signature.contentSha256, currentSha256, contentFormat: signature.contentFormat, verifiedAt };
}

/**
 * Editing a signed filing starts version N+1: a draft copy of the device, radios, use positions,
 * markets and co-transmission combinations. Other parts of the product add their own copy step
 * to `versionCopiers` (evidence is carried by reference, lab data by value).
 */
export const versionCopiers: ((db: Db, fromVersionId: number, toVersionId: number) => void)[] = [copyLabData, (db, from, to) => void carryEvidenceForward(db, from, to)];

export function startNextVersion(db: Db, actor: FilingActor, filingId: number) {
  const { row, version } = load(db, actor, filingId);
  requireAllowed('start-next-version', actor, stateOf(version));
  const next = db.transaction((tx) => {
    const device = repo.copyDevice(tx, version.deviceId ?? row.filing.deviceId);
    const v = repo.insertVersion(tx, filingId, version.number + 1, device.id);
    filingsRepo.writeRadios(tx, v.id, filingsRepo.readRadios(tx, version.id));
    filingsRepo.writeUsePositions(tx, v.id, filingsRepo.readUsePositions(tx, version.id), filingsRepo.antennaIdsByKey(tx, v.id));
    filingsRepo.writeMarkets(tx, v.id, filingsRepo.readMarkets(tx, version.id));
    filingsRepo.writeCoTransmissionGroups(tx, v.id, filingsRepo.readCoTransmissionGroups(tx, version.id));
    for (const copy of versionCopiers) copy(tx, version.id, v.id);
    audit(tx, actor, filingId, 'version.started', { version: v.number, from: version.number });
    return v;
  });
  return next.number;
}

// --- comments --------------------------------------------------------------------------------

function commentRefusal(actor: FilingActor, state: VersionState) {
  if (!actor.roles.includes('approver')) return { allowed: false, reason: 'Approvers start comment threads; a specialist answers them.' };
  if (state !== 'in-review') return { allowed: false, reason: `Comments are left while a version is in review; this one is ${stateWord(state)}.` };
  return null;
}

function replyRefusal(actor: FilingActor, state: VersionState) {
  if (!actor.roles.includes('specialist') && !actor.roles.includes('approver')) return { allowed: false, reason: 'Only the specialist and the approver take part in a review.' };
  if (state !== 'in-review' && state !== 'returned') return { allowed: false, reason: `The version is ${stateWord(state)}; its comments no longer change.` };
  return null;
}

function resolveRefusal(actor: FilingActor, state: VersionState) {
  if (!actor.roles.includes('specialist')) return { allowed: false, reason: 'The specialist resolves a comment once it is answered.' };
  if (state !== 'in-review' && state !== 'returned') return { allowed: false, reason: `The version is ${stateWord(state)}; its comments no longer change.` };
  return null;
}

function refuseWith(r: { reason?: string } | null) {
  if (r) throw forbidden(r.reason);
}

/** Turns a refusal about the version's state into 409 and one about the role into 403. */
function refuseComment(r: { reason?: string } | null, actor: FilingActor, roleOk: boolean) {
  if (!r) return;
  if (roleOk) throw conflict(r.reason!);
  refuseWith(r);
}

export function addThread(db: Db, actor: FilingActor, filingId: number, input: NewThreadInput): ReviewThreadDto {
  const { version } = load(db, actor, filingId);
  refuseComment(commentRefusal(actor, stateOf(version)), actor, actor.roles.includes('approver'));
  const id = db.transaction((tx) => {
    const t = repo.insertThread(tx, { versionId: version.id, step: input.step, rowRef: input.rowRef || null, createdByUserId: actor.id });
    repo.insertComment(tx, { threadId: t.id, authorUserId: actor.id, body: input.body });
    audit(tx, actor, filingId, 'review.comment', { version: version.number, thread: t.id, step: input.step, rowRef: input.rowRef ?? null });
    return t.id;
  });
  return threadDtos(db, version.id).find((t) => t.id === id)!;
}

function loadThread(db: Db, versionId: number, threadId: number) {
  const t = repo.findThread(db, versionId, threadId);
  if (!t) throw notFound('No such comment thread on this version.');
  return t;
}

export function replyToThread(db: Db, actor: FilingActor, filingId: number, threadId: number, input: ReplyInput): ReviewThreadDto {
  const { version } = load(db, actor, filingId);
  refuseComment(replyRefusal(actor, stateOf(version)), actor, actor.roles.includes('specialist') || actor.roles.includes('approver'));
  const thread = loadThread(db, version.id, threadId);
  db.transaction((tx) => {
    repo.insertComment(tx, { threadId, authorUserId: actor.id, body: input.body });
    audit(tx, actor, filingId, 'review.reply', { version: version.number, thread: threadId });
  });
  return threadDtos(db, version.id).find((t) => t.id === thread.id)!;
}

export function resolveThread(db: Db, actor: FilingActor, filingId: number, threadId: number, resolved: boolean): ReviewThreadDto {
  const { version } = load(db, actor, filingId);
  refuseComment(resolveRefusal(actor, stateOf(version)), actor, actor.roles.includes('specialist'));
  loadThread(db, version.id, threadId);
  db.transaction((tx) => {
    repo.setThreadState(tx, threadId, resolved ? 'resolved' : 'open', actor.id);
    audit(tx, actor, filingId, resolved ? 'review.resolve' : 'review.reopen', { version: version.number, thread: threadId });
  });
  return threadDtos(db, version.id).find((t) => t.id === threadId)!;
}
