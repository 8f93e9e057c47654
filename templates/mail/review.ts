/**
 * The review hand-off e-mails, each as text and HTML with a link deep into the app:
 * - review requested: to every approver of the organisation, from the specialist's request;
 * - returned: to the filing's specialist(s), with the open comment threads;
 * - signed: to the filing's people, with the signer and the content hash.
 * Data: the filing's device name and model, version number, who acted, and the link.
 */
export interface ReviewMailBase {
  recipientName: string;
  deviceName: string;
  model: string;
  version: number;
  actorName: string;
  link: string;
}

export interface ReturnedMailData extends ReviewMailBase {
  note?: string;
  threads: { where: string; comments: { author: string; body: string }[] }[];
}

export interface SignedMailData extends ReviewMailBase {
  signedAt: string;
  contentSha256: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const shell = (inner: string) => `<!doctype html><html><body style="font-family:sans-serif;color:#1c2b36;line-height:1.45">
${inner}
<p style="color:#5b6670;font-size:13px">Fieldfile shows engineering estimates and summaries of lab measurements; the certifying body and accredited labs decide.</p>
</body></html>`;

const filingName = (d: ReviewMailBase) => `${d.deviceName} (${d.model}), version ${d.version}`;

export function renderReviewRequestedMail(d: ReviewMailBase) {
  const subject = `Ready for your review: ${d.deviceName}, version ${d.version}`;
  const text = [
    `Hello ${d.recipientName},`,
    '',
    `${d.actorName} asks you to review ${filingName(d)}. Its checklist has nothing that blocks signing.`,
    '',
    'Read it, leave comments on any step or row, then return it or sign it:',
    d.link,
    '',
    '— Fieldfile',
  ].join('\n');
  const html = shell(`<p>Hello ${escapeHtml(d.recipientName)},</p>
<p>${escapeHtml(d.actorName)} asks you to review <strong>${escapeHtml(filingName(d))}</strong>. Its checklist has nothing that blocks signing.</p>
<p><a href="${escapeHtml(d.link)}">Open the review</a> — leave comments on any step or row, then return it or sign it.</p>`);
  return { subject, text, html };
}

export function renderReturnedMail(d: ReturnedMailData) {
  const subject = `Returned with comments: ${d.deviceName}, version ${d.version}`;
  const threadText = d.threads.flatMap((t) => [`• ${t.where}`, ...t.comments.map((c) => `    ${c.author}: ${c.body}`)]);
  const text = [
    `Hello ${d.recipientName},`,
    '',
    `${d.actorName} returned ${filingName(d)} for changes.`,
    ...(d.note ? ['', `Note: ${d.note}`] : []),
    '',
    d.threads.length ? 'Open comments:' : 'There are no open comments.',
    ...threadText,
    '',
    'Answer each comment, make the changes and ask for review again:',
    d.link,
    '',
    '— Fieldfile',
  ].join('\n');
  const threadHtml = d.threads
    .map((t) => `<li><strong>${escapeHtml(t.where)}</strong><ul>${t.comments.map((c) => `<li>${escapeHtml(c.author)}: ${escapeHtml(c.body)}</li>`).join('')}</ul></li>`)
    .join('');
  const html = shell(`<p>Hello ${escapeHtml(d.recipientName)},</p>
<p>${escapeHtml(d.actorName)} returned <strong>${escapeHtml(filingName(d))}</strong> for changes.</p>
${d.note ? `<p>Note: ${escapeHtml(d.note)}</p>` : ''}
${d.threads.length ? `<p>Open comments:</p><ul>${threadHtml}</ul>` : '<p>There are no open comments.</p>'}
<p><a href="${escapeHtml(d.link)}">Answer the comments</a>, make the changes and ask for review again.</p>`);
  return { subject, text, html };
}

export function renderSignedMail(d: SignedMailData) {
  const subject = `Signed: ${d.deviceName}, version ${d.version}`;
  const text = [
    `Hello ${d.recipientName},`,
    '',
    `${d.actorName} signed ${filingName(d)} at ${d.signedAt}.`,
    `The signed content has SHA-256 ${d.contentSha256}. The version is now frozen; any change starts the next version.`,
    '',
    'See the signature and verify it:',
    d.link,
    '',
    '— Fieldfile',
  ].join('\n');
  const html = shell(`<p>Hello ${escapeHtml(d.recipientName)},</p>
<p>${escapeHtml(d.actorName)} signed <strong>${escapeHtml(filingName(d))}</strong> at ${escapeHtml(d.signedAt)}.</p>
<p>The signed content has SHA-256 <code>${escapeHtml(d.contentSha256)}</code>. The version is now frozen; any change starts the next version.</p>
<p><a href="${escapeHtml(d.link)}">See the signature and verify it</a></p>`);
  return { subject, text, html };
}
