/**
 * The audit trail in words (pure, so it is tested without a screen): what each action is called,
 * and what an entry is about — the person changed and each change as before → after, the account
 * of a failed sign-in, an accepted invitation.
 */
import type { AuditEntry } from '../../hooks/queries/audit';
import { ROLE_LABELS, ROLES, type Role } from '../../constants/schemas/roles';

const ACTION_LABELS: Record<string, string> = {
  'auth.sign-in': 'Signed in',
  'auth.sign-in-failed': 'Failed sign-in',
  'auth.sign-out': 'Signed out',
  'auth.password-set': 'Set a password',
  'auth.set-password': 'Set a password',
  'auth.sign-in-blocked': 'Sign-in paused after wrong passwords',
  'auth.password-reset-requested': 'Asked for a password-reset link',
  'auth.password-reset': 'Chose a new password from a reset link',
  'auth.password-change': 'Changed the password',
  'user.invite': 'Invited a user',
  'user.invite-resend': 'Sent an invitation again',
  'user.join': 'Accepted an invitation',
  'user.update': 'Changed a user',
  'user.deactivate': 'Deactivated a user',
  'user.reactivate': 'Reactivated a user',
  'filing.create': 'Started a filing',
  'filing.import': 'Imported a device file',
  'filing.archive': 'Archived a filing',
  'filing.restore': 'Restored a filing',
  'filing.step-save': 'Saved a step',
  'evidence.upload': 'Filed evidence',
  'evidence.replace': 'Replaced evidence',
  'evidence.delete': 'Removed evidence',
  'version.review-requested': 'Asked for review',
  'version.returned': 'Returned for changes',
  'version.started': 'Started a new version',
  'version.signed': 'Signed a version',
  'version.sign-refused': 'Signing refused',
  'version.verified': 'Verified a signature',
  'review.comment': 'Commented',
  'review.reply': 'Answered a comment',
  'review.resolve': 'Resolved a comment',
  'review.reopen': 'Reopened a comment',
};

const detailsOf = (details: unknown) => (details && typeof details === 'object' ? (details as Record<string, unknown>) : {});

/** Actions without a label of their own ("filing.create") read as "Filing: create". */
export function actionLabel(action: string, details?: unknown): string {
  // A password set from an invitation link is how a new person accepts it.
  if (action === 'auth.set-password' && detailsOf(details).purpose === 'invitation') return 'Accepted an invitation and set a password';
  if (ACTION_LABELS[action]) return ACTION_LABELS[action];
  const [noun = action, ...rest] = action.split('.');
  const what = rest.join(' ').replace(/[-_]/g, ' ');
  return `${noun.charAt(0).toUpperCase()}${noun.slice(1)}${what ? `: ${what}` : ''}`;
}

const roleWords = (roles: unknown[]) => {
  const known = roles.filter((r): r is Role => (ROLES as readonly unknown[]).includes(r));
  return known.length ? known.map((r) => ROLE_LABELS[r]).join(', ') : 'no role';
};

/** What the entry is about, in words: "Priya Raman (engineer@…) · roles: Test engineer → Test engineer, Approver". */
export function describeEntry(entry: Pick<AuditEntry, 'details' | 'targetType' | 'targetId' | 'filingId'>): string {
  const d = detailsOf(entry.details);
  const parts: string[] = [];
  const who = typeof d.targetName === 'string' && d.targetName ? d.targetName : null;
  const email = typeof d.email === 'string' ? d.email : null;
  if (who && email) parts.push(`${who} (${email})`);
  else if (who || email) parts.push((who ?? email)!);
  if (typeof d.nameBefore === 'string' && typeof d.name === 'string') parts.push(`name: ${d.nameBefore} → ${d.name}`);
  else if (typeof d.name === 'string' && !who) parts.unshift(d.name);
  if (Array.isArray(d.roles)) parts.push(Array.isArray(d.rolesBefore) ? `roles: ${roleWords(d.rolesBefore)} → ${roleWords(d.roles)}` : `roles: ${roleWords(d.roles)}`);
  if (typeof d.active === 'boolean')
    parts.push(typeof d.activeBefore === 'boolean' ? `${d.activeBefore ? 'active' : 'inactive'} → ${d.active ? 'active' : 'inactive'}` : d.active ? 'active' : 'inactive');
  if (!parts.length && entry.targetType && !entry.filingId) parts.push(`${entry.targetType} #${entry.targetId}`);
  return parts.join(' · ');
}
