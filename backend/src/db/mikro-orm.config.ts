// MikroORM configuration, shared by the server, the migration runner, the seed and the tests.
import { defineConfig } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import path from 'node:path';
import { loadConfig } from '../config';
import { entities } from './entities';

export function ormConfig(db = loadConfig().db) {
  return defineConfig({
    host: db.host,
    port: db.port,
    user: db.user,
    password: db.password,
    dbName: db.dbName,
    entities,
    extensions: [Migrator],
    discovery: { warnWhenNoEntities: true },
    migrations: {
      path: path.resolve(__dirname, '../../../migrations'),
      pathTs: path.resolve(__dirname, '../../../migrations'),
      glob: '!(*.d).{js,ts}',
      transactional: true,
      snapshot: false,
      emit: 'ts',
    },
    // The session table belongs to connect-pg-simple; it is created by the first migration.
    schemaGenerator: { skipTables: ['session'] },
    pool: { min: 0, max: 10 },
    // PostgreSQL's JIT compiles a query whose estimated cost is high; the ledger's correlated filters estimate high and
    // then spend ~450 ms compiling a query that runs in ~50 ms (measured by `npm run bench`). Short queries only here.
    driverOptions: { connection: { options: '-c jit=off' } },
    debug: false,
  });
}

export default ormConfig();
