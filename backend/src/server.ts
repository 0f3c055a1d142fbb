// Starts the API and the built client on 127.0.0.1.
import { MikroORM } from '@mikro-orm/postgresql';
import { createApp } from './app';
import { loadConfig } from './config';
import { ormConfig } from './db/mikro-orm.config';
import { startJobQueue } from './jobs/queue';
import { createMailer } from './mail/mailer';
import { createObjectStore } from './storage/object-store';

async function main() {
  const config = loadConfig();
  const orm = await MikroORM.init(ormConfig(config.db));
  const mailer = createMailer(config.smtp);
  const store = createObjectStore(config.storage);
  await store.ensureBucket();
  const queue = await startJobQueue(config.db);
  const { app, close } = createApp({ orm, config, mailer, store, queue });
  const server = app.listen(config.port, '127.0.0.1', (error?: Error) => {
    if (error) {
      console.error(`Tallyhood could not listen on 127.0.0.1:${config.port}: ${error.message}`);
      process.exit(1);
    }
    console.log(`Tallyhood is serving on ${config.appUrl}`);
  });
  const stop = () => {
    server.close(async () => {
      await close();
      await queue.stop();
      store.close();
      mailer.close();
      await orm.close();
      process.exit(0);
    });
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((error) => {
  console.error('Tallyhood failed to start:', error);
  process.exit(1);
});
