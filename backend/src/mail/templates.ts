// The wording of every e-mail, each with a plain-text part and a simple HTML part.
import type { MailMessage } from './mailer';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function html(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  return `<div style="font-family:sans-serif;color:#22302f">${body}<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p></div>`;
}

export function inviteMail(input: { to: string; inviterName: string; buildName: string; role: string; link: string }): MailMessage {
  const lines = [
    `${input.inviterName} invited you to the build "${input.buildName}" on Tallyhood as ${input.role}.`,
    'The link works for 7 days.',
  ];
  return {
    to: input.to,
    subject: `Join "${input.buildName}" on Tallyhood`,
    text: `${lines.join('\n\n')}\n\nOpen the invite: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Open the invite' }),
  };
}

export function passwordResetMail(input: { to: string; link: string }): MailMessage {
  const lines = [
    'Someone asked to reset the password of your Tallyhood account.',
    'The link works once, for one hour. If it was not you, ignore this mail: your password stays as it is.',
  ];
  return {
    to: input.to,
    subject: 'Reset your Tallyhood password',
    text: `${lines.join('\n\n')}\n\nChoose a new password: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Choose a new password' }),
  };
}

export function commentMail(input: { to: string; author: string; receiptLabel: string; body: string; link: string }): MailMessage {
  const lines = [`${input.author} commented on ${input.receiptLabel}:`, input.body];
  return {
    to: input.to,
    subject: `${input.author} commented on ${input.receiptLabel}`,
    text: `${lines.join('\n\n')}\n\nOpen the receipt: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Open the receipt' }),
  };
}
