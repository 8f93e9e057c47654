/**
 * Mail about an account itself, sent to its own address and seen by no organisation: the link to
 * choose a new password (someone asked for it on the sign-in page), and the notice that the
 * password changed. They name no organisation, person or filing: whoever types an address on the
 * sign-in page learns nothing from what it receives.
 * Data: the link and when it expires; for the notice, how it changed and when.
 */

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const utc = (d: Date) => d.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';

const page = (paragraphs: string[]) => `<!doctype html><html><body style="font-family:sans-serif;color:#1c2b36">
${paragraphs.map((p) => `<p>${p}</p>`).join('\n')}
</body></html>`;

export interface PasswordResetMailData {
  link: string;
  expiresAt: Date;
}

export function renderPasswordResetMail(d: PasswordResetMailData) {
  const subject = 'Choose a new Fieldfile password';
  const text = [
    'Hello,',
    '',
    'Someone asked to choose a new password for the Fieldfile account of this address. If it was you, open this link (it works once and expires ' + utc(d.expiresAt) + '):',
    d.link,
    '',
    'Choosing a new password signs the account out everywhere else.',
    '',
    'If it was not you, ignore this message: the password stays as it is.',
    '— Fieldfile',
  ].join('\n');
  const html = page([
    'Hello,',
    'Someone asked to choose a new password for the Fieldfile account of this address.',
    `<a href="${escapeHtml(d.link)}">Choose a new password</a> — the link works once and expires ${escapeHtml(utc(d.expiresAt))}. Choosing a new password signs the account out everywhere else.`,
    '<span style="color:#5b6670">If it was not you, ignore this message: the password stays as it is.</span>',
  ]);
  return { subject, text, html };
}

export interface PasswordChangedMailData {
  how: 'changed' | 'reset';
  at: Date;
}

export function renderPasswordChangedMail(d: PasswordChangedMailData) {
  const subject = 'Your Fieldfile password changed';
  const what =
    d.how === 'reset'
      ? `The password of the Fieldfile account of this address was replaced through an e-mailed link at ${utc(d.at)}.`
      : `The password of the Fieldfile account of this address was changed from its profile at ${utc(d.at)}.`;
  const text = [
    'Hello,',
    '',
    what,
    'Every other session of the account was signed out.',
    '',
    'If that was not you, choose a new password now with "Forgot your password?" on the sign-in page, and tell your organisation’s admin.',
    '— Fieldfile',
  ].join('\n');
  const html = page([
    'Hello,',
    `${escapeHtml(what)} Every other session of the account was signed out.`,
    '<strong>If that was not you</strong>, choose a new password now with “Forgot your password?” on the sign-in page, and tell your organisation’s admin.',
  ]);
  return { subject, text, html };
}
