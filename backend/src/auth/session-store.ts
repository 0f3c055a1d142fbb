// Sessions in PostgreSQL (connect-pg-simple), with the rolling expiry written at most every few minutes.
//
// A rolling session is touched on every answer: the cookie gets a fresh Expires (free) and the store an UPDATE of
// the row's expire (a write before every answer, reads included). The row's expire only has to stay ahead of the
// cookie's, so one write per session every TOUCH_EVERY_MS keeps "30 days after the last request" to within those
// few minutes. The touch stays an UPDATE: it never brings back a session that signing out destroyed.
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';

export const TOUCH_EVERY_MS = 5 * 60 * 1000;
/** Past this many remembered sessions, those not written within TOUCH_EVERY_MS are forgotten (they cost one write). */
const REMEMBERED = 10_000;

export function pgSessionStore(pool: pg.Pool, errorLog: (...args: unknown[]) => void) {
  const PgStore = connectPgSimple(session);

  class ThrottledPgStore extends PgStore {
    /** When each session's row was last written by this process. */
    private readonly written = new Map<string, number>();

    private remember(sid: string, now: number): void {
      if (this.written.size >= REMEMBERED) {
        for (const [key, at] of this.written) if (now - at >= TOUCH_EVERY_MS) this.written.delete(key);
      }
      this.written.set(sid, now);
    }

    override set(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
      super.set(sid, sess, (err?: unknown) => {
        if (!err) this.remember(sid, Date.now());
        fn?.(err);
      });
    }

    override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
      const now = Date.now();
      const last = this.written.get(sid);
      if (last !== undefined && now - last < TOUCH_EVERY_MS) {
        fn?.();
        return;
      }
      super.touch(sid, sess, (err?: unknown) => {
        if (!err) this.remember(sid, now);
        fn?.(err);
      });
    }

    override destroy(sid: string, fn?: (err?: unknown) => void): void {
      this.written.delete(sid);
      super.destroy(sid, fn);
    }
  }

  return new ThrottledPgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: 15 * 60,
    errorLog,
  });
}
