// One alert mailed to one person: the unique key (user, kind, event key) is what stops a mail going out twice.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { ALERT_KINDS, type AlertKind } from '../../../shared/api/alerts';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';

export class AlertSent {
  [OptionalProps]?: 'sentAt';
  id: string = randomUUID();
  user!: User;
  build!: Build;
  kind!: AlertKind;
  /** Stable per event: budget:<systemId>:90, core-due:<coreId>, return-window:<lineId>, warranty-ends:<partId>:<end day>, duplicate:<receiptId>, digest:<buildId>:<day>. */
  eventKey!: string;
  sentAt: Date = new Date();
}

export const AlertSentSchema = new EntitySchema<AlertSent>({
  class: AlertSent,
  uniques: [{ name: 'alert_sent_user_kind_event_key_unique', properties: ['user', 'kind', 'eventKey'] }],
  indexes: [{ properties: ['build', 'kind'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    user: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    kind: { enum: true, items: () => [...ALERT_KINDS] },
    eventKey: { type: 'text' },
    sentAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
