// `npm start`: installs what is missing, starts PostgreSQL, migrates, seeds the demo build, builds the client and
// serves Tallyhood with a fake mail catcher on 127.0.0.1 until Ctrl-C (PostgreSQL keeps running: npm run db:stop).
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { ROOT, checkRuntimeEngines, ensureClientBuild, ensureNodeModules, fail, log, migrate, npmBin, pgEnv, runAsync, startCluster, timed } from './setup.mjs';

const DATABASE = 'tallyhood';
const port = process.env.PORT || '3000';
const smtpPort = process.env.SMTP_PORT || '2525';
const mailViewPort = process.env.MAIL_VIEW_PORT || '2580';
const appUrl = `http://127.0.0.1:${port}`;
const mailUrl = `http://127.0.0.1:${mailViewPort}/`;
const s3Port = process.env.S3_PORT || '4569';
const s3Url = `http://127.0.0.1:${s3Port}`;

const setupStarted = performance.now();
const timings = [];
await timed('packages', timings, () => {
  ensureNodeModules();
  checkRuntimeEngines();
});
await timed('postgres', timings, startCluster);

const env = {
  ...process.env,
  ...pgEnv(DATABASE),
  PORT: port,
  APP_URL: appUrl,
  SMTP_HOST: '127.0.0.1',
  SMTP_PORT: smtpPort,
  MAIL_VIEW_PORT: mailViewPort,
  S3_PORT: s3Port,
  S3_ENDPOINT: process.env.S3_ENDPOINT || s3Url,
  // The fake mail server hands mail for the receipts domain to the app's inbound-mail webhook with this secret.
  INBOUND_MAIL_SECRET: process.env.INBOUND_MAIL_SECRET || randomBytes(32).toString('hex'),
};

if (!(await timed('migrate', timings, () => migrate(env)))) fail('The migrations failed (see above); nothing was started.');
const seedScript = path.join(ROOT, 'backend/src/seed/seed-demo.ts');
await timed('seed', timings, async () => {
  // The seed does nothing when the database already holds accounts. Its receipt documents go to the same fake S3
  // (port and folder) the servers use below: it starts that store briefly itself, as it is not running yet here.
  if ((await runAsync(npmBin('tsx'), [seedScript], { env })).code !== 0) fail('Seeding the demo build failed (see above).');
});
const build = await timed('client build', timings, ensureClientBuild);
if (!build.built) timings[timings.length - 1] += ' (up to date)';
if (!build.ok) fail('The client build failed (see above); nothing was started.');
log(`Set-up done in ${((performance.now() - setupStarted) / 1000).toFixed(1)} s (${timings.join(', ')}).`);

// Children get their own process group so that Ctrl-C reaches them once, through us, as SIGTERM.
const children = [];
let stopping = false;

/**
 * Starts a child. A child that stops on its own stops everything, unless it is `restartable` (the reading worker:
 * the site keeps serving without it), which is started again after 1, 2, 4 ... at most 30 s; a run of over a
 * minute counts as healthy and resets the wait.
 */
function startChild(name, script, { restartable = false, failuresInARow = 0 } = {}) {
  const startedAt = Date.now();
  const child = spawn(npmBin('tsx'), [path.join(ROOT, script)], { cwd: ROOT, env, stdio: 'inherit', detached: true });
  child.on('exit', (code, signal) => {
    child.exited = true;
    if (!stopping && restartable) {
      const failures = Date.now() - startedAt > 60_000 ? 1 : failuresInARow + 1;
      const waitMs = Math.min(30_000, 1000 * 2 ** (failures - 1));
      log(`The ${name} stopped (${signal ?? `exit code ${code}`}); starting it again in ${waitMs / 1000} s.`);
      setTimeout(() => {
        if (stopping) return;
        children.splice(children.indexOf(child), 1);
        startChild(name, script, { restartable, failuresInARow: failures });
      }, waitMs);
    } else if (!stopping) {
      log(`The ${name} stopped (${signal ?? `exit code ${code}`}); stopping the rest.`);
      stopAll(code || 1);
    } else if (children.every((other) => other.exited)) {
      process.exit(process.exitCode ?? 0);
    }
  });
  children.push(child);
  return child;
}

function stopAll(exitCode) {
  if (stopping) return;
  stopping = true;
  process.exitCode = exitCode;
  const running = children.filter((child) => !child.exited);
  if (running.length === 0) process.exit(exitCode);
  for (const child of running) child.kill('SIGTERM');
  setTimeout(() => {
    for (const child of children) if (!child.exited) child.kill('SIGKILL');
    process.exit(exitCode);
  }, 5000).unref();
}

process.on('SIGINT', () => stopAll(0));
process.on('SIGTERM', () => stopAll(0));

async function answers(url) {
  try {
    await fetch(url, { signal: AbortSignal.timeout(1000) });
    return true;
  } catch {
    return false;
  }
}

async function waitUntilAnswering(url, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (!stopping && Date.now() < deadline) {
    if (await answers(url)) return true;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  return false;
}

for (const [label, url] of [['Port ' + port, appUrl], ['Port ' + mailViewPort, mailUrl], ['Port ' + s3Port, s3Url]]) {
  if (await answers(url)) fail(`${label} is already in use (${url} answers): is another npm start running? Stop it or set PORT / MAIL_VIEW_PORT / S3_PORT.`);
}

startChild('fake mail server', 'backend/src/mail/fake-mail-server.ts');
startChild('fake S3 server', 'backend/src/storage/fake-s3-server.ts');
// The server and the worker make the bucket on start, so the store must answer first.
const storeUp = await waitUntilAnswering(s3Url);
startChild('server', 'backend/src/server.ts');
startChild('receipt reading worker', 'backend/src/jobs/worker.ts', { restartable: true });
if (!storeUp || !(await waitUntilAnswering(mailUrl)) || !(await waitUntilAnswering(appUrl))) {
  if (!stopping) {
    log('The servers did not answer within a minute; stopping.');
    stopAll(1);
  }
} else {
  console.log(`
  Tallyhood is running at ${appUrl}
  Caught mail (nothing leaves this machine): ${mailUrl}

  Demo sign-ins, all with the password demo-garage-2026:
    builder@example.com   owner of the demo build
    crew@example.com      crew
    partner@example.com   reviewer

  Ctrl-C stops the servers; PostgreSQL keeps running until \`npm run db:stop\`.
  Ready ${((performance.now() - setupStarted) / 1000).toFixed(1)} s after start.
`);
}
