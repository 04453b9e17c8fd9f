// Baywright's own e-mails: plain words, a text part and a matching HTML part, one link each.

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const SIGN_OFF = 'Baywright — shared steel floor framing for your team';

function formatDate(date: Date): string {
  return date.toLocaleString('en-GB', {
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    timeZone: 'UTC',
    timeZoneName: 'short',
  });
}

/** Paragraphs (already escaped HTML) plus an optional button link, in a plain frame. */
function htmlFrame(title: string, paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${p}</p>`).join('\n');
  const button = link
    ? `<p style="margin:20px 0"><a href="${escapeHtml(link.href)}" style="display:inline-block;padding:10px 16px;background:#1f5fa8;color:#ffffff;text-decoration:none;border-radius:3px">${escapeHtml(link.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#55606b">If the button does not work, copy this address into your browser:<br><a href="${escapeHtml(link.href)}">${escapeHtml(link.href)}</a></p>`
    : '';
  return `<!doctype html>
<html><body style="margin:0;padding:24px;background:#f6f3ec;font-family:Inter,Arial,sans-serif;color:#1c2228">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #1c2228;padding:24px">
<h1 style="margin:0 0 16px;font-size:18px">${escapeHtml(title)}</h1>
${body}
${button}
<p style="margin:24px 0 0;font-size:12px;color:#55606b">${escapeHtml(SIGN_OFF)}</p>
</div></body></html>`;
}

const ROLE_WORDS: Record<string, string> = {
  owner: 'owner',
  engineer: 'engineer',
  drafter: 'drafter',
  manager: 'manager',
};

export function invitationMail(input: {
  firmName: string;
  inviterName: string;
  role: string;
  link: string;
  expiresAt: Date;
}): MailContent {
  const role = ROLE_WORDS[input.role] ?? input.role;
  const subject = `${input.inviterName} invited you to ${input.firmName} on Baywright`;
  const text = [
    'Hello,',
    '',
    `${input.inviterName} has invited you to join ${input.firmName} on Baywright as ${article(role)} ${role}.`,
    '',
    'To accept, open this link, then choose your name and a password:',
    input.link,
    '',
    `The link works once and until ${formatDate(input.expiresAt)}.`,
    'If you were not expecting this, you can ignore this message; nothing happens until the link is used.',
    '',
    SIGN_OFF,
  ].join('\n');
  const html = htmlFrame(
    `Join ${input.firmName} on Baywright`,
    [
      `${escapeHtml(input.inviterName)} has invited you to join <strong>${escapeHtml(input.firmName)}</strong> on Baywright as ${article(role)} <strong>${escapeHtml(role)}</strong>.`,
      'Open the link, then choose your name and a password.',
      `The link works once and until ${escapeHtml(formatDate(input.expiresAt))}. If you were not expecting this, you can ignore this message.`,
    ],
    { href: input.link, label: 'Accept the invitation' },
  );
  return { subject, text, html };
}

export function passwordResetMail(input: { name: string; link: string; expiresAt: Date }): MailContent {
  const subject = 'Choose a new Baywright password';
  const text = [
    `Hello ${input.name},`,
    '',
    'Someone (we hope you) asked to choose a new password for your Baywright account.',
    'Open this link to choose it:',
    input.link,
    '',
    `The link works once and until ${formatDate(input.expiresAt)}. Choosing a new password signs you out everywhere.`,
    'If you did not ask for this, ignore this message: your password stays as it is.',
    '',
    SIGN_OFF,
  ].join('\n');
  const html = htmlFrame(
    'Choose a new password',
    [
      `Hello ${escapeHtml(input.name)},`,
      'Someone (we hope you) asked to choose a new password for your Baywright account.',
      `The link works once and until ${escapeHtml(formatDate(input.expiresAt))}. Choosing a new password signs you out everywhere.`,
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ],
    { href: input.link, label: 'Choose a new password' },
  );
  return { subject, text, html };
}

export function schemeStatusMail(input: {
  recipientName: string;
  firmName: string;
  projectName: string;
  schemeName: string;
  event: 'submitted' | 'chosen';
  link?: string;
}): MailContent {
  const what =
    input.event === 'submitted'
      ? `Scheme "${input.schemeName}" of ${input.projectName} is ready for your review.`
      : `Scheme "${input.schemeName}" of ${input.projectName} has been chosen; it is the one the team goes ahead with.`;
  const subject =
    input.event === 'submitted'
      ? `For review: ${input.schemeName} (${input.projectName})`
      : `Chosen: ${input.schemeName} (${input.projectName})`;
  const text = [
    `Hello ${input.recipientName},`,
    '',
    what,
    ...(input.link ? ['', input.link] : []),
    '',
    `You get this because of your notification settings in ${input.firmName}; change them under Settings in Baywright.`,
    '',
    SIGN_OFF,
  ].join('\n');
  const html = htmlFrame(
    subject,
    [
      `Hello ${escapeHtml(input.recipientName)},`,
      escapeHtml(what),
      `You get this because of your notification settings in ${escapeHtml(input.firmName)}; change them under Settings in Baywright.`,
    ],
    input.link ? { href: input.link, label: 'Open the project' } : undefined,
  );
  return { subject, text, html };
}

function article(word: string): string {
  return /^[aeiou]/i.test(word) ? 'an' : 'a';
}
