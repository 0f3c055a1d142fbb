// The wording of every e-mail, each with a plain-text part and a simple HTML part.
import type { MailMessage } from './mailer';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function html(paragraphs: string[], ...links: { href: string; label: string }[]): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  const anchors = links.map((link) => `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`).join('');
  return `<div style="font-family:sans-serif;color:#22302f">${body}${anchors}</div>`;
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

/** To a new address: the one-time link that makes the account. */
export function signUpLinkMail(input: { to: string; displayName: string; link: string }): MailMessage {
  const lines = [
    `Welcome to Tallyhood, ${input.displayName}. One step is left: open the link below and your account is made and signed in.`,
    'The link works once, for 24 hours. If you did not sign up, ignore this mail: no account is made.',
  ];
  return {
    to: input.to,
    subject: 'Finish creating your Tallyhood account',
    text: `${lines.join('\n\n')}\n\nFinish creating your account: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Finish creating your account' }),
  };
}

/** To an address that has an account, when someone signs up with it again: nothing was changed. */
export function signUpKnownAddressMail(input: { to: string; signInLink: string; resetLink: string }): MailMessage {
  const lines = [
    'Someone tried to create a Tallyhood account with this address, which already has one. Nothing was changed.',
    'If it was you, sign in with your password, or choose a new password if you have forgotten it. If it was not you, ignore this mail.',
  ];
  return {
    to: input.to,
    subject: 'You already have a Tallyhood account',
    text: `${lines.join('\n\n')}\n\nSign in: ${input.signInLink}\nChoose a new password: ${input.resetLink}\n`,
    html: html(lines, { href: input.signInLink, label: 'Sign in' }, { href: input.resetLink, label: 'Choose a new password' }),
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

/** To the reviewer who asked: the builder's reply, with the question it answers. */
export function answerMail(input: { to: string; author: string; receiptLabel: string; question: string; body: string; link: string }): MailMessage {
  const lines = [`${input.author} answered your question on ${input.receiptLabel}.`, `You asked: ${input.question}`, `Answer: ${input.body}`, 'The receipt is back in your review queue.'];
  return {
    to: input.to,
    subject: `${input.author} answered your question on ${input.receiptLabel}`,
    text: `${lines.join('\n\n')}\n\nReview it again: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Review it again' }),
  };
}

/** To the uploader: the reviewer approved their receipt. */
export function approvedMail(input: { to: string; reviewer: string; receiptLabel: string; link: string }): MailMessage {
  const lines = [`${input.reviewer} approved ${input.receiptLabel}.`, 'Nothing more is needed for it.'];
  return {
    to: input.to,
    subject: `${input.reviewer} approved ${input.receiptLabel}`,
    text: `${lines.join('\n\n')}\n\nOpen the receipt: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Open the receipt' }),
  };
}

/** To an uploader of either receipt of a pair: it is no longer flagged as a likely duplicate, and why. */
export function notDuplicateMail(input: { to: string; author: string; receiptLabel: string; reason: string; link: string }): MailMessage {
  const lines = [`${input.author} marked ${input.receiptLabel} and the receipt it resembled as two purchases, not a duplicate.`, `Reason: ${input.reason}`];
  return {
    to: input.to,
    subject: `${input.receiptLabel} is not a duplicate`,
    text: `${lines.join('\n\n')}\n\nOpen the receipt: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Open the receipt' }),
  };
}

// Mail alerts (budget, core deposit, return window, likely duplicate, reviewer digest). Amounts arrive formatted
// in the build's currency and locale; each mail ends with where to change which alerts a person gets.

function alertMail(input: { to: string; subject: string; lines: string[]; link: { href: string; label: string }; settingsLink: string }): MailMessage {
  const footer = `You get this mail because this alert is on for you. Choose which alerts you get: ${input.settingsLink}`;
  return {
    to: input.to,
    subject: input.subject,
    text: `${input.lines.join('\n\n')}\n\n${input.link.label}: ${input.link.href}\n\n${footer}\n`,
    html: html([...input.lines, footer], input.link),
  };
}

export function budgetAlertMail(input: {
  to: string;
  buildName: string;
  systemName: string;
  threshold: 90 | 100;
  netCost: string;
  budget: string;
  percent: string;
  link: string;
  settingsLink: string;
}): MailMessage {
  const reached = input.threshold === 100 ? 'has used all of its budget' : 'has used 90 % of its budget';
  return alertMail({
    to: input.to,
    subject: `${input.systemName} ${reached} on "${input.buildName}"`,
    lines: [
      `${input.systemName} on "${input.buildName}" has cost ${input.netCost} so far, against a budget of ${input.budget} (${input.percent} %).`,
      input.threshold === 100
        ? 'Raise the budget, or look at the parts still planned for this system.'
        : 'Check the parts still planned for this system before the budget runs out.',
    ],
    link: { href: input.link, label: 'Open the ledger' },
    settingsLink: input.settingsLink,
  });
}

export function coreDueMail(input: {
  to: string;
  buildName: string;
  description: string;
  deposit: string;
  dueDate: string;
  /** "in 7 days", "today", "3 days ago". */
  when: string;
  vendorName: string | null;
  overdue: boolean;
  link: string;
  settingsLink: string;
}): MailMessage {
  const from = input.vendorName ? ` to ${input.vendorName}` : '';
  return alertMail({
    to: input.to,
    subject: `Core deposit of ${input.deposit} due back by ${input.dueDate}: ${input.description}`,
    lines: [
      `The old part for "${input.description}" on "${input.buildName}" ${input.overdue ? 'was' : 'is'} due back${from} by ${input.dueDate} (${input.when}).`,
      `Hand it in to get the core deposit of ${input.deposit} refunded, then mark the core as handed in.`,
    ],
    link: { href: input.link, label: 'Open cores and returns' },
    settingsLink: input.settingsLink,
  });
}

export function returnWindowMail(input: {
  to: string;
  buildName: string;
  vendorName: string | null;
  purchaseDate: string;
  returnableUntil: string;
  lines: { description: string; amount: string }[];
  link: string;
  settingsLink: string;
}): MailMessage {
  const from = input.vendorName ?? 'a receipt';
  const count = input.lines.length === 1 ? '1 part' : `${input.lines.length} parts`;
  return alertMail({
    to: input.to,
    subject: `Return window closes ${input.returnableUntil}: ${count} from ${from}`,
    lines: [
      `These parts on "${input.buildName}", bought from ${from} on ${input.purchaseDate}, are not fitted yet and can be returned until ${input.returnableUntil}:`,
      ...input.lines.map((line) => `${line.description}: ${line.amount}`),
      'If you will not use them, return them with the receipt before then. The shop decides in the end what it takes back.',
    ],
    link: { href: input.link, label: 'Open the receipt' },
    settingsLink: input.settingsLink,
  });
}

export function warrantyEndingMail(input: {
  to: string;
  buildName: string;
  description: string;
  months: number;
  ends: string;
  /** "in 30 days", "today". */
  when: string;
  /** The receipt the warranty rests on, described ("Ashgrove Motor Spares, Mar 14, 2026"), or null when none is linked. */
  receiptLabel: string | null;
  link: string;
  settingsLink: string;
}): MailMessage {
  return alertMail({
    to: input.to,
    subject: `Warranty ends ${input.ends}: ${input.description}`,
    lines: [
      `The ${input.months}-month warranty on "${input.description}" on "${input.buildName}" ends on ${input.ends} (${input.when}).`,
      input.receiptLabel
        ? `It rests on the receipt from ${input.receiptLabel}. If the part is failing, take it and the receipt to the shop before then.`
        : 'No receipt is linked to it: find the proof of purchase now, in case the part fails before then.',
    ],
    link: input.receiptLabel ? { href: input.link, label: 'Open the receipt' } : { href: input.link, label: 'Open the parts' },
    settingsLink: input.settingsLink,
  });
}

export function duplicateReceiptMail(input: {
  to: string;
  buildName: string;
  receiptLabel: string;
  sameDocument: boolean;
  otherCount: number;
  link: string;
  settingsLink: string;
}): MailMessage {
  const others = input.otherCount === 1 ? 'another receipt' : `${input.otherCount} other receipts`;
  const why = input.sameDocument ? 'the same document' : 'the same shop, date and total';
  return alertMail({
    to: input.to,
    subject: `Possible duplicate receipt on "${input.buildName}": ${input.receiptLabel}`,
    lines: [
      `${input.receiptLabel} has ${why} as ${others} on "${input.buildName}".`,
      'If it was entered twice, delete one so the money is not counted twice. Small items bought again are normal: then there is nothing to do.',
    ],
    link: { href: input.link, label: 'Open the receipt' },
    settingsLink: input.settingsLink,
  });
}

export function reviewDigestMail(input: {
  to: string;
  buildName: string;
  since: string;
  receipts: { label: string; total: string }[];
  totals: string[];
  link: string;
  settingsLink: string;
}): MailMessage {
  const count = input.receipts.length === 1 ? '1 receipt' : `${input.receipts.length} receipts`;
  return alertMail({
    to: input.to,
    subject: `Digest: ${count} filed on "${input.buildName}"`,
    lines: [
      `Filed on "${input.buildName}" since ${input.since}:`,
      ...input.receipts.map((receipt) => `${receipt.label}: ${receipt.total}`),
      `Total: ${input.totals.join(', ')}`,
    ],
    link: { href: input.link, label: 'Open the review queue' },
    settingsLink: input.settingsLink,
  });
}

/** To a member whose mailed receipt was not taken: what was wrong with it and what to send instead. */
export function mailedReceiptRefusedMail(input: { to: string; buildName: string; subject: string; reasons: string[]; link: string }): MailMessage {
  const lines = [
    `Your message "${input.subject}" to the inbox of "${input.buildName}" did not become a receipt, and nothing of it was kept as one:`,
    ...input.reasons,
    'Send the receipt again as a photo or PDF attachment, or upload it in the app.',
  ];
  return {
    to: input.to,
    subject: `Not added to "${input.buildName}": ${input.subject}`,
    text: `${lines.join('\n\n')}\n\nOpen the receipts: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Open the receipts' }),
  };
}
