// The one guard every build route uses: it loads the caller's membership of the build in the URL and checks
// the role. Someone who is not a member learns nothing: not even that the build exists (404, not 403).
import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { RequestHandler, Response } from 'express';
import type { BuildRole } from '../../../shared/enums';
import { Membership } from '../builds/membership.entity';
import { Conflict, Forbidden, NotFound, Unauthenticated } from './errors';
import { callerMembership } from './request-identity';

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

function buildAccess(roles: BuildRole[], options: { archivedWritable: boolean }): RequestHandler {
  return async (req, res, next) => {
    if (!req.user) throw new Unauthenticated();
    const buildId = req.params.buildId;
    if (!isUuid(buildId)) throw new NotFound('That build');
    const membership = await callerMembership(req, buildId, req.user.id);
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
