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
