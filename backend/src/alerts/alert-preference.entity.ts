// A member's own choice of mail alerts on one build; no row means the defaults of their role.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Membership } from '../builds/membership.entity';

export class AlertPreference {
  [OptionalProps]?: 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  /** Tied to the membership, so leaving a build (or being removed) drops the choice with it. */
  membership!: Membership;
  budget!: boolean;
  coreDue!: boolean;
  returnWindow!: boolean;
  warrantyEnding!: boolean;
  duplicate!: boolean;
  reviewDigest!: boolean;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const AlertPreferenceSchema = new EntitySchema<AlertPreference>({
  class: AlertPreference,
  properties: {
    id: { type: 'uuid', primary: true },
    membership: { kind: '1:1', entity: () => Membership, owner: true, unique: true, deleteRule: 'cascade' },
    budget: { type: 'boolean' },
    coreDue: { type: 'boolean' },
    returnWindow: { type: 'boolean' },
    warrantyEnding: { type: 'boolean' },
    duplicate: { type: 'boolean' },
    reviewDigest: { type: 'boolean' },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
