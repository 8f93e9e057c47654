/**
 * Review and signing: who may move a version from which state to which, the request bodies
 * (shared by the forms and the server) and the shapes the API returns.
 */
import { z } from 'zod';
import type { Role } from './roles';
import type { VersionState } from './filings';

export type ReviewAction = 'request-review' | 'return' | 'sign' | 'start-next-version';

/**
 * The state machine: each action, the states it starts from, the state it ends in, and the
 * role it needs. Everything else is refused (admins read; engineers change lab data, not states).
 */
export const REVIEW_TRANSITIONS: Record<ReviewAction, { from: readonly VersionState[]; to: VersionState; role: Role }> = {
  'request-review': { from: ['draft', 'returned'], to: 'in-review', role: 'specialist' },
  return: { from: ['in-review'], to: 'returned', role: 'approver' },
  sign: { from: ['in-review'], to: 'signed', role: 'approver' },
  // Editing a signed filing starts the next version as a draft copy.
  'start-next-version': { from: ['signed'], to: 'draft', role: 'specialist' },
};

export const REVIEW_ACTION_LABELS: Record<ReviewAction, string> = {
  'request-review': 'Ask for review',
  return: 'Return with comments',
  sign: 'Sign',
  'start-next-version': 'Start the next version',
};

/** Our own words; the signer confirms them by re-entering their password. */
export const SIGNING_STATEMENT =
  'I have reviewed this version of the filing — its device data, screening, results, checklist and evidence — and approve it for submission. I understand that it is frozen once signed and that any later change starts a new version.';

export const MAX_COMMENT_LENGTH = 4000;
export const MAX_ROW_REF_LENGTH = 80;

const body = z.string({ error: 'Write a comment.' }).trim().min(1, 'Write a comment.').max(MAX_COMMENT_LENGTH, `Keep a comment under ${MAX_COMMENT_LENGTH} characters.`);

export const zNewThread = z.strictObject({
  step: z.string({ error: 'Say which step the comment is about.' }).trim().min(1, 'Say which step the comment is about.').max(40),
  rowRef: z.string().trim().max(MAX_ROW_REF_LENGTH, `A row reference is at most ${MAX_ROW_REF_LENGTH} characters.`).optional(),
  body,
});
export type NewThreadInput = z.input<typeof zNewThread>;

export const zReply = z.strictObject({ body });
export type ReplyInput = z.input<typeof zReply>;

export const zReturn = z.strictObject({
  message: z.string().trim().max(MAX_COMMENT_LENGTH, `Keep the note under ${MAX_COMMENT_LENGTH} characters.`).optional(),
});
export type ReturnInput = z.input<typeof zReturn>;

export const zSign = z.strictObject({
  password: z.string({ error: 'Enter your password to sign.' }).min(1, 'Enter your password to sign.').max(1024),
  /** The statement the signer read, so a changed statement on the server is never signed blind. */
  statement: z.literal(SIGNING_STATEMENT, { error: 'The statement you confirmed is not the current one; reload and read it again.' }),
});
export type SignInput = z.input<typeof zSign>;

export interface ReviewCommentDto {
  id: number;
  author: { id: number; name: string };
  body: string;
  createdAt: string;
}

export interface ReviewThreadDto {
  id: number;
  step: string;
  rowRef: string | null;
  state: 'open' | 'resolved';
  createdBy: { id: number; name: string };
  createdAt: string;
  resolvedAt: string | null;
  comments: ReviewCommentDto[];
}

export interface SignatureDto {
  signer: { id: number; name: string; role: string };
  signedAt: string;
  statement: string;
  contentFormat: string;
  contentSha256: string;
}

export interface VersionDto {
  id: number;
  number: number;
  state: VersionState;
  createdAt: string;
  signature: SignatureDto | null;
}

export interface ReviewDto {
  filingId: number;
  version: VersionDto;
  versions: VersionDto[];
  threads: ReviewThreadDto[];
  /** What the signed-in user may do now, and why not when they may not. */
  can: Record<ReviewAction | 'comment' | 'reply' | 'resolve', { allowed: boolean; reason?: string }>;
  signingStatement: string;
}

export interface VerifyDto {
  version: number;
  matches: boolean;
  signedSha256: string;
  currentSha256: string;
  contentFormat: string;
  verifiedAt: string;
}

export interface TimelineEntryDto {
  id: number;
  at: string;
  action: string;
  actorName: string | null;
  details: Record<string, unknown> | null;
}
