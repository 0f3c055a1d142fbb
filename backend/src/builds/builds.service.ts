// Builds: create (the creator becomes the owner), list the caller's, edit with a version check, archive.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { BuildDto, UpdateBuildRequest } from '../../../shared/api/builds';
import type { BuildRole } from '../../../shared/enums';
import type { User } from '../auth/user.entity';
import { StaleVersion, ValidationFailed } from '../http/errors';
import { Build } from './build.entity';
import { Membership } from './membership.entity';
import { addDefaultSystems } from '../systems/systems.service';

export interface NewBuild {
  name: string;
  vehicle: string;
  currency: string;
  locale: string;
  status: Build['status'];
  startedOn?: string | null;
  targetDate?: string | null;
}

export function buildDto(build: Build, role: BuildRole): BuildDto {
  return {
    id: build.id,
    name: build.name,
    vehicle: build.vehicle,
    currency: build.currency,
    locale: build.locale,
    status: build.status,
    startedOn: build.startedOn ?? null,
    targetDate: build.targetDate ?? null,
    returnWindowDays: build.returnWindowDays,
    archived: build.archivedAt !== null,
    version: build.version,
    role,
    createdAt: build.createdAt.toISOString(),
  };
}

export async function createBuild(em: EntityManager, owner: User, input: NewBuild): Promise<Build> {
  const build = em.create(Build, {
    name: input.name,
    vehicle: input.vehicle,
    currency: input.currency,
    locale: input.locale,
    status: input.status,
    startedOn: input.startedOn ?? null,
    targetDate: input.targetDate ?? null,
  });
  em.create(Membership, { build, user: owner, role: 'owner' });
  addDefaultSystems(em, build);
  await em.flush();
  return build;
}

export async function listBuilds(em: EntityManager, user: User, archived: boolean): Promise<BuildDto[]> {
  const memberships = await em.find(
    Membership,
    { user: user.id, build: { archivedAt: archived ? { $ne: null } : null } },
    { populate: ['build'], orderBy: { build: { updatedAt: 'desc' } } },
  );
  return memberships.map((m) => buildDto(m.build, m.role));
}

export async function updateBuild(em: EntityManager, build: Build, input: UpdateBuildRequest): Promise<Build> {
  if (input.version !== build.version) throw new StaleVersion('This build');
  const { version: _version, ...changes } = input;
  const next = { ...changes };
  for (const key of Object.keys(next) as (keyof typeof next)[]) if (next[key] === undefined) delete next[key];
  const startedOn = next.startedOn === undefined ? build.startedOn : next.startedOn;
  const targetDate = next.targetDate === undefined ? build.targetDate : next.targetDate;
  if (startedOn && targetDate && targetDate < startedOn) {
    throw new ValidationFailed({ targetDate: 'The target date is before the start date.' });
  }
  em.assign(build, next);
  await em.flush();
  return build;
}

export async function setArchived(em: EntityManager, build: Build, archived: boolean): Promise<Build> {
  build.archivedAt = archived ? build.archivedAt ?? new Date() : null;
  await em.flush();
  return build;
}
