// An inbox token a build used before it was rotated: mail to it is refused, but shown to the build's owner.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { Build } from '../builds/build.entity';

export class RetiredInboxToken {
  [OptionalProps]?: 'retiredAt';
  token!: string;
  build!: Build;
  retiredAt: Date = new Date();
}

export const RetiredInboxTokenSchema = new EntitySchema<RetiredInboxToken>({
  class: RetiredInboxToken,
  properties: {
    token: { type: 'string', length: 64, primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    retiredAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
