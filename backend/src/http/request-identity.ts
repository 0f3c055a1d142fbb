// Who is asking, read once per request: the signed-in user (passport's deserializeUser) and, on a build's route,
// their membership of that build with the build itself (for buildRole). On a build's route the two come in one
// query, so the build routes pay one round trip to PostgreSQL for them, not two (`npm run bench`, list routes).
// Both are plain queries mapped with em.map: findOne's query building cost about four times the query itself.
import { ReferenceKind, RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Request } from 'express';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';
import { Membership } from '../builds/membership.entity';
import { preparedRows } from '../db/prepared-rows';

type Row = Record<string, any>;

/** `/api/builds/<uuid>` and anything under it: the build a build route's guard will ask about. */
const BUILD_URL = /^\/api\/builds\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})(?:[/?]|$)/i;

/** The membership read with the user, for the build the URL names (null: the user is not a member). */
const readWithUser = new WeakMap<Request, { buildId: string; userId: string; membership: Membership | null }>();

function em(): EntityManager {
  return RequestContext.getEntityManager() as EntityManager;
}

const MEMBERSHIP_COLUMNS = 'm.id as membership_id, m.role as membership_role, m.created_at as membership_created_at, b.*';

function mapMembership(manager: EntityManager, row: Row, userId: string): Membership {
  const { membership_id, membership_role, membership_created_at, ...buildColumns } = row;
  const build = manager.map(Build, buildColumns);
  return manager.map(Membership, { id: membership_id, role: membership_role, created_at: membership_created_at, build_id: build.id, user_id: userId });
}

/**
 * The user's columns (each read as `user_<column>`: they share the row with the build's, and both have an id) and
 * the query, made once per ORM's metadata rather than on every request.
 */
const userQueries = new WeakMap<object, { columns: string[]; sql: string }>();

function userWithMembershipQuery(manager: EntityManager): { columns: string[]; sql: string } {
  const metadata = manager.getMetadata();
  let query = userQueries.get(metadata);
  if (!query) {
    const columns = metadata
      .get(User.name)
      .props.filter((prop) => prop.kind === ReferenceKind.SCALAR && prop.persist !== false)
      .flatMap((prop) => prop.fieldNames);
    const sql = `select ${columns.map((column) => `u.${column} as user_${column}`).join(', ')}, ${MEMBERSHIP_COLUMNS}
       from app_user u
       left join (membership m join build b on b.id = m.build_id) on m.user_id = u.id and m.build_id = ?
      where u.id = ?`;
    query = { columns, sql };
    userQueries.set(metadata, query);
  }
  return query;
}

async function userWithMembership(manager: EntityManager, userId: string, buildId: string): Promise<{ user: User | null; membership: Membership | null }> {
  const { columns, sql } = userWithMembershipQuery(manager);
  const [row] = await preparedRows<Row>(manager, sql, [buildId, userId]);
  if (!row) return { user: null, membership: null };
  const userRow: Row = {};
  for (const column of columns) {
    userRow[column] = row[`user_${column}`];
    delete row[`user_${column}`];
  }
  const user = manager.map(User, userRow);
  return { user, membership: row.membership_id === null ? null : mapMembership(manager, row, userId) };
}

/** The signed-in user of the session (null when the account is gone); on a build's URL, with the membership. */
export async function signedInUser(req: Request, userId: string): Promise<User | null> {
  const manager = em();
  const buildId = BUILD_URL.exec(req.originalUrl)?.[1];
  if (buildId) {
    const { user, membership } = await userWithMembership(manager, userId, buildId);
    readWithUser.set(req, { buildId, userId, membership });
    return user;
  }
  const [row] = await manager.execute('select * from app_user where id = ?', [userId]);
  return row ? manager.map(User, row) : null;
}

/** The caller's membership of the build with that build: the one read with the user, else one query. */
export async function callerMembership(req: Request, buildId: string, userId: string): Promise<Membership | null> {
  const read = readWithUser.get(req);
  if (read && read.buildId.toLowerCase() === buildId.toLowerCase() && read.userId === userId) return read.membership;
  const manager = em();
  const [row] = await preparedRows<Row>(
    manager,
    `select ${MEMBERSHIP_COLUMNS}
       from membership m join build b on b.id = m.build_id
      where m.build_id = ? and m.user_id = ?`,
    [buildId, userId],
  );
  return row ? mapMembership(manager, row, userId) : null;
}
