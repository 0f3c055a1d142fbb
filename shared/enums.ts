// Enumerations shared by the server, the client and the database checks.

export const BUILD_ROLES = ['owner', 'crew', 'reviewer'] as const;
export type BuildRole = (typeof BUILD_ROLES)[number];

/** Roles an owner may hand out by invite (ownership is only held by the creator). */
export const INVITABLE_ROLES = ['crew', 'reviewer'] as const;
export type InvitableRole = (typeof INVITABLE_ROLES)[number];

export const BUILD_STATUSES = ['planning', 'active', 'finished', 'sold'] as const;
export type BuildStatus = (typeof BUILD_STATUSES)[number];

export const ROLE_LABELS: Record<BuildRole, string> = {
  owner: 'Owner',
  crew: 'Crew',
  reviewer: 'Reviewer',
};

export const BUILD_STATUS_LABELS: Record<BuildStatus, string> = {
  planning: 'Planning',
  active: 'Underway',
  finished: 'Finished',
  sold: 'Sold',
};

export const PART_STATUSES = ['planned', 'ordered', 'on_hand', 'installed', 'returned', 'sold'] as const;
export type PartStatus = (typeof PART_STATUSES)[number];

export const PART_STATUS_LABELS: Record<PartStatus, string> = {
  planned: 'Planned',
  ordered: 'Ordered',
  on_hand: 'On the shelf',
  installed: 'Fitted',
  returned: 'Sent back',
  sold: 'Sold on',
};

/** Statuses whose money is committed: the part was bought (the estimate is no longer "remaining"). */
export const BOUGHT_STATUSES: readonly PartStatus[] = ['ordered', 'on_hand', 'installed', 'returned', 'sold'];

/** The systems every new build starts with; the owner renames, reorders, archives and adds to them. */
export const DEFAULT_SYSTEMS = [
  'Engine',
  'Wiring harness',
  'Cooling',
  'Fuel',
  'Drivetrain',
  'Exhaust',
  'Brakes',
  'Suspension',
  'Safety and track inspection',
  'Interior',
  'Body',
  'Tools and consumables',
] as const;

/** Where a receipt is on its way from photo to filed lines. */
export const RECEIPT_STATES = ['queued', 'reading', 'to_check', 'filed', 'failed'] as const;
export type ReceiptState = (typeof RECEIPT_STATES)[number];

export const RECEIPT_STATE_LABELS: Record<ReceiptState, string> = {
  queued: 'Waiting to be read',
  reading: 'Reading',
  to_check: 'Ready to check',
  filed: 'Filed',
  failed: 'Could not be read',
};

/** "answered": a builder replied to a question, so the receipt is back in the reviewer's queue. */
export const REVIEW_STATES = ['none', 'approved', 'questioned', 'answered'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const REVIEW_STATE_LABELS: Record<ReviewState, string> = {
  none: 'Not reviewed',
  approved: 'Approved',
  questioned: 'Questioned',
  answered: 'Answered',
};

export const CORE_STATES = ['owed', 'dropped_off', 'refunded', 'forfeited'] as const;
export type CoreState = (typeof CORE_STATES)[number];

export const CORE_STATE_LABELS: Record<CoreState, string> = {
  owed: 'Old part still here',
  dropped_off: 'Old part handed in',
  refunded: 'Deposit back',
  forfeited: 'Deposit lost',
};

/** What a receipt line is: money out for a part, money back for a return, a core deposit and its refund, a fee, a discount. */
export const RECEIPT_LINE_KINDS = ['part', 'return', 'core_charge', 'core_refund', 'fee', 'discount'] as const;
export type ReceiptLineKind = (typeof RECEIPT_LINE_KINDS)[number];

export const RECEIPT_LINE_KIND_LABELS: Record<ReceiptLineKind, string> = {
  part: 'Purchase',
  return: 'Return',
  core_charge: 'Core deposit',
  core_refund: 'Core refund',
  fee: 'Fee',
  discount: 'Discount',
};
