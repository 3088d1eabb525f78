import { ROLE_LABELS, type Role } from '@shared/roles';
import { SAFETY_POINTS, SAFETY_TEXT } from '@shared/safety';
import type { MailMessage } from '../core/jobs';

/** Escapes text for the HTML part of a mail. */
function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** The safety caution for mails about coaching and progress; the same words as the app's safety note. */
const SAFETY_HTML = `<div style="margin:16px 0 0;padding:8px 12px;border-left:3px solid #D99A1E;background:#FBEFD6;font-size:12px;color:#1F2A36"><strong>Safety</strong><ul style="margin:4px 0 0;padding-left:18px">${SAFETY_POINTS.map((p) => `<li>${escapeHtml(p)}</li>`).join('')}</ul></div>`;

function layout(paragraphs: string[], link: { href: string; label: string }, options: { safety?: boolean } = {}): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('');
  return `<!doctype html><html><body style="font-family:'Open Sans',Arial,sans-serif;color:#1F2A36;background:#F5F3EE;padding:24px">
<div style="max-width:560px;margin:auto;background:#fff;border-radius:8px;padding:24px">
<p style="font-weight:700;font-size:18px;margin:0 0 16px">Trenchwork</p>${body}
<p><a href="${escapeHtml(link.href)}" style="background:#2E6B4F;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>
<p style="font-size:12px;color:#55606b">If the button does not work, copy this address into your browser: ${escapeHtml(link.href)}</p>${options.safety ? SAFETY_HTML : ''}
</div></body></html>`;
}

export function invitationMail(args: { to: string; teamName: string; inviterName: string; role: Role; link: string; expiresAt: Date }): MailMessage {
  const role = ROLE_LABELS[args.role].toLowerCase();
  const until = args.expiresAt.toUTCString();
  const lines = [
    `${args.inviterName} invited you to join ${args.teamName} on Trenchwork as ${role}.`,
    `Open the link below to set your name and password. The link works once and expires ${until}.`,
  ];
  return {
    to: args.to,
    subject: `You're invited to ${args.teamName} on Trenchwork`,
    text: `${lines.join('\n\n')}\n\n${args.link}\n\nIf you did not expect this, you can ignore this mail.\n`,
    html: layout([...lines, 'If you did not expect this, you can ignore this mail.'], { href: args.link, label: 'Accept the invitation' }),
    purpose: 'invitation',
  };
}

export function passwordResetMail(args: { to: string; name: string; link: string; ttlMinutes: number }): MailMessage {
  const lines = [
    `Hi ${args.name},`,
    `Someone asked to reset the password of your Trenchwork account. Open the link below within ${args.ttlMinutes} minutes to choose a new one. The link works once.`,
    'If it was not you, ignore this mail: your password stays as it is.',
  ];
  return {
    to: args.to,
    subject: 'Reset your Trenchwork password',
    text: `${lines.join('\n\n')}\n\n${args.link}\n`,
    html: layout(lines, { href: args.link, label: 'Choose a new password' }),
    purpose: 'password_reset',
  };
}

export function gradeSheetMail(args: { to: string; playerName: string; sessionTitle: string; lines: string[]; link: string }): MailMessage {
  const intro = `Hi ${args.playerName}, here is your grade sheet for ${args.sessionTitle}.`;
  return {
    to: args.to,
    subject: `Your grade sheet: ${args.sessionTitle}`,
    text: `${intro}\n\n${args.lines.join('\n')}\n\nWatch your clips and your coach's points: ${args.link}\n`,
    html: layout([intro, ...args.lines], { href: args.link, label: 'Open Trenchwork' }),
    purpose: 'grade_sheet',
  };
}

export interface DigestPoint {
  sessionTitle: string;
  snapOrder: number | null;
  at: string;
  kind: string;
  body: string;
  author: string;
  link: string;
}

/** New coaching points in one mail, with a link straight to each clip. Non-essential: has an unsubscribe link. */
export function coachingDigestMail(args: { to: string; playerName: string; points: DigestPoint[]; queueLink: string; unsubscribeLink: string }): MailMessage {
  const count = args.points.length;
  const intro = `Hi ${args.playerName}, your coaches left ${count} new coaching point${count === 1 ? '' : 's'} on your film.`;
  const lines = args.points.map((p) => `${p.sessionTitle}${p.snapOrder ? `, snap ${p.snapOrder}` : ''} at ${p.at} (${p.kind}, ${p.author}): ${p.body}\n  ${p.link}`);
  const footer = `You get at most one of these an hour. Stop these mails: ${args.unsubscribeLink}`;
  const items = args.points
    .map((p) => `<li style="margin:0 0 10px"><strong>${escapeHtml(p.sessionTitle)}${p.snapOrder ? `, snap ${p.snapOrder}` : ''} · ${escapeHtml(p.at)}</strong> — ${escapeHtml(p.kind)}, ${escapeHtml(p.author)}<br>${escapeHtml(p.body)}<br><a href="${escapeHtml(p.link)}">Watch this clip</a></li>`)
    .join('');
  return {
    to: args.to,
    subject: `${count} new coaching point${count === 1 ? '' : 's'} on your film`,
    text: `${intro}\n\n${lines.join('\n\n')}\n\nYour study queue: ${args.queueLink}\n\n${SAFETY_TEXT}\n\n${footer}\n`,
    html: `<!doctype html><html><body style="font-family:'Open Sans',Arial,sans-serif;color:#1F2A36;background:#F5F3EE;padding:24px"><div style="max-width:560px;margin:auto;background:#fff;border-radius:8px;padding:24px"><p style="font-weight:700;font-size:18px;margin:0 0 16px">Trenchwork</p><p>${escapeHtml(intro)}</p><ul style="padding-left:18px">${items}</ul><p><a href="${escapeHtml(args.queueLink)}">Open your study queue</a></p>${SAFETY_HTML}<p style="font-size:12px;color:#55606b">You get at most one of these an hour. <a href="${escapeHtml(args.unsubscribeLink)}">Stop these mails</a>.</p></div></body></html>`,
    purpose: 'coaching_digest',
  };
}

export function weeklySummaryMail(args: { to: string; playerName: string; lines: string[]; link: string; unsubscribeLink: string }): MailMessage {
  const intro = `Hi ${args.playerName}, here is your week on film.`;
  return {
    to: args.to,
    subject: 'Your week on film',
    text: `${intro}\n\n${args.lines.join('\n')}\n\n${args.link}\n\n${SAFETY_TEXT}\n\nStop these weekly mails: ${args.unsubscribeLink}\n`,
    html: layout([intro, ...args.lines, `Stop these weekly mails: ${args.unsubscribeLink}`], { href: args.link, label: 'See your progress' }, { safety: true }),
    purpose: 'weekly_summary',
  };
}
