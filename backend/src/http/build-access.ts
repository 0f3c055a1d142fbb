// The one guard every build route uses: it loads the caller's membership of the build in the URL and checks
// the role. Someone who is not a member learns nothing: not even that the build exists (404, not 403).
import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { RequestHandler, Response } from 'express';
import type { BuildRole } from '../../../shared/enums';
import { Build } from '../builds/build.entity';
import { Membership } from '../builds/membership.entity';
import { Conflict, Forbidden, NotFound, Unauthenticated } from './errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

export function em(): EntityManager {
  return RequestContext.getEntityManager() as EntityManager;
}

/** Requires a signed-in user. */
export const signedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : new Unauthenticated());
};

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Requires a membership of :buildId with one of the roles; puts it in res.locals.membership. An archived build is read-only. */
export function buildRole(...roles: BuildRole[]): RequestHandler {
  return buildAccess(roles, { archivedWritable: false });
}

/** For the few writes that an archived build takes: restoring it (and archiving it again, which changes nothing). */
export function buildRoleEvenArchived(...roles: BuildRole[]): RequestHandler {
  return buildAccess(roles, { archivedWritable: true });
}

/**
 * The caller's membership with its build, in one plain query mapped to both entities (managed, as findOne would
 * make them). Every build route runs this: findOne with a populate spent about five times the query's own time
 * building it (`npm run bench`, list routes).
 */
async function membershipWithBuild(buildId: string, userId: string): Promise<Membership | null> {
  const manager = em();
  const [row] = await manager.execute(
    `select m.id as membership_id, m.role as membership_role, m.created_at as membership_created_at, b.*
       from membership m join build b on b.id = m.build_id
      where m.build_id = ? and m.user_id = ?`,
    [buildId, userId],
  );
  if (!row) return null;
  const { membership_id, membership_role, membership_created_at, ...buildColumns } = row;
  const build = manager.map(Build, buildColumns);
  return manager.map(Membership, { id: membership_id, role: membership_role, created_at: membership_created_at, build_id: build.id, user_id: userId });
}

function buildAccess(roles: BuildRole[], options: { archivedWritable: boolean }): RequestHandler {
  return async (req, res, next) => {
    if (!req.user) throw new Unauthenticated();
    const buildId = req.params.buildId;
    if (!isUuid(buildId)) throw new NotFound('That build');
    const membership = await membershipWithBuild(buildId, req.user.id);
    if (!membership) throw new NotFound('That build');
    if (!roles.includes(membership.role)) throw new Forbidden();
    if (membership.build.archivedAt && !options.archivedWritable && !READS.has(req.method)) {
      throw new Conflict('This build is archived, so it is read-only. Its owner can restore it from the archived builds to change it again.');
    }
    res.locals.membership = membership;
    next();
  };
}

export const ANY_MEMBER: BuildRole[] = ['owner', 'crew', 'reviewer'];

export function membershipOf(res: Response): Membership {
  return res.locals.membership as Membership;
}
