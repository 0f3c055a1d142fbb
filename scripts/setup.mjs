// Shared set-up helpers for the start, test and database scripts: Debian's PostgreSQL in a cluster of the
// project's own, npm packages, Chromium and the client build. Node's own modules only: this runs before npm ci.
import { spawn, spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const PG_HOST = '127.0.0.1';
export const PG_PORT = process.env.PGPORT || '54329';
export const APP_ROLE = 'tallyhood';
export const APP_PASSWORD = 'tallyhood';
export const CHROMIUM_PATH = '/usr/bin/chromium';
// Development-only superuser password; the cluster listens on loopback only.
const SUPERUSER_PASSWORD = 'tallyhood-dev-superuser';
const IS_ROOT = process.getuid?.() === 0;
const BIN = path.join(ROOT, 'node_modules', '.bin');

export function log(message) {
  console.log(`[tallyhood] ${message}`);
}

export function fail(message) {
  console.error(`[tallyhood] ${message}`);
  process.exit(1);
}

/** Runs a step and logs how long it took; returns the step's result. */
export async function timed(label, timings, work) {
  const started = performance.now();
  const result = await work();
  const seconds = (performance.now() - started) / 1000;
  timings.push(`${label} ${seconds.toFixed(1)} s`);
  return result;
}

/** Path of a binary installed by npm (node_modules/.bin), faster than going through npx. */
export function npmBin(name) {
  return path.join(BIN, name);
}

/** Runs a command to completion; throws with its output on failure unless `allowFailure`. */
export function run(command, args, { env, cwd = ROOT, quiet = false, allowFailure = false } = {}) {
  const result = spawnSync(command, args, {
    cwd,
    env: env ?? process.env,
    encoding: 'utf8',
    stdio: quiet ? ['ignore', 'pipe', 'pipe'] : 'inherit',
  });
  if (result.error) throw result.error;
  if (result.status !== 0 && !allowFailure) {
    const output = quiet ? `\n${result.stdout ?? ''}${result.stderr ?? ''}`.trimEnd() : '';
    throw new Error(`${command} ${args.join(' ')} exited with ${result.status ?? result.signal}${output}`);
  }
  return result;
}

/** Runs a command without blocking, streaming (or capturing) its output; resolves to its exit code. */
export function runAsync(command, args, { env, cwd = ROOT, capture = false } = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd, env: env ?? process.env, stdio: capture ? ['ignore', 'pipe', 'pipe'] : 'inherit' });
    let output = '';
    if (capture) {
      child.stdout.on('data', (chunk) => (output += chunk));
      child.stderr.on('data', (chunk) => (output += chunk));
    }
    child.on('error', reject);
    child.on('close', (code, signal) => resolve({ code: code ?? (signal ? 1 : 0), output }));
  });
}

function aptInstall(packageName) {
  if (!IS_ROOT) {
    fail(`${packageName} is missing. Install it with:\n  sudo apt-get update && sudo apt-get install -y ${packageName}\nthen run this again.`);
  }
  log(`Installing ${packageName} from Debian (apt-get) ...`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update'], { env });
  run('apt-get', ['install', '-y', packageName], { env });
}

function findPostgresBin() {
  const root = '/usr/lib/postgresql';
  if (!fs.existsSync(root)) return null;
  const versions = fs
    .readdirSync(root)
    .filter((name) => /^\d+(\.\d+)?$/.test(name))
    .sort((a, b) => Number(b) - Number(a));
  for (const version of versions) {
    const bin = path.join(root, version, 'bin');
    if (['initdb', 'pg_ctl', 'postgres'].every((tool) => fs.existsSync(path.join(bin, tool)))) return bin;
  }
  return null;
}

/** Finds Debian's PostgreSQL server binaries (highest version), installing the package when root. */
export function ensurePostgres() {
  let bin = findPostgresBin();
  if (!bin) {
    aptInstall('postgresql');
    bin = findPostgresBin();
    if (!bin) fail('PostgreSQL was installed but /usr/lib/postgresql/*/bin/initdb is still missing.');
  }
  return bin;
}

/** Runs `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureNodeModules() {
  const lock = path.join(ROOT, 'package-lock.json');
  const installed = path.join(ROOT, 'node_modules', '.package-lock.json');
  // The reading's language data is a package too, from Debian rather than npm.
  ensureOcrLanguages();
  if (fs.existsSync(installed) && (!fs.existsSync(lock) || fs.statSync(installed).mtimeMs >= fs.statSync(lock).mtimeMs)) {
    return false;
  }
  log('Installing npm packages (npm ci) ...');
  run('npm', fs.existsSync(lock) ? ['ci'] : ['install']);
  return true;
}

/**
 * Fails loudly when a runtime (non-dev) package declares a Node.js engine range this Node does not satisfy:
 * npm only warns (EBADENGINE), and such a package may break at run time. Reads the engines npm recorded in
 * node_modules/.package-lock.json, so it costs nothing when the install was skipped.
 */
export function checkRuntimeEngines() {
  const installedLock = path.join(ROOT, 'node_modules', '.package-lock.json');
  const semverPath = path.join(ROOT, 'node_modules', 'semver', 'index.js');
  if (!fs.existsSync(installedLock) || !fs.existsSync(semverPath)) return;
  const require = createRequire(import.meta.url);
  const semver = require(semverPath);
  const { packages } = JSON.parse(fs.readFileSync(installedLock, 'utf8'));
  const mismatches = Object.entries(packages)
    .filter(([, entry]) => !entry.dev && typeof entry.engines?.node === 'string')
    .filter(([, entry]) => !semver.satisfies(process.versions.node, entry.engines.node, { includePrerelease: true }))
    .map(([where, entry]) => `  ${where.replace(/^.*node_modules\//, '')}@${entry.version} needs Node ${entry.engines.node}`);
  if (mismatches.length > 0) {
    fail(`These runtime packages do not support Node ${process.versions.node} (npm's EBADENGINE):\n${mismatches.join('\n')}\nPin versions whose "engines" allow this Node (see shared STACK-NOTES) and run npm install.`);
  }
}

/** Languages receipts are read in beside English, as tesseract names them; the build's locale chooses among them. */
export const OCR_LANGUAGES = ['deu', 'fra', 'spa', 'ita', 'nld', 'por', 'msa'];
/** Where Debian's tesseract-ocr-<lang> packages put their trained data (5.x, then 4.x). */
export const TESSDATA_FOLDERS = ['/usr/share/tesseract-ocr/5/tessdata', '/usr/share/tesseract-ocr/4.00/tessdata'];

/**
 * Installs Debian's OCR data for the other languages (never fetched at run time). Without root it only says how:
 * receipts are then read with the English model alone.
 */
export function ensureOcrLanguages() {
  const missing = OCR_LANGUAGES.filter((language) => !TESSDATA_FOLDERS.some((folder) => fs.existsSync(path.join(folder, `${language}.traineddata`))));
  if (missing.length === 0) return false;
  const packages = missing.map((language) => `tesseract-ocr-${language}`);
  if (!IS_ROOT) {
    log(`Receipts in other languages are read with the English model until these are installed:\n  sudo apt-get update && sudo apt-get install -y ${packages.join(' ')}`);
    return false;
  }
  log(`Installing OCR language data from Debian (apt-get): ${packages.join(' ')} ...`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update'], { env });
  run('apt-get', ['install', '-y', '--no-install-recommends', ...packages], { env });
  return true;
}

/** Makes sure Debian's Chromium is there for the browser tests. */
export function ensureChromium() {
  if (fs.existsSync(CHROMIUM_PATH)) return false;
  aptInstall('chromium');
  if (!fs.existsSync(CHROMIUM_PATH)) fail(`chromium was installed but ${CHROMIUM_PATH} is still missing.`);
  return true;
}

// ---------------------------------------------------------------------------------------------------------
// The cluster

/**
 * Where the cluster lives: `.data/postgres` in the checkout, unless the server (run as the `postgres` user
 * when we are root) cannot enter the checkout; then a folder in the system's temporary folder named after it.
 */
export function clusterPaths() {
  let base = path.join(ROOT, '.data');
  if (IS_ROOT && run('runuser', ['-u', 'postgres', '--', 'test', '-x', ROOT], { cwd: '/', quiet: true, allowFailure: true }).status !== 0) {
    const hash = createHash('sha256').update(ROOT).digest('hex').slice(0, 12);
    base = path.join(os.tmpdir(), `tallyhood-pg-${hash}`);
  }
  return { base, data: path.join(base, 'postgres'), logFile: path.join(base, 'postgres.log') };
}

/** Runs a PostgreSQL server tool as the `postgres` user when we are root (the server refuses to run as root). */
function runPgTool(bin, tool, args, options = {}) {
  const command = path.join(bin, tool);
  // cwd '/' because the postgres user may not be allowed into the current folder.
  return IS_ROOT
    ? run('runuser', ['-u', 'postgres', '--', command, ...args], { cwd: '/', quiet: true, ...options })
    : run(command, args, { cwd: '/', quiet: true, ...options });
}

function chownToPostgres(target) {
  if (IS_ROOT) run('chown', ['postgres:postgres', target], { quiet: true });
}

function initCluster(bin, paths) {
  fs.mkdirSync(paths.base, { recursive: true, mode: 0o755 });
  // A data folder without PG_VERSION is an interrupted initdb: nothing in it is worth keeping.
  fs.rmSync(paths.data, { recursive: true, force: true });
  fs.mkdirSync(paths.data, { mode: 0o700 });
  chownToPostgres(paths.data);
  const passwordFile = path.join(paths.base, `.pwfile-${process.pid}`);
  fs.writeFileSync(passwordFile, `${SUPERUSER_PASSWORD}\n`, { mode: 0o600 });
  chownToPostgres(passwordFile);
  try {
    log(`Creating a PostgreSQL cluster in ${paths.data} ...`);
    runPgTool(bin, 'initdb', [
      '-D', paths.data,
      '-U', 'postgres',
      `--pwfile=${passwordFile}`,
      '--auth-host=scram-sha-256',
      '--auth-local=peer',
      '--encoding=UTF8',
      '--no-locale',
    ]);
  } finally {
    fs.rmSync(passwordFile, { force: true });
  }
}

function isLivePostgresProcess(pid) {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const state = stat.slice(stat.lastIndexOf(')') + 2).split(' ')[0];
    if (state === 'Z' || state === 'X') return false;
    return fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('postgres');
  } catch {
    return false;
  }
}

/** PID of the postmaster recorded in the data folder, when that process is really alive. */
function runningPostmasterPid(paths) {
  const pidFile = path.join(paths.data, 'postmaster.pid');
  if (!fs.existsSync(pidFile)) return null;
  const pid = Number.parseInt(fs.readFileSync(pidFile, 'utf8').split('\n')[0], 10);
  return Number.isInteger(pid) && pid > 0 && isLivePostgresProcess(pid) ? pid : null;
}

/** 0 accepting connections, 1 starting up or shutting down, 2 no answer (pg_isready's codes). */
function serverState(bin) {
  return run(path.join(bin, 'pg_isready'), ['-h', PG_HOST, '-p', PG_PORT, '-t', '2', '-q'], { quiet: true, allowFailure: true }).status;
}

function sleep(ms) {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

function logTail(paths, lines = 20) {
  try {
    return fs.readFileSync(paths.logFile, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '(no log)';
  }
}

async function startServer(bin, paths) {
  if (!fs.existsSync(paths.logFile)) fs.writeFileSync(paths.logFile, '');
  chownToPostgres(paths.logFile);
  const serverOptions = `-c listen_addresses=${PG_HOST} -c port=${PG_PORT} -c unix_socket_directories=''`;
  // A postmaster killed a moment ago can leave children holding its shared memory for a short while.
  for (let attempt = 1; ; attempt++) {
    const pidFile = path.join(paths.data, 'postmaster.pid');
    if (fs.existsSync(pidFile) && !runningPostmasterPid(paths)) {
      log('Removing a stale postmaster.pid left by a server that is gone.');
      fs.rmSync(pidFile, { force: true });
    }
    const result = runPgTool(bin, 'pg_ctl', ['start', '-D', paths.data, '-l', paths.logFile, '-w', '-t', '60', '-o', serverOptions], { allowFailure: true });
    if (result.status === 0) return;
    if (attempt >= 3) {
      fail(`PostgreSQL did not start.\n${result.stdout}${result.stderr}\nLast lines of ${paths.logFile}:\n${logTail(paths)}`);
    }
    await sleep(1000 * attempt);
  }
}

function psqlPath(bin) {
  const own = path.join(bin, 'psql');
  return fs.existsSync(own) ? own : '/usr/bin/psql';
}

/** Runs SQL as the cluster's superuser over TCP; returns stdout (unaligned, tuples only). */
function superuserSql(bin, statements) {
  const args = ['-h', PG_HOST, '-p', PG_PORT, '-U', 'postgres', '-d', 'postgres', '-X', '-q', '-A', '-t', '-v', 'ON_ERROR_STOP=1'];
  // Each -c runs on its own, outside a transaction block, as DROP/CREATE DATABASE require.
  for (const statement of statements) args.push('-c', statement);
  const env = { ...process.env, PGPASSWORD: SUPERUSER_PASSWORD, PGCONNECT_TIMEOUT: '5' };
  return run(psqlPath(bin), args, { env, quiet: true }).stdout.trim();
}

function quoteIdentifier(name) {
  return `"${name.replaceAll('"', '""')}"`;
}

function quoteLiteral(value) {
  return `'${value.replaceAll("'", "''")}'`;
}

function ensureRoleAndDatabase(bin, database) {
  const [hasRole, hasDatabase] = superuserSql(bin, [
    `select (select count(*) from pg_roles where rolname = ${quoteLiteral(APP_ROLE)}) || '|' || (select count(*) from pg_database where datname = ${quoteLiteral(database)})`,
  ]).split('|');
  if (hasRole === '0') {
    log(`Creating role ${APP_ROLE} ...`);
    superuserSql(bin, [`create role ${quoteIdentifier(APP_ROLE)} login createdb password ${quoteLiteral(APP_PASSWORD)}`]);
  }
  if (hasDatabase === '0') {
    log(`Creating database ${database} ...`);
    superuserSql(bin, [`create database ${quoteIdentifier(database)} owner ${quoteIdentifier(APP_ROLE)}`]);
  }
}

/**
 * Starts the project's cluster (creating it on first use) and makes sure role `tallyhood` and its database
 * `tallyhood` exist. Fast when everything is already there. Returns what the other helpers need.
 */
export async function startCluster() {
  const bin = ensurePostgres();
  const paths = clusterPaths();
  if (!fs.existsSync(path.join(paths.data, 'PG_VERSION'))) initCluster(bin, paths);

  let state = serverState(bin);
  const ownPid = runningPostmasterPid(paths);
  // Our postmaster is alive but still starting (or recovering after a crash): wait for it.
  for (let waited = 0; ownPid && state === 1 && waited < 60; waited++) {
    await sleep(500);
    state = serverState(bin);
  }
  if (state !== 0) {
    if (ownPid) fail(`PostgreSQL (pid ${ownPid}) runs but does not answer on ${PG_HOST}:${PG_PORT}.\nLast lines of ${paths.logFile}:\n${logTail(paths)}`);
    log(`Starting PostgreSQL on ${PG_HOST}:${PG_PORT} ...`);
    await startServer(bin, paths);
  } else if (!ownPid) {
    log(`Port ${PG_PORT} is answered by a PostgreSQL whose data folder is not ${paths.data}; using it. Set PGPORT to use another port.`);
  }
  ensureRoleAndDatabase(bin, APP_ROLE);
  return { bin, paths };
}

/** Stops the project's cluster (fast mode: open sessions are disconnected). */
export function stopCluster() {
  const bin = ensurePostgres();
  const paths = clusterPaths();
  const pid = runningPostmasterPid(paths);
  if (!pid) {
    log(`PostgreSQL for this project is not running (data folder ${paths.data}).`);
    return;
  }
  runPgTool(bin, 'pg_ctl', ['stop', '-D', paths.data, '-m', 'fast', '-w', '-t', '60']);
  log(`PostgreSQL stopped (was pid ${pid}).`);
}

/** Prints where the cluster lives and whether it answers. Returns true when it does. */
export function clusterStatus() {
  const bin = findPostgresBin();
  if (!bin) {
    log('PostgreSQL is not installed (no /usr/lib/postgresql/*/bin/initdb).');
    return false;
  }
  const paths = clusterPaths();
  const pid = runningPostmasterPid(paths);
  const answers = serverState(bin) === 0;
  log(`binaries:    ${bin}`);
  log(`data folder: ${paths.data}${fs.existsSync(path.join(paths.data, 'PG_VERSION')) ? '' : ' (not created yet)'}`);
  log(`log file:    ${paths.logFile}`);
  log(`server:      ${pid ? `running, pid ${pid}` : 'not running'}; ${PG_HOST}:${PG_PORT} ${answers ? 'answers' : 'does not answer'}`);
  return answers;
}

/** Drops a database (disconnecting its sessions) and creates it again, empty, owned by the app role. */
export function recreateDatabase(bin, database) {
  superuserSql(bin, [
    `drop database if exists ${quoteIdentifier(database)} with (force)`,
    `create database ${quoteIdentifier(database)} owner ${quoteIdentifier(APP_ROLE)}`,
  ]);
}

/** The environment the backend reads to reach its database. */
export function pgEnv(database) {
  return { PGHOST: PG_HOST, PGPORT: PG_PORT, PGUSER: APP_ROLE, PGPASSWORD: APP_PASSWORD, PGDATABASE: database };
}

// ---------------------------------------------------------------------------------------------------------
// Backend and client steps shared by start and test

/** Applies the migrations to the database named in env.PGDATABASE. Returns false when they failed. */
export async function migrate(env) {
  const script = path.join(ROOT, 'backend/src/db/migrate.ts');
  if (!fs.existsSync(script)) {
    log('backend/src/db/migrate.ts does not exist yet: no migrations applied.');
    return true;
  }
  const { code } = await runAsync(npmBin('tsx'), [script], { env });
  return code === 0;
}

function newestMtime(target) {
  if (!fs.existsSync(target)) return 0;
  const stat = fs.statSync(target);
  if (!stat.isDirectory()) return target.endsWith('.spec.ts') ? 0 : stat.mtimeMs;
  let newest = stat.mtimeMs; // a deleted file shows only as a newer folder
  for (const entry of fs.readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/** Builds the client with `ng build` unless dist/ is newer than every source it comes from. */
export async function ensureClientBuild() {
  const index = path.join(ROOT, 'dist/tallyhood/browser/index.html');
  const sources = ['src', 'shared', 'public', 'angular.json', 'ngsw-config.json', 'tsconfig.json', 'tsconfig.app.json'].map((name) => path.join(ROOT, name));
  if (fs.existsSync(index) && fs.statSync(index).mtimeMs >= Math.max(...sources.map(newestMtime))) {
    return { built: false, ok: true };
  }
  if (!fs.existsSync(path.join(ROOT, 'angular.json'))) {
    log('angular.json does not exist yet: client not built.');
    return { built: false, ok: false };
  }
  log('Building the client (ng build) ...');
  const { code } = await runAsync(npmBin('ng'), ['build'], { env: { ...process.env, NG_CLI_ANALYTICS: 'false' } });
  return { built: true, ok: code === 0 && fs.existsSync(index) };
}
