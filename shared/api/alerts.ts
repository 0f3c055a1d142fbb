// Mail alerts: the kinds a person can receive, the defaults per role, and the preference request and response.
import { z } from 'zod';
import type { BuildRole } from '../enums';

/** Every mail alert a build can send. The order is the order the settings page lists them in. */
export const ALERT_KINDS = ['budget', 'coreDue', 'returnWindow', 'warrantyEnding', 'duplicate', 'reviewDigest'] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];

export type AlertPreferences = Record<AlertKind, boolean>;

/**
 * What a person gets until they choose otherwise. Our choice: the owner is told everything; crew, who buy and hand
 * in parts, get the money and deadline alerts; a reviewer gets the digest of what was filed, which is their job.
 * Every role may switch any kind on or off.
 */
export const DEFAULT_ALERT_PREFERENCES: Record<BuildRole, AlertPreferences> = {
  owner: { budget: true, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: true, reviewDigest: true },
  crew: { budget: true, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: false, reviewDigest: false },
  reviewer: { budget: false, coreDue: false, returnWindow: false, warrantyEnding: false, duplicate: false, reviewDigest: true },
};

export const ALERT_LABELS: Record<AlertKind, { label: string; explanation: string }> = {
  budget: { label: 'Budget reached', explanation: 'When a system has used 90 % and then 100 % of its budget.' },
  coreDue: { label: 'Core deposit due', explanation: 'When an old part must go back within 7 days to get its deposit refunded.' },
  returnWindow: { label: 'Return window closing', explanation: 'When parts not yet fitted can be returned for 7 more days at most.' },
  warrantyEnding: { label: 'Warranty ending', explanation: 'When a part\'s warranty ends within 30 days, with its receipt to hand.' },
  duplicate: { label: 'Possible duplicate receipt', explanation: 'When a receipt has the same document, or the same shop, date and total, as another.' },
  reviewDigest: { label: 'Digest of filed receipts', explanation: 'Once a day at most: the receipts filed since the last digest, with totals.' },
};

const flag = (kind: AlertKind) => z.boolean({ error: `Choose on or off for "${ALERT_LABELS[kind].label}".` });

/** PUT body: every kind, so the stored row always says exactly what the person chose. */
export const alertPreferencesRequest = z
  .object({
    budget: flag('budget'),
    coreDue: flag('coreDue'),
    returnWindow: flag('returnWindow'),
    warrantyEnding: flag('warrantyEnding'),
    duplicate: flag('duplicate'),
    reviewDigest: flag('reviewDigest'),
  })
  .strict();
export type AlertPreferencesRequest = z.input<typeof alertPreferencesRequest>;

export interface AlertPreferencesDto extends AlertPreferences {
  /** False while the person has never saved a choice and gets their role's defaults. */
  chosen: boolean;
}
