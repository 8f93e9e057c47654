/**
 * The invitation e-mail: produced when an admin adds a user; carries the one-time link to set a
 * password, or, for someone who already has a Fieldfile account, to accept with that account.
 * Data: the invitee's name, the organisation, who invited them, the link and its expiry.
 */
export interface InvitationMailData {
  inviteeName: string;
  organisationName: string;
  inviterName: string;
  roles: string[];
  link: string;
  expiresAt: Date;
  /** The address already has an account: the link joins it to the organisation. */
  existingAccount?: boolean;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function renderInvitationMail(d: InvitationMailData) {
  const expires = d.expiresAt.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
  const subject = `You're invited to ${d.organisationName} on Fieldfile`;
  const text = [
    `Hello ${d.inviteeName},`,
    '',
    `${d.inviterName} added you to ${d.organisationName} on Fieldfile as: ${d.roles.join(', ')}.`,
    '',
    (d.existingAccount ? 'Accept with your existing Fieldfile password here' : 'Choose your password here') + ' (the link works once and expires ' + expires + '):',
    d.link,
    '',
    'If you did not expect this, ignore this message.',
    '— Fieldfile',
  ].join('\n');
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#1c2b36">
<p>Hello ${escapeHtml(d.inviteeName)},</p>
<p>${escapeHtml(d.inviterName)} added you to <strong>${escapeHtml(d.organisationName)}</strong> on Fieldfile as: ${escapeHtml(d.roles.join(', '))}.</p>
<p><a href="${escapeHtml(d.link)}">${d.existingAccount ? 'Accept the invitation' : 'Choose your password'}</a> — the link works once and expires ${escapeHtml(expires)}.</p>
<p style="color:#5b6670">If you did not expect this, ignore this message.</p>
</body></html>`;
  return { subject, text, html };
}
