// One database transaction per writing request: everything the request changes (rows, audit events, parts made on
// the way) commits together before the answer leaves, or not at all. A refused request (any 4xx or 5xx answer)
// rolls back, so it changes nothing saved, however far the handler got before it refused.
//
// Flush mode: AUTO, deliberately. Inside the request's own transaction an automatic flush before a query writes
// only to that transaction, which the refusal rolls back; and the request's later queries (the ledger, the
// receipt's reconciliation) must see its own pending changes. Reading requests get a plain context, no transaction.
import { RequestContext } from '@mikro-orm/core';
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import type { RequestHandler, Response } from 'express';
import { refreshMarkedLedgerTotals } from '../ledger/ledger-totals';

const READING_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Work that must wait until the request's changes are committed (queue a job, send a mail). */
type AfterCommit = () => Promise<void> | void;
const pendingAfterCommit = new WeakMap<EntityManager, AfterCommit[]>();

/**
 * Runs `work` once the request's transaction has committed; at once when there is no request transaction (a job,
 * the seed). A rolled-back request never runs it: no mail about, and no reading of, something that was not saved.
 */
export async function afterCommit(em: EntityManager, work: AfterCommit): Promise<void> {
  const queue = pendingAfterCommit.get(em);
  if (queue) queue.push(work);
  else await work();
}

function runAfterCommit(work: AfterCommit[]): void {
  for (const item of work) {
    Promise.resolve()
      .then(item)
      .catch((error: unknown) => console.error('[after commit]', error instanceof Error ? error.message : error));
  }
}

export function requestTransaction(orm: MikroORM): RequestHandler {
  return (req, res, next) => {
    if (READING_METHODS.has(req.method)) {
      RequestContext.create(orm.em, next);
      return;
    }
    // The transaction is begun on the request context's own fork: the one every service reaches through em().
    RequestContext.create(orm.em, () => {
      const em = RequestContext.getEntityManager() as EntityManager;
      const waiting: AfterCommit[] = [];
      pendingAfterCommit.set(em, waiting);
      holdAnswerUntilSettled(res, em, waiting);
      em.begin().then(() => next(), next);
    });
  };
}

/**
 * The answer is written by `res.end` (json, send, redirect and status().end() all end there); it waits for the
 * commit, or the rollback of a refusal. A commit that fails turns the answer into a 500 when nothing was sent yet.
 */
function holdAnswerUntilSettled(res: Response, em: EntityManager, waiting: AfterCommit[]): void {
  const end = res.end.bind(res) as (...args: unknown[]) => Response;
  let settled = false;
  let abandoned = false;
  // A client that goes away before its answer is written gets its changes rolled back (it will send again),
  // once the handler is done with the transaction.
  res.on('close', () => {
    abandoned = !settled;
  });
  res.end = ((...args: unknown[]) => {
    if (settled) return end(...args);
    settled = true;
    const refused = res.statusCode >= 400 || abandoned;
    // The ledger's running totals are brought up to date last, in the same transaction, after every change is flushed.
    const settle = refused ? em.rollback() : em.flush().then(() => refreshMarkedLedgerTotals(em)).then(() => em.commit());
    settle.then(
      () => {
        end(...args);
        if (!refused) runAfterCommit(waiting);
      },
      (error: unknown) => {
        console.error('[transaction]', error instanceof Error ? error.message : error);
        em.rollback().catch(() => undefined);
        if (res.headersSent) {
          end();
          return;
        }
        res.statusCode = 500;
        res.setHeader('Content-Type', 'application/json; charset=utf-8');
        end(JSON.stringify({ error: { code: 'internal', message: 'The change could not be saved. Nothing was changed; try again.' } }));
      },
    );
    return res;
  }) as Response['end'];
}
