// A car build: the unit every part, receipt and member belongs to.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { BUILD_STATUSES, type BuildStatus } from '../../../shared/enums';
import { Decimal } from '../../../shared/money';
import { DecimalType } from '../db/decimal-type';
import { newInboxToken } from '../inbox/inbox-token';

export class Build {
  [OptionalProps]?: 'createdAt' | 'updatedAt' | 'version' | 'vehicle' | 'locale' | 'status' | 'startedOn' | 'targetDate' | 'archivedAt' | 'contingencyBudget' | 'returnWindowDays' | 'inboxToken';
  id: string = randomUUID();
  name!: string;
  vehicle = '';
  /** ISO 4217 code, fixed at creation. */
  currency!: string;
  /** BCP 47 tag: formats and day-first or month-first dates. */
  locale = 'en-US';
  status: BuildStatus = 'planning';
  startedOn: string | null = null;
  targetDate: string | null = null;
  archivedAt: Date | null = null;
  /** Held back for the unexpected; the build's budget is the systems' budgets plus this. */
  contingencyBudget: Decimal = new Decimal(0);
  /** Days after purchase a shop takes a part back: 30 is common practice, from memory (windows of 30 to 90 days are usual). */
  returnWindowDays = 30;
  /** The private part of the build's inbox address (inbox/inbox-token.ts); rotating it retires the old one. */
  inboxToken: string = newInboxToken();
  version = 1;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const BuildSchema = new EntitySchema<Build>({
  class: Build,
  properties: {
    id: { type: 'uuid', primary: true },
    name: { type: 'string', length: 120 },
    vehicle: { type: 'string', length: 200, default: '' },
    currency: { type: 'string', length: 3 },
    locale: { type: 'string', length: 35, default: 'en-US' },
    status: { enum: true, items: () => [...BUILD_STATUSES], nativeEnumName: undefined, default: 'planning' },
    startedOn: { type: 'date', nullable: true },
    targetDate: { type: 'date', nullable: true },
    archivedAt: { type: 'datetime', nullable: true },
    contingencyBudget: { type: DecimalType, default: '0' },
    returnWindowDays: { type: 'integer', default: 30 },
    inboxToken: { type: 'string', length: 64, unique: true },
    version: { type: 'integer', version: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
