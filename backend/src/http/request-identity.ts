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

/**
 * The scalar columns of an entity's table, read once per ORM's metadata. Each row here is read into a fresh object
 * per entity (`user_<column>`, `build_<column>`: the tables share the row and both have an id): deleting keys from
 * the row or taking the rest of it cost more than the ORM's own mapping (`npm run bench`, list routes).
 */
function scalarColumns(manager: EntityManager, entityName: string): string[] {
  return manager
    .getMetadata()
    .get(entityName)
    .props.filter((prop) => prop.kind === ReferenceKind.SCALAR && prop.persist !== false)
    .flatMap((prop) => prop.fieldNames);
}

interface IdentityQueries {
  userColumns: string[];
  buildColumns: string[];
  /** The user alone. */
  user: string;
  /** The user with their membership of one build and the build ($1 the build, $2 the user). */
  userWithMembership: string;
  /** The membership of one build with the build ($1 the build, $2 the user). */
  membership: string;
}

const queriesByMetadata = new WeakMap<object, IdentityQueries>();

function identityQueries(manager: EntityManager): IdentityQueries {
  const metadata = manager.getMetadata();
  let queries = queriesByMetadata.get(metadata);
  if (!queries) {
    const userColumns = scalarColumns(manager, User.name);
    const buildColumns = scalarColumns(manager, Build.name);
    const membershipColumns = `m.id as membership_id, m.role as membership_role, m.created_at as membership_created_at,
            coalesce(lv.version, 0) as lists_version, exists (select 1 from list_stale s where s.build_id = m.build_id) as lists_stale,
            ${buildColumns.map((column) => `b.${column} as build_${column}`).join(', ')}`;
    queries = {
      userColumns,
      buildColumns,
      user: `select ${userColumns.join(', ')} from app_user where id = ?`,
      userWithMembership: `select ${userColumns.map((column) => `u.${column} as user_${column}`).join(', ')}, ${membershipColumns}
         from app_user u
         left join (membership m join build b on b.id = m.build_id) on m.user_id = u.id and m.build_id = ?
         left join build_list_version lv on lv.build_id = m.build_id
        where u.id = ?`,
      membership: `select ${membershipColumns}
         from membership m join build b on b.id = m.build_id
         left join build_list_version lv on lv.build_id = m.build_id
        where m.build_id = ? and m.user_id = ?`,
    };
    queriesByMetadata.set(metadata, queries);
  }
  return queries;
}

/** The columns of `row` named `<prefix><column>`, as a row of the entity's own table. */
function columnsOf(row: Row, prefix: string, columns: string[]): Row {
  const own: Row = {};
  for (const column of columns) own[column] = row[prefix + column];
  return own;
}

/** Where the build's lists stand, read with the membership (http/list-cache.ts). */
export interface ListsStamp {
  /** The build's lists version (a bigint, as text). */
  version: string;
  /** Writes since the version last moved on are marked: the version must move on before a list is answered from memory. */
  stale: boolean;
}

const listsStamps = new WeakMap<Membership, ListsStamp>();

/** The lists stamp read with the caller's membership of the build. */
export function listsStampOf(membership: Membership): ListsStamp | undefined {
  return listsStamps.get(membership);
}

function mapMembership(manager: EntityManager, queries: IdentityQueries, row: Row, userId: string): Membership {
  const build = manager.map(Build, columnsOf(row, 'build_', queries.buildColumns));
  const membership = manager.map(Membership, { id: row.membership_id, role: row.membership_role, created_at: row.membership_created_at, build_id: build.id, user_id: userId });
  listsStamps.set(membership, { version: String(row.lists_version), stale: row.lists_stale });
  return membership;
}

async function userWithMembership(manager: EntityManager, userId: string, buildId: string): Promise<{ user: User | null; membership: Membership | null }> {
  const queries = identityQueries(manager);
  const [row] = await preparedRows<Row>(manager, queries.userWithMembership, [buildId, userId]);
  if (!row) return { user: null, membership: null };
  const user = manager.map(User, columnsOf(row, 'user_', queries.userColumns));
  return { user, membership: row.membership_id === null ? null : mapMembership(manager, queries, row, userId) };
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
  const [row] = await preparedRows<Row>(manager, identityQueries(manager).user, [userId]);
  return row ? manager.map(User, row) : null;
}

/** The caller's membership of the build with that build: the one read with the user, else one query. */
export async function callerMembership(req: Request, buildId: string, userId: string): Promise<Membership | null> {
  const read = readWithUser.get(req);
  if (read && read.buildId.toLowerCase() === buildId.toLowerCase() && read.userId === userId) return read.membership;
  const manager = em();
  const queries = identityQueries(manager);
  const [row] = await preparedRows<Row>(manager, queries.membership, [buildId, userId]);
  return row ? mapMembership(manager, queries, row, userId) : null;
}
