// A build's inbox: the private address that mailed receipts go to, and the mail it did not accept, with why.

/** Why a mailed message did not become a receipt. */
export const MAIL_REFUSAL_REASONS = ['unknown_address', 'old_address', 'not_a_member', 'reviewer', 'archived', 'refused_attachment', 'nothing_to_read'] as const;
export type MailRefusalReason = (typeof MAIL_REFUSAL_REASONS)[number];

export const MAIL_REFUSAL_LABELS: Record<MailRefusalReason, string> = {
  unknown_address: 'Sent to an address no build has',
  old_address: 'Sent to an address this build no longer uses',
  not_a_member: 'The sender is not on this build',
  reviewer: 'Reviewers cannot add receipts',
  archived: 'The build is archived',
  refused_attachment: 'An attachment could not be taken',
  nothing_to_read: 'Nothing in the message to read',
};

export interface InboxDto {
  /** `<token>@<receipts domain>`; mail to it from the owner or crew becomes receipts. */
  address: string;
}

export interface MailRefusalDto {
  id: string;
  receivedAt: string;
  from: string;
  subject: string;
  reason: MailRefusalReason;
  /** The reason in words, with what the sender can do. */
  detail: string;
}
