// A throw-away database of the bench's own, dropped and made anew on the project's cluster.
import pg from 'pg';
import type { loadConfig } from '../../backend/src/config';

export async function recreateDatabase(config: ReturnType<typeof loadConfig>['db'], name: string): Promise<void> {
  const admin = new pg.Client({ host: config.host, port: config.port, user: config.user, password: config.password, database: 'postgres' });
  await admin.connect();
  await admin.query(`drop database if exists ${name} with (force)`);
  await admin.query(`create database ${name}`);
  await admin.end();
}
