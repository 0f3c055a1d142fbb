// Applies pending migrations from migrations/ (run by npm start and npm test before anything else).
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from './mikro-orm.config';

async function main() {
  const orm = await MikroORM.init(ormConfig());
  try {
    const applied = await orm.getMigrator().up();
    console.log(applied.length ? `Applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}` : 'Database is up to date.');
  } finally {
    await orm.close(true);
  }
}

main().catch((error) => {
  console.error('Migration failed:', error);
  process.exit(1);
});
