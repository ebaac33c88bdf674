// The words of each e-mail Phasewright sends. Plain text first; the HTML says the same.
const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[ch]!);

export function passwordResetMail(name: string, url: string) {
  const text = [
    `Hello ${name},`,
    '',
    'Someone asked to reset the password of your Phasewright account.',
    `Open this link within the hour to choose a new one:`,
    url,
    '',
    'If it was not you, ignore this message: your password stays as it is.',
  ].join('\n');
  const html =
    `<p>Hello ${escapeHtml(name)},</p><p>Someone asked to reset the password of your Phasewright account. ` +
    `Open this link within the hour to choose a new one:</p><p><a href="${escapeHtml(url)}">${escapeHtml(url)}</a></p>` +
    `<p>If it was not you, ignore this message: your password stays as it is.</p>`;
  return { subject: 'Reset your Phasewright password', text, html };
}

export function pinMail(input: { kind: 'pin' | 'reply'; author: string; sheetName: string; number: number; text: string; url: string }) {
  const what = input.kind === 'pin' ? `added pin ${input.number}` : `replied on pin ${input.number}`;
  const subject = `${input.author} ${what} on ${input.sheetName}`;
  const text = [`${input.author} ${what} on the sheet "${input.sheetName}":`, '', input.text, '', `Open it: ${input.url}`, '', 'You can turn these e-mails off in Phasewright.'].join('\n');
  const html =
    `<p>${escapeHtml(input.author)} ${what} on the sheet “${escapeHtml(input.sheetName)}”:</p>` +
    `<blockquote>${escapeHtml(input.text).replace(/\n/g, '<br>')}</blockquote>` +
    `<p><a href="${escapeHtml(input.url)}">Open the pin</a></p><p>You can turn these e-mails off in Phasewright.</p>`;
  return { subject, text, html };
}

export function invitationMail(input: { inviter: string; projectName: string; role: string; url: string }) {
  const subject = `${input.inviter} invited you to ${input.projectName} on Phasewright`;
  const text = [
    `${input.inviter} invited you to the project "${input.projectName}" on Phasewright, as ${input.role}.`,
    '',
    'Open this link within 7 days to accept (it works once):',
    input.url,
  ].join('\n');
  const html =
    `<p>${escapeHtml(input.inviter)} invited you to the project “${escapeHtml(input.projectName)}” on Phasewright, as ${escapeHtml(input.role)}.</p>` +
    `<p><a href="${escapeHtml(input.url)}">Accept the invitation</a> within 7 days (the link works once).</p>`;
  return { subject, text, html };
}

export function reviewMail(input: { reviewer: string; verdict: 'reviewed' | 'approved'; sheetName: string; number: number; comment: string; url: string; viaLink: boolean }) {
  const what = input.verdict === 'approved' ? 'approved' : 'marked as reviewed';
  const who = input.viaLink ? `${input.reviewer} (through a viewer link)` : input.reviewer;
  const subject = `${input.reviewer} ${what} revision ${input.number} of ${input.sheetName}`;
  const said = input.comment ? ['', input.comment] : [];
  const text = [`${who} ${what} revision ${input.number} of the sheet "${input.sheetName}".`, ...said, '', `Open it: ${input.url}`].join('\n');
  const html =
    `<p>${escapeHtml(who)} ${what} revision ${input.number} of the sheet “${escapeHtml(input.sheetName)}”.</p>` +
    (input.comment ? `<blockquote>${escapeHtml(input.comment).replace(/\n/g, '<br>')}</blockquote>` : '') +
    `<p><a href="${escapeHtml(input.url)}">Open the revision</a></p>`;
  return { subject, text, html };
}
