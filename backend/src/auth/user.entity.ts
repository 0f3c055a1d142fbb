// A person who signs in; e-mail is stored lower-cased so it is unique regardless of case.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';

export class User {
  [OptionalProps]?: 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  email!: string;
  displayName!: string;
  passwordHash!: string;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const UserSchema = new EntitySchema<User>({
  class: User,
  tableName: 'app_user',
  properties: {
    id: { type: 'uuid', primary: true },
    email: { type: 'string', length: 254, unique: true },
    displayName: { type: 'string', length: 80 },
    passwordHash: { type: 'text', hidden: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
