// `npm test`: the set-up of `npm start` without the demo seed, a fresh test database, type checks and one jest
// run over every project; ends with the line `N passed, N failed` and exits non-zero when anything failed.
import fs from 'node:fs';
import path from 'node:path';
import {
  CHROMIUM_PATH,
  ROOT,
  checkRuntimeEngines,
  ensureChromium,
  ensureClientBuild,
  ensureNodeModules,
  log,
  migrate,
  npmBin,
  pgEnv,
  recreateDatabase,
  runAsync,
  startCluster,
  timed,
} from './setup.mjs';

const TEST_DATABASE = 'tallyhood_test';
const OUTPUT_DIR = 'test-results';
const JEST_REPORT = path.join(OUTPUT_DIR, 'jest.json');

const started = performance.now();
const timings = [];
const failures = [];
let passed = 0;
let failed = 0;
let skipped = 0;

function recordFailure(what) {
  failed += 1;
  failures.push(what);
}

/**
 * One test run at a time per checkout: a second run would drop the test database under the first one.
 * The lock file holds the owner's pid; a lock whose owner is gone is taken over.
 */
async function waitForTestLock() {
  const lockFile = path.join(ROOT, '.data', 'npm-test.lock');
  fs.mkdirSync(path.dirname(lockFile), { recursive: true });
  let announced = false;
  for (;;) {
    try {
      fs.writeFileSync(lockFile, String(process.pid), { flag: 'wx' });
      process.on('exit', () => fs.rmSync(lockFile, { force: true }));
      for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => process.exit(130));
      return;
    } catch (error) {
      if (error.code !== 'EEXIST') throw error;
    }
    const owner = Number.parseInt(fs.readFileSync(lockFile, 'utf8'), 10);
    let ownerAlive = false;
    try {
      ownerAlive = fs.readFileSync(`/proc/${owner}/cmdline`, 'utf8').includes('test.mjs');
    } catch {
      ownerAlive = false;
    }
    if (!ownerAlive) {
      fs.rmSync(lockFile, { force: true });
      continue;
    }
    if (!announced) log(`Another npm test (pid ${owner}) is running in this checkout; waiting for it to finish ...`);
    announced = true;
    await new Promise((resolve) => setTimeout(resolve, 1000));
  }
}

await waitForTestLock();
const setupStarted = performance.now();
await timed('packages', timings, async () => {
  ensureNodeModules();
  checkRuntimeEngines();
  ensureChromium();
});
const { bin } = await timed('postgres', timings, startCluster);
await timed('test database', timings, () => recreateDatabase(bin, TEST_DATABASE));

const env = {
  ...process.env,
  ...pgEnv(TEST_DATABASE),
  TEST_OUTPUT_DIR: OUTPUT_DIR,
  CHROMIUM_PATH,
};
fs.mkdirSync(path.join(ROOT, OUTPUT_DIR), { recursive: true });

if (!(await timed('migrate', timings, () => migrate(env)))) recordFailure(`migrations on ${TEST_DATABASE}`);
const build = await timed('client build', timings, ensureClientBuild);
if (!build.built) timings[timings.length - 1] += ' (up to date)';
if (!build.ok) recordFailure('client build (ng build)');
log(`Set-up done in ${((performance.now() - setupStarted) / 1000).toFixed(1)} s (${timings.join(', ')}).`);

// Type checks: jest does not type-check, so each tsconfig counts as one test. Both run at once.
const typecheckStarted = performance.now();
const typechecks = await Promise.all(
  ['tsconfig.server.json', 'tsconfig.spec.json'].map(async (project) => ({
    project,
    ...(await runAsync(npmBin('tsc'), ['-p', project, '--noEmit'], { env, capture: true })),
  })),
);
for (const { project, code, output } of typechecks) {
  if (code === 0) {
    passed += 1;
    log(`typecheck ${project}: passed`);
  } else {
    console.log(output.trimEnd());
    log(`typecheck ${project}: FAILED`);
    recordFailure(`typecheck ${project}`);
  }
}
timings.push(`typecheck ${((performance.now() - typecheckStarted) / 1000).toFixed(1)} s`);

// Two jest runs: the browser-like client project apart from the Node projects, because the reading pipeline loads
// pdf.js into the worker's main context, whose polyfills (a global Iterator on Node 20) break jsdom in the same
// worker. Each run's normal report streams to the console; the numbers come from its JSON.
const userArgs = process.argv.slice(2);
// The server run takes two workers on this 2-core machine (jest's default is cores − 1 = 1): most of its files wait on
// PostgreSQL, the browser or the reading worker, so two at once fill the idle time (every file makes its own
// accounts and builds, so files never share rows).
const runs =
  userArgs.length > 0
    ? [['all', userArgs]]
    : [
        ['client', ['--selectProjects', 'client']],
        ['server', ['--maxWorkers=2', '--selectProjects', 'unit', 'api', 'e2e']],
      ];
for (const [name, args] of runs) {
  const jestStarted = performance.now();
  const reportFile = JEST_REPORT.replace(/\.json$/, `-${name}.json`);
  const reportPath = path.join(ROOT, reportFile);
  fs.rmSync(reportPath, { force: true }); // a report left by an earlier run must not stand in for this one
  const jest = await runAsync(npmBin('jest'), ['--ci', '--json', `--outputFile=${reportFile}`, ...args], { env });
  timings.push(`jest ${name} ${((performance.now() - jestStarted) / 1000).toFixed(1)} s`);

  let report = null;
  try {
    report = JSON.parse(fs.readFileSync(reportPath, 'utf8'));
  } catch {
    report = null;
  }
  if (!report) {
    recordFailure(`jest ${name} crashed (exit code ${jest.code}, no ${reportFile})`);
  } else {
    passed += report.numPassedTests;
    skipped += report.numPendingTests + report.numTodoTests;
    failed += report.numFailedTests + report.numRuntimeErrorTestSuites;
    if (report.numFailedTests > 0) failures.push(`${report.numFailedTests} jest ${name} test(s)`);
    if (report.numRuntimeErrorTestSuites > 0) failures.push(`${report.numRuntimeErrorTestSuites} jest ${name} suite(s) that failed to run`);
    // Jest can fail with every counted test green (no tests found, an error outside any test): count it once.
    if (jest.code !== 0 && report.numFailedTests + report.numRuntimeErrorTestSuites === 0) {
      recordFailure(`jest ${name} exited with code ${jest.code}`);
    }
  }
}

log(`Timings: ${timings.join(', ')}; total ${((performance.now() - started) / 1000).toFixed(1)} s.`);
if (failures.length > 0) log(`Failed: ${failures.join('; ')}.`);
// Skipped tests are never counted as passed; they are named when there are any.
console.log(`${passed} passed, ${failed} failed${skipped > 0 ? `, ${skipped} skipped` : ''}`);
process.exitCode = failed === 0 ? 0 : 1;
