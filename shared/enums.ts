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
