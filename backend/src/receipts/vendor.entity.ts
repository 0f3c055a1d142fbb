// A shop or seller, per build, matched by a normalised name so "Quayside Parts" and "QUAYSIDE PARTS." are one.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Build } from '../builds/build.entity';

export class Vendor {
  [OptionalProps]?: 'createdAt';
  id: string = randomUUID();
  build!: Build;
  name!: string;
  normalizedName!: string;
  createdAt: Date = new Date();
}

export function normalizeVendorName(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

export const VendorSchema = new EntitySchema<Vendor>({
  class: Vendor,
  uniques: [{ properties: ['build', 'normalizedName'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    name: { type: 'string', length: 120 },
    normalizedName: { type: 'string', length: 120 },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
