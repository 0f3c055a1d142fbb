// Request schemas and response types for builds and their crew.
import { z } from 'zod';
import { code as currencyByCode } from 'currency-codes';
import { BUILD_STATUSES, BuildRole, BuildStatus, INVITABLE_ROLES, InvitableRole } from '../enums';
import { emailSchema } from './auth';
import { calendarDate } from './dates';

const optionalIsoDate = z.union([calendarDate, z.null()]).optional();

export const currencyCodeSchema = z
  .string({ error: 'Choose a currency.' })
  .trim()
  .toUpperCase()
  .refine((value) => /^[A-Z]{3}$/.test(value) && !!currencyByCode(value), 'Choose an ISO 4217 currency code such as USD or EUR.');

export const localeSchema = z
  .string()
  .trim()
  // The column is 35 wide, the length RFC 5646 §4.4.1 asks every implementation to store.
  .max(35, 'A language tag is at most 35 characters, such as en-US or en-GB.')
  .refine((value) => {
    try {
      return Intl.getCanonicalLocales(value).length === 1;
    } catch {
      return false;
    }
  }, 'Use a language tag such as en-US or en-GB.');

const buildStatusSchema = z.enum(BUILD_STATUSES, { error: `Choose one of: ${BUILD_STATUSES.join(', ')}.` });

const buildFields = {
  name: z.string({ error: 'Give the build a name.' }).trim().min(1, 'Give the build a name.').max(120, 'A name is at most 120 characters.'),
  vehicle: z.string().trim().max(200, 'The vehicle is at most 200 characters.').default(''),
  currency: currencyCodeSchema,
  locale: localeSchema.default('en-US'),
  status: buildStatusSchema.default('planning'),
  startedOn: optionalIsoDate,
  targetDate: optionalIsoDate,
};

function targetAfterStart(value: { startedOn?: string | null; targetDate?: string | null }, context: z.RefinementCtx) {
  if (value.startedOn && value.targetDate && value.targetDate < value.startedOn) {
    context.addIssue({ code: 'custom', path: ['targetDate'], message: 'The target date is before the start date.' });
  }
}

export const createBuildRequest = z.object(buildFields).superRefine(targetAfterStart);
export type CreateBuildRequest = z.input<typeof createBuildRequest>;

/** How many days after purchase a shop takes a part back; a year at most, 0 for shops that take nothing back. */
export const returnWindowDaysSchema = z
  .number({ error: 'Enter the return window as a number of days.' })
  .int('Enter the return window as a whole number of days.')
  .min(0, 'The return window cannot be negative.')
  .max(365, 'The return window is at most 365 days.');

/** The currency is fixed at creation: every amount of the build is in it. */
export const updateBuildRequest = z
  .object({
    name: buildFields.name.optional(),
    vehicle: z.string().trim().max(200, 'The vehicle is at most 200 characters.').optional(),
    locale: localeSchema.optional(),
    // No default here: a PATCH changes only the fields it carries.
    status: buildStatusSchema.optional(),
    startedOn: optionalIsoDate,
    targetDate: optionalIsoDate,
    returnWindowDays: returnWindowDaysSchema.optional(),
    version: z.number({ error: 'Send the version you last saw.' }).int().min(1),
  })
  .strict()
  .superRefine(targetAfterStart);
export type UpdateBuildRequest = z.input<typeof updateBuildRequest>;

export interface BuildDto {
  id: string;
  name: string;
  vehicle: string;
  currency: string;
  locale: string;
  status: BuildStatus;
  startedOn: string | null;
  targetDate: string | null;
  /** Days after purchase a part not yet fitted can be returned. */
  returnWindowDays: number;
  archived: boolean;
  version: number;
  /** The caller's role on this build. */
  role: BuildRole;
  createdAt: string;
}

export const inviteRequest = z.object({
  email: emailSchema,
  role: z.enum(INVITABLE_ROLES, { error: 'Choose crew or reviewer.' }),
});
export type InviteRequest = z.infer<typeof inviteRequest>;

export const changeRoleRequest = z.object({
  role: z.enum(['owner', 'crew', 'reviewer'], { error: 'Choose owner, crew or reviewer.' }),
});
export type ChangeRoleRequest = z.infer<typeof changeRoleRequest>;

export interface MemberDto {
  userId: string;
  email: string;
  displayName: string;
  role: BuildRole;
  joinedAt: string;
}

export interface InviteDto {
  id: string;
  email: string;
  role: InvitableRole;
  expiresAt: string;
  createdAt: string;
}

export interface MembersResponse {
  members: MemberDto[];
  /** Pending invites; listed for the owner only. */
  invites: InviteDto[];
}

/** GET /api/invites/:token: what a person sees before accepting. */
export interface InvitePreviewDto {
  buildName: string;
  role: InvitableRole;
  email: string;
  invitedBy: string;
  expiresAt: string;
}
