// Every saved row that belongs to a build, in a stable order: two dumps are equal only when nothing of the build
// (nor the accounts and invites around it) changed, down to versions and timestamps.
import type { MikroORM } from '@mikro-orm/postgresql';

const BUILD_TABLES = ['vehicle_system', 'part', 'vendor', 'receipt', 'receipt_line', 'core', 'audit_event', 'comment', 'not_duplicate', 'invite', 'membership', 'alert_sent', 'ledger_system_total', 'ledger_part_total', 'ledger_stale'];
// Not list_stale nor build_list_version: the lists' bookkeeping (http/list-cache.ts), which a read of a list moves on.
// A refused write leaves no mark there either, as its transaction is rolled back (test/api/list-cache.test.ts).

export async function dumpBuild(orm: MikroORM, buildId: string): Promise<string> {
  const connection = orm.em.fork().getConnection();
  const dump: Record<string, unknown> = {};
  [dump.build] = await connection.execute(`select row_to_json(b)::text as row from build b where id = ?`, [buildId]);
  for (const table of BUILD_TABLES) {
    dump[table] = await connection.execute(`select row_to_json(t)::text as row from "${table}" t where build_id = ? order by 1`, [buildId]);
  }
  dump.app_user = await connection.execute(
    `select row_to_json(u)::text as row from app_user u where id in (select user_id from membership where build_id = ?) order by id`,
    [buildId],
  );
  dump.alert_preference = await connection.execute(
    `select row_to_json(a)::text as row from alert_preference a where membership_id in (select id from membership where build_id = ?) order by id`,
    [buildId],
  );
  return JSON.stringify(dump);
}
