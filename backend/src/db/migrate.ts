// Applies pending migrations from migrations/ (run by npm start and npm test before anything else).
import { MikroORM } from '@mikro-orm/postgresql';
import { refreshAllStaleLedgerTotals } from '../ledger/ledger-totals';
import { ormConfig } from './mikro-orm.config';

async function main() {
  const orm = await MikroORM.init(ormConfig());
  try {
    const applied = await orm.getMigrator().up();
    console.log(applied.length ? `Applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}` : 'Database is up to date.');
    // The ledger's running totals of builds a migration (or a writer outside a request) left marked stale.
    const refreshed = await refreshAllStaleLedgerTotals(orm.em.fork());
    if (refreshed) console.log(`Ledger totals recomputed for ${refreshed} build(s).`);
  } finally {
    await orm.close(true);
  }
}

main().catch((error) => {
  console.error('Migration failed:', error);
  process.exit(1);
});
