// The list routes under load: 20 signed-in clients on loopback ask, each in turn, for /api/health, the demo
// build's parts list and its receipts list, and the rates and latencies of the lists are set beside health's.
// Runs the app in this process against its own throw-away database, seeded with the demo build.
import { runSection } from './print-figures';
import http from 'node:http';
import { BenchClient } from './bench-client';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../backend/src/seed/demo-scenario';
import { percentile } from './percentile';
import { withDemoApp } from './seeded-demo';
import { listCacheCounts } from '../../backend/src/http/list-cache';

const LOAD_DB = 'tallyhood_bench_load';
const CLIENTS = 20;
/**
 * The routes take turns, ROUNDS times, each for this long or until this many answers have come: other work on the
 * machine then weighs on every route alike, and the ratios to health stay fair.
 */
const ROUNDS = 8;
const SECONDS_PER_TURN = 1;
const MAX_REQUESTS_PER_TURN = 1000;
const WARM_UP_REQUESTS = 100;

/** All clients ask for `url` back to back until the time or the count runs out; every answer must be 200. */
async function load(clients: BenchClient[], url: string, seconds: number, maxRequests: number, latencies: number[] = []) {
  let issued = 0;
  const deadline = performance.now() + seconds * 1000;
  const started = performance.now();
  await Promise.all(
    clients.map(async (client) => {
      while (issued < maxRequests && performance.now() < deadline) {
        issued += 1;
        const sent = performance.now();
        const res = await client.request('GET', url);
        if (res.status !== 200) throw new Error(`${url} answered ${res.status}: ${res.text.slice(0, 200)}`);
        latencies.push(performance.now() - sent);
      }
    }),
  );
  return (performance.now() - started) / 1000;
}

const EDITING_SECONDS = 4;

/**
 * The parts list while one client edits a part back to back (a builder at work while the others look): every edit
 * moves the list's version on, so the readers get fresh reads between the answers from memory.
 */
async function whileEditing(clients: BenchClient[], buildId: string, healthRate: number): Promise<Record<string, string | number>> {
  const [editor, ...readers] = clients;
  const partsUrl = `/api/builds/${buildId}/parts`;
  let part = JSON.parse((await editor.request('GET', partsUrl)).text).parts[0] as { id: string; version: number };
  let edits = 0;
  const kept = listCacheCounts();
  const deadline = performance.now() + EDITING_SECONDS * 1000;
  const editing = (async () => {
    while (performance.now() < deadline) {
      const res = await editor.request('PATCH', `${partsUrl}/${part.id}`, { notes: `Checked ${edits + 1} times`, version: part.version });
      if (res.status !== 200) throw new Error(`the edit answered ${res.status}: ${res.text.slice(0, 200)}`);
      part = JSON.parse(res.text);
      edits += 1;
    }
  })();
  const latencies: number[] = [];
  const [seconds] = await Promise.all([load(readers, partsUrl, EDITING_SECONDS, Number.MAX_SAFE_INTEGER, latencies), editing]);
  const keptAfter = listCacheCounts();
  return {
    'editing: part edits/s': (edits / seconds).toFixed(0),
    'editing: parts list req/s (19 clients)': (latencies.length / seconds).toFixed(0),
    'editing: parts list p95 ms': percentile(latencies, 95).toFixed(1),
    'editing: answered from memory, read': `${keptAfter.fromMemory - kept.fromMemory}, ${keptAfter.read - kept.read}`,
    'editing: parts list rate / health': (latencies.length / seconds / healthRate).toFixed(2),
  };
}

export async function benchListLoad(): Promise<Record<string, string | number>> {
  return withDemoApp(LOAD_DB, async ({ port, build }) => {
    const agent = new http.Agent({ keepAlive: true, maxSockets: CLIENTS });
    try {
      const owner = DEMO_PEOPLE.find((person) => person.role === 'owner')!;
      const clients = Array.from({ length: CLIENTS }, () => new BenchClient(port, agent));
      for (const client of clients) {
        await client.request('GET', '/api/auth/me');
        const res = await client.request('POST', '/api/auth/sign-in', { email: owner.email, password: DEMO_PASSWORD });
        if (res.status !== 200) throw new Error(`sign-in answered ${res.status}: ${res.text}`);
      }
      const routes: [string, string][] = [
        ['health', '/api/health'],
        ['parts list', `/api/builds/${build.id}/parts`],
        ['receipts list', `/api/builds/${build.id}/receipts`],
      ];
      const figures: Record<string, string | number> = {};
      const parts = JSON.parse((await clients[0].request('GET', routes[1][1])).text).parts.length;
      const receipts = JSON.parse((await clients[0].request('GET', routes[2][1])).text).receipts.length;
      figures['load: clients'] = CLIENTS;
      figures['load: demo parts, receipts'] = `${parts}, ${receipts}`;
      for (const [, url] of routes) await load(clients, url, SECONDS_PER_TURN, WARM_UP_REQUESTS);
      const measured = routes.map(() => ({ latencies: [] as number[], seconds: 0, cpuMicroseconds: 0 }));
      const kept = listCacheCounts();
      for (let round = 0; round < ROUNDS; round += 1) {
        for (const [index, [, url]] of routes.entries()) {
          const cpu = process.cpuUsage();
          measured[index].seconds += await load(clients, url, SECONDS_PER_TURN, MAX_REQUESTS_PER_TURN, measured[index].latencies);
          const used = process.cpuUsage(cpu);
          measured[index].cpuMicroseconds += used.user + used.system;
        }
      }
      // Nothing writes to the demo build during the run: after the warm-up every list is answered from memory.
      const keptAfter = listCacheCounts();
      figures['load lists: answered from memory, read'] = `${keptAfter.fromMemory - kept.fromMemory}, ${keptAfter.read - kept.read}`;
      const healthRate = measured[0].latencies.length / measured[0].seconds;
      for (const [index, [name]] of routes.entries()) {
        const { latencies, seconds, cpuMicroseconds } = measured[index];
        const rate = latencies.length / seconds;
        figures[`load ${name}: requests`] = latencies.length;
        figures[`load ${name}: req/s`] = rate.toFixed(0);
        figures[`load ${name}: p50 ms`] = percentile(latencies, 50).toFixed(1);
        figures[`load ${name}: p95 ms${index > 0 ? " (goal ≤ 150)" : ""}`] = percentile(latencies, 95).toFixed(1);
        // This process's CPU (the app and the clients) per answer: other work on the machine moves it much less than the rate.
        figures[`load ${name}: process CPU ms / request`] = (cpuMicroseconds / 1000 / latencies.length).toFixed(2);
        if (index > 0) figures[`load ${name}: rate / health (goal ≥ 0.70)`] = (rate / healthRate).toFixed(2);
      }
      Object.assign(figures, await whileEditing(clients, build.id, healthRate));
      return figures;
    } finally {
      agent.destroy();
    }
  });
}

if (require.main === module) runSection(benchListLoad);
