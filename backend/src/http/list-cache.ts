// The parts and receipts lists, answered from memory while the build's lists version stays the same.
//
// Reading a list costs several times what the request's identity read costs: its rows on PostgreSQL (which shares
// the machine's cores) and making them into an answer (`npm run bench`, list routes). Every write to a table a list
// is read from marks the build in list_stale, in the writer's own transaction (database triggers, migration
// Migration20261203100000), so a mark is seen exactly when the write is. The identity read that every build route
// makes anyway also reads the build's lists version and whether it is marked (http/request-identity.ts). A marked
// build's version moves on (and its marks are cleared) in one statement before the list is read; an unmarked build's
// list is the one read at its version. So an answer from memory was read after every write committed before the
// request began: a reader never misses a write another request or a job has committed.
import type { Response } from 'express';
import { LRUCache } from 'lru-cache';
import { em, membershipOf } from './build-access';
import { listsStampOf } from './request-identity';

interface Answer {
  body: string;
  /** Express's own ETag of the body, made once, so a browser's revalidation still gets 304. */
  etag: string | undefined;
}

/** Lists of every build and filter, newest used kept, up to this many characters of JSON in all. */
const MAX_CHARACTERS = 16 * 1024 * 1024;

const answers = new LRUCache<string, Answer>({ maxSize: MAX_CHARACTERS, sizeCalculation: (answer) => answer.body.length + 100 });

const counts = { fromMemory: 0, read: 0 };

/** How many list answers came from memory (kept, or being read for another request) and how many were read (tests and the bench). */
export function listCacheCounts(): { fromMemory: number; read: number } {
  return { ...counts };
}

/** Clears the marks of the build and moves its lists version on: the version of what a list read next will see. */
async function moveVersionOn(buildId: string): Promise<string> {
  const [row] = await em().execute<{ version: string }[]>(
    `with cleared as (delete from list_stale where build_id = ?)
     insert into build_list_version (build_id, version) values (?, 1)
     on conflict (build_id) do update set version = build_list_version.version + 1
     returning version`,
    [buildId, buildId],
  );
  return String(row.version);
}

/**
 * The work of this process still under way, shared by the requests that need the same: after a write, every reader
 * of the build finds it marked, and each moving the version on and reading the list again would be many reads of one
 * list. Joining keeps the rule above: a version still being moved on ends after the joiner's identity read, and the
 * list is read after it; a list being read at version V began after V was made, so it sees every write whose marks V
 * cleared, and a write still marked would have sent the joiner to move the version on instead.
 */
const versionsMoving = new Map<string, Promise<string>>();
const listsBeingRead = new Map<string, Promise<Answer>>();

function shared<T>(work: Map<string, Promise<T>>, key: string, start: () => Promise<T>): Promise<T> {
  let promise = work.get(key);
  if (!promise) {
    promise = start().finally(() => work.delete(key));
    work.set(key, promise);
  }
  return promise;
}

/**
 * Answers the build's list (`list` names the route, `filter` its checked filters): from memory when it was read at the
 * build's current lists version, else from `read`, kept for the next caller.
 */
export async function sendList(res: Response, list: string, filter: object, read: () => Promise<object>): Promise<void> {
  const membership = membershipOf(res);
  const buildId = membership.build.id;
  const stamp = listsStampOf(membership);
  const version = !stamp || stamp.stale ? await shared(versionsMoving, buildId, () => moveVersionOn(buildId)) : stamp.version;
  // The lists take the build's currency from the identity read, which may be older than the version a request moved
  // on: the currency is in the key, so a list made with an older one is never answered to a request that read a newer.
  const cacheKey = `${buildId} ${version} ${membership.build.currency} ${list} ${JSON.stringify(filter)}`;
  const kept = answers.get(cacheKey);
  if (kept || listsBeingRead.has(cacheKey)) counts.fromMemory += 1;
  const answer =
    kept ??
    (await shared(listsBeingRead, cacheKey, async () => {
      counts.read += 1;
      const body = JSON.stringify(await read());
      const etagOf = res.app.get('etag fn') as ((body: string, encoding: string) => string) | undefined;
      const made = { body, etag: etagOf?.(body, 'utf8') };
      answers.set(cacheKey, made);
      return made;
    }));
  if (answer.etag) res.set('ETag', answer.etag);
  res.type('json').send(answer.body);
}
