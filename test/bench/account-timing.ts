// Sign-up and password reset, timed for an address that has an account and for one that has not: the answers must
// not tell the two apart by their status, words or time (see DEVELOPERS.md, "Sign-in and reset limits"). Both answer
// 202 and mail afterwards.
//
// The requests come from a worker thread, an event loop of their own: in this process, the app's work after an answer
// (the reset link made and mailed) would otherwise hold up the client's reading of the answer, which a remote client
// never sees.
import { ACCOUNT_MAILS_PER_HOUR } from '../../backend/src/auth/account-mail-cap';
import { Worker } from 'node:worker_threads';
import { DEMO_PEOPLE } from '../../backend/src/seed/demo-scenario';
import { percentile } from './percentile';
import { runSection, type Figures } from './print-figures';
import { withDemoApp } from './seeded-demo';

const ACCOUNTS_DB = 'tallyhood_bench_accounts';
const ATTEMPTS = 10;
const MAIL_WAIT_MS = 30_000;
/**
 * A pause before each timed request, so that the work after the previous answer (the link or note made and mailed to the
 * fake mail server, which runs in this process) is done and does not land on the next one's time: with 250 ms on a
 * busy machine, a known address's reset still measured 39 ms against 11 ms; with 1.5 s, 45 against 50.
 */
const PAUSE_MS = 1000;

interface TimingCase {
  name: string;
  url: string;
  bodies: unknown[];
}

/**
 * Plain JavaScript for the worker: for each body, a fresh client (its own address, TEST-NET-3 of RFC 5737, so the
 * per-address limits never answer) fetches its XSRF token, waits PAUSE_MS, then the POST is timed from send to the
 * answer's end.
 */
const CLIENT_SOURCE = `
const http = require('node:http');
const { parentPort, workerData } = require('node:worker_threads');
const agent = new http.Agent({ keepAlive: true });
function send(method, path, cookies, address, body) {
  const payload = body === undefined ? undefined : JSON.stringify(body);
  const headers = { cookie: [...cookies].map(([k, v]) => k + '=' + v).join('; '), 'x-forwarded-for': address };
  if (payload !== undefined) Object.assign(headers, { 'content-type': 'application/json', 'x-xsrf-token': decodeURIComponent(cookies.get('XSRF-TOKEN') || '') });
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port: workerData.port, path, method, headers, agent }, (res) => {
      for (const cookie of res.headers['set-cookie'] || []) {
        const pair = cookie.split(';')[0];
        cookies.set(pair.slice(0, pair.indexOf('=')), pair.slice(pair.indexOf('=') + 1));
      }
      res.resume();
      res.on('end', () => resolve(res.statusCode));
    });
    req.on('error', reject);
    req.end(payload);
  });
}
(async () => {
  let attempt = 0;
  const results = [];
  for (const timingCase of workerData.cases) {
    const times = [];
    const statuses = [];
    for (const body of timingCase.bodies) {
      attempt += 1;
      const cookies = new Map();
      const address = '203.0.113.' + attempt;
      await send('GET', '/api/auth/me', cookies, address);
      await new Promise((resolve) => setTimeout(resolve, workerData.pauseMs));
      const sent = performance.now();
      statuses.push(await send('POST', timingCase.url, cookies, address, body));
      times.push(performance.now() - sent);
    }
    results.push({ name: timingCase.name, times, statuses });
  }
  agent.destroy();
  parentPort.postMessage(results);
})();
`;

function timeInWorker(port: number, cases: TimingCase[]): Promise<{ name: string; times: number[]; statuses: number[] }[]> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(CLIENT_SOURCE, { eval: true, workerData: { port, cases, pauseMs: PAUSE_MS } });
    worker.once('message', resolve);
    worker.once('error', reject);
  });
}

export async function benchAccountTiming(): Promise<Figures> {
  return withDemoApp(ACCOUNTS_DB, async ({ port, mail }) => {
    const known = DEMO_PEOPLE[0].email;
    const run = Date.now();
    const attempts = (body: (index: number) => unknown) => Array.from({ length: ATTEMPTS + 1 }, (_, index) => body(index));
    const password = 'timing-password-1';
    const cases: TimingCase[] = [
      { name: 'sign-up, new address', url: '/api/auth/sign-up', bodies: attempts((index) => ({ email: `timing-${run}-${index}@example.test`, displayName: 'Timing', password })) },
      { name: 'sign-up, known address', url: '/api/auth/sign-up', bodies: attempts(() => ({ email: known, displayName: 'Timing', password })) },
      { name: 'reset, unknown address', url: '/api/auth/password-reset', bodies: attempts((index) => ({ email: `nobody-${run}-${index}@example.test` })) },
      { name: 'reset, known address', url: '/api/auth/password-reset', bodies: attempts(() => ({ email: known })) },
    ];
    const figures: Figures = {};
    for (const { name, times, statuses } of await timeInWorker(port, cases)) {
      // The first request of each kind pays for loading code: it is left out.
      figures[`${name}: status`] = [...new Set(statuses)].join(', ');
      figures[`${name}: p50 ms`] = percentile(times.slice(1), 50).toFixed(1);
      figures[`${name}: p95 ms`] = percentile(times.slice(1), 95).toFixed(1);
    }
    // The links and notes are mailed after the answers: let them arrive before the mail server closes. Every timed
    // request mails once, but a reset for an unknown address and those past the known address's hourly cap.
    const mailed = () => mail.messages.filter((message) => message.to.includes(known) || message.to.some((to) => to.startsWith(`timing-${run}-`))).length;
    const expected = ATTEMPTS + 1 + Math.min(ACCOUNT_MAILS_PER_HOUR, 2 * (ATTEMPTS + 1));
    const deadline = Date.now() + MAIL_WAIT_MS;
    while (mailed() < expected && Date.now() < deadline) {
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    return figures;
  });
}

if (require.main === module) runSection(benchAccountTiming);
