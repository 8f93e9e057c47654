/**
 * The admin's activity view: which kinds of entries the audit trail holds, and the filters of
 * GET /api/audit (`?filing=&person=&kind=`; an empty value means no filter). Shared by the
 * route (which validates with it) and the activity screen (which offers its pickers).
 */
import { z } from 'zod';

export const AUDIT_KINDS = ['sign-in', 'people', 'filing-data', 'lab', 'evidence', 'state-change', 'comment', 'signature', 'verification', 'package'] as const;
export type AuditKind = (typeof AUDIT_KINDS)[number];

export const AUDIT_KIND_LABELS: Record<AuditKind, string> = {
  'sign-in': 'Sign-ins and passwords',
  people: 'People and roles',
  'filing-data': 'Filing data',
  lab: 'Lab data',
  evidence: 'Evidence',
  'state-change': 'Review state changes',
  comment: 'Comments',
  signature: 'Signatures',
  verification: 'Verifications',
  package: 'Packages',
};

/** The actions of each kind: exact names, or every action under a prefix (`lab.` covers `lab.measurements.import`). */
export const AUDIT_KIND_ACTIONS: Record<AuditKind, { actions?: readonly string[]; prefixes?: readonly string[] }> = {
  'sign-in': { prefixes: ['auth.'] },
  people: { prefixes: ['user.', 'seed.'] },
  'filing-data': { prefixes: ['filing.'] },
  lab: { prefixes: ['lab.'] },
  evidence: { prefixes: ['evidence.'] },
  'state-change': { actions: ['version.review-requested', 'version.returned', 'version.started'] },
  comment: { prefixes: ['review.'] },
  signature: { actions: ['version.signed', 'version.sign-refused'] },
  verification: { actions: ['version.verified'] },
  package: { prefixes: ['package.'] },
};

/** The kind an action belongs to, or null for one no kind covers. */
export function auditKindOf(action: string): AuditKind | null {
  for (const kind of AUDIT_KINDS) {
    const { actions = [], prefixes = [] } = AUDIT_KIND_ACTIONS[kind];
    if (actions.includes(action) || prefixes.some((p) => action.startsWith(p))) return kind;
  }
  return null;
}

/** How many entries one answer lists at most (newest first). */
export const AUDIT_LIST_LIMIT = 500;

const ID_PATTERN = /^[1-9][0-9]{0,14}$/;
/** An empty value is no filter: a picker set to "all" may still send the parameter. */
const blankToUndefined = (v: unknown) => (v === '' ? undefined : v);
const id = (what: string) =>
  z.preprocess(
    blankToUndefined,
    z
      .string({ error: `Give one ${what} id, as a plain number.` })
      .regex(ID_PATTERN, `The ${what} id must be a plain positive number.`)
      .transform(Number)
      .optional(),
  );

/** Filters by filing, person and kind only: another parameter is a mistake worth saying. */
export const zAuditQuery = z.strictObject({
  filing: id('filing'),
  person: id('person'),
  kind: z.preprocess(blankToUndefined, z.enum(AUDIT_KINDS, { error: `The kind must be one of: ${AUDIT_KINDS.join(', ')}.` }).optional()),
});
export type AuditQuery = z.output<typeof zAuditQuery>;
