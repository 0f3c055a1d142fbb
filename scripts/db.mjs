// The project's PostgreSQL cluster on 127.0.0.1: `node scripts/db.mjs start|stop|status|reset-test`.
import { fail, log, PG_HOST, PG_PORT, clusterStatus, recreateDatabase, startCluster, stopCluster } from './setup.mjs';

const TEST_DATABASE = 'tallyhood_test';
const command = process.argv[2];
const started = performance.now();

switch (command) {
  case 'start': {
    await startCluster();
    log(`PostgreSQL answers on ${PG_HOST}:${PG_PORT}: database tallyhood, user tallyhood, password tallyhood.`);
    break;
  }
  case 'stop':
    stopCluster();
    break;
  case 'status':
    process.exitCode = clusterStatus() ? 0 : 3;
    break;
  case 'reset-test': {
    const { bin } = await startCluster();
    recreateDatabase(bin, TEST_DATABASE);
    log(`Database ${TEST_DATABASE} recreated empty (no migrations applied).`);
    break;
  }
  default:
    fail('Usage: node scripts/db.mjs start|stop|status|reset-test');
}
log(`done in ${((performance.now() - started) / 1000).toFixed(1)} s`);
