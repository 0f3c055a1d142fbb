// Ledger and export figures on large builds seeded here: the ledger's p50/p95 beside the bare SQL aggregate, what a
// write pays to bring the running totals up to date, the tax-ledger export's rows per second and peak memory, and a
// seeded random walk of changes through the API after which the running totals must equal a fresh aggregate.
// Runs against throw-away databases of its own.
import { runSection } from './print-figures';
import { MikroORM } from '@mikro-orm/postgresql';
import http from 'node:http';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { User } from '../../backend/src/auth/user.entity';
import { Build } from '../../backend/src/builds/build.entity';
import { createBuild } from '../../backend/src/builds/builds.service';
import { loadConfig } from '../../backend/src/config';
import { ormConfig } from '../../backend/src/db/mikro-orm.config';
import { taxLedgerCsv } from '../../backend/src/exports/tax-ledger';
import { buildLedger } from '../../backend/src/ledger/ledger.service';
import { refreshLedgerTotals, totalsBesideFreshAggregate } from '../../backend/src/ledger/ledger-totals';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../backend/src/seed/demo-scenario';
import { walkLedger } from '../support/ledger-walk';
import { BenchClient } from './bench-client';
import { recreateDatabase } from './bench-db';
import { percentile } from './percentile';
import { withDemoApp } from './seeded-demo';

const BENCH_DB = 'tallyhood_bench';
const WALK_DB = 'tallyhood_bench_walk';
const WALK_STEPS = 200;
const WALK_SEED = 20261203;

/** Receipts of 10 lines each, spread over the build's systems, filed, with cents that vary. */
async function seedLines(orm: MikroORM, build: Build, userId: string, lineCount: number, options: { analyse: boolean } = { analyse: true }) {
  const connection = orm.em.getConnection();
  const receipts = lineCount / 10;
  await connection.execute(
    `insert into receipt (id, build_id, original_filename, document_key, content_type, sha256, size, state, uploaded_by_id, purchase_date, total)
     select gen_random_uuid(), ?, 'r.png', 'none', 'image/png', md5(g::text) || md5(g::text), 1, 'filed', ?, date '2026-01-01' + (g % 300), 0
       from generate_series(1, ?) g`,
    [build.id, userId, receipts],
  );
  await connection.execute(
    `insert into receipt_line (id, build_id, receipt_id, position, kind, description, amount, allocated_tax, allocated_shipping, system_id)
     select gen_random_uuid(), r.build_id, r.id, n, case when n = 9 then 'core_charge' else 'part' end, 'Bench part ' || n,
            ((abs(hashtext(r.id::text || n)) % 50000) + 1) / 100.0, 0.07 * n, 0.01 * n,
            (select id from vehicle_system s where s.build_id = r.build_id order by s.sort_order offset (n % 12) limit 1)
       from receipt r cross join generate_series(0, 9) n where r.build_id = ?`,
    [build.id],
  );
  if (options.analyse) await connection.execute('analyze');
}

/**
 * The lines were written by SQL, outside a request: the triggers marked the build, and its running totals are brought up
 * to date with the function a writing request runs before it commits. Answers the milliseconds that took: what one
 * write pays at this size.
 */
async function refreshTotals(orm: MikroORM, build: Build): Promise<number> {
  const started = performance.now();
  await orm.em.fork().transactional((tx) => refreshLedgerTotals(tx, build.id));
  return performance.now() - started;
}

/** A seeded random walk of changes through the API on the demo build; the running totals must equal a fresh aggregate. */
async function walkDemoBuild(): Promise<Record<string, string | number>> {
  return withDemoApp(WALK_DB, async ({ port, build, orm }) => {
    const agent = new http.Agent({ keepAlive: true });
    try {
      const client = new BenchClient(port, agent);
      const owner = DEMO_PEOPLE.find((person) => person.role === 'owner')!;
      await client.request('GET', '/api/auth/me');
      const signIn = await client.request('POST', '/api/auth/sign-in', { email: owner.email, password: DEMO_PASSWORD });
      if (signIn.status !== 200) throw new Error(`sign-in answered ${signIn.status}: ${signIn.text}`);
      const walk = await walkLedger(
        async (method, url, body) => {
          const res = await client.request(method.toUpperCase() as 'GET', url, body);
          return { status: res.status, body: res.text ? JSON.parse(res.text) : undefined };
        },
        build.id,
        { steps: WALK_STEPS, seed: WALK_SEED },
      );
      const { stored, fresh } = await totalsBesideFreshAggregate(orm.em.fork(), build.id);
      const equal = stored.length > 0 && JSON.stringify(stored) === JSON.stringify(fresh);
      if (!equal) {
        console.error('stored totals:', stored, '\nfresh aggregate:', fresh);
        throw new Error(`running totals differ from a fresh aggregate after ${WALK_STEPS} steps of the random walk`);
      }
      return {
        'running totals equal fresh aggregate': `yes (${WALK_STEPS} steps)`,
        'random walk: changes made, by kind': Object.entries(walk.applied).map(([action, count]) => `${action} ${count}`).join(', '),
        'random walk: refused, by kind and status': Object.entries(walk.refused).map(([what, count]) => `${what}: ${count}`).join(', ') || 'none',
      };
    } finally {
      agent.destroy();
    }
  });
}

async function time(fn: () => Promise<unknown>, runs: number): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const started = performance.now();
    await fn();
    times.push(performance.now() - started);
  }
  return times;
}

export async function benchLedger(): Promise<Record<string, string | number>> {
  const base = loadConfig();
  await recreateDatabase(base.db, BENCH_DB);
  const db = { ...base.db, dbName: BENCH_DB };
  const orm = await MikroORM.init(ormConfig(db));
  await orm.getMigrator().up();
  const figures: Record<string, string | number> = {};
  try {
    const em = orm.em.fork();
    const user = em.create(User, { email: 'bench@example.test', displayName: 'Bench', passwordHash: 'x' });
    await em.flush();
    for (const lines of [2_000, 20_000, 200_000]) {
      const build = await createBuild(em, user, { name: `Bench ${lines}`, vehicle: '', currency: 'USD', locale: 'en-US', status: 'active' });
      const seeded = performance.now();
      await seedLines(orm, build, user.id, lines);
      figures[`ledger ${lines} lines: seed s`] = ((performance.now() - seeded) / 1000).toFixed(1);
      figures[`ledger ${lines} lines: totals recompute ms`] = (await refreshTotals(orm, build)).toFixed(1);
      const bareSql = `select system_id, sum(amount + allocated_tax + allocated_shipping - allocated_discount) from receipt_line where build_id = ? group by system_id`;
      const bare = await time(() => orm.em.getConnection().execute(bareSql, [build.id]), 20);
      const ledger = await time(() => buildLedger(orm.em.fork(), build), 20);
      figures[`ledger ${lines} lines: p50 ms`] = percentile(ledger, 50).toFixed(1);
      figures[`ledger ${lines} lines: p95 ms`] = percentile(ledger, 95).toFixed(1);
      figures[`ledger ${lines} lines: bare SQL p50 ms`] = percentile(bare, 50).toFixed(1);
      figures[`ledger ${lines} lines: ratio ledger/bare (p50)`] = (percentile(ledger, 50) / percentile(bare, 50)).toFixed(2);
    }
    // One receipt of 8,000 lines, just written and not yet analysed (a large import before autovacuum has looked):
    // per-line subqueries show here first.
    const single = await createBuild(em, user, { name: 'Bench one receipt', vehicle: '', currency: 'USD', locale: 'en-US', status: 'active' });
    await seedLines(orm, single, user.id, 10, { analyse: false });
    await orm.em.getConnection().execute(
      `insert into receipt_line (id, build_id, receipt_id, position, kind, description, amount, system_id)
       select gen_random_uuid(), build_id, receipt_id, position + n * 10, kind, description, amount, system_id
         from receipt_line, generate_series(1, 800) as n where build_id = ?`,
      [single.id],
    );
    figures['ledger 1 receipt 8010 lines: totals recompute ms'] = (await refreshTotals(orm, single)).toFixed(1);
    const one = await time(() => buildLedger(orm.em.fork(), single), 5);
    figures['ledger 1 receipt 8010 lines: p50 ms'] = percentile(one, 50).toFixed(1);
    // The export of 100,000 lines: the first 10,000 receipts of the large build.
    const big = await orm.em.fork().findOneOrFail(Build, { name: 'Bench 200000' });
    let rows = 0;
    let peak = process.memoryUsage().rss;
    const baseline = peak;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 20);
    const started = performance.now();
    await pipeline(
      taxLedgerCsv(orm.em.fork(), big, { to: '2026-05-30' }),
      new Writable({
        write(chunk: Buffer, _encoding, done) {
          for (const byte of chunk) if (byte === 10) rows += 1;
          done();
        },
      }),
    );
    clearInterval(sampler);
    const seconds = (performance.now() - started) / 1000;
    figures['export tax ledger: rows'] = rows - 1;
    figures['export tax ledger: rows per second'] = Math.round((rows - 1) / seconds);
    figures['export tax ledger: peak RSS MB'] = (peak / 1024 / 1024).toFixed(0);
    figures['export tax ledger: RSS growth MB'] = ((peak - baseline) / 1024 / 1024).toFixed(0);
  } finally {
    await orm.close(true);
  }
  return { ...figures, ...(await walkDemoBuild()) };
}

if (require.main === module) runSection(benchLedger);
