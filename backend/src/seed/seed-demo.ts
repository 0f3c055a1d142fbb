// Seeds the demo build, its people and its receipt history (run by npm start when the database has no accounts yet).
// The receipts go the way a person's do: stored, read, checked and assigned, filed, reviewed, through the same code.
import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import { hashPassword } from '../auth/passwords';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';
import { Membership } from '../builds/membership.entity';
import { createBuild } from '../builds/builds.service';
import { loadConfig, type AppConfig } from '../config';
import { ormConfig } from '../db/mikro-orm.config';
import { refreshLedgerTotals } from '../ledger/ledger-totals';
import { Decimal } from '../../../shared/money';
import type { PartStatus } from '../../../shared/enums';
import type { Unit } from '../../../shared/units';
import { Part } from '../parts/part.entity';
import { Core } from '../receipts/core.entity';
import { Receipt } from '../receipts/receipt.entity';
import type { FakeS3 } from '../storage/fake-s3-server';
import type { ObjectStore } from '../storage/object-store';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { DEMO_BUDGETS, DEMO_BUILD, DEMO_CONTINGENCY, DEMO_PARTS, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_REFUSED_MAIL } from './demo-scenario';
import { inboxAddress } from '../inbox/inbox-token';
import { MailRefusal } from '../inbox/mail-refusal.entity';

export interface SeedOptions {
  /** npm start seeds only a database without accounts; a shared test database is seeded beside other accounts. */
  onlyIntoEmptyDatabase?: boolean;
}

export async function seedDemo(deps: { orm: MikroORM; store: ObjectStore; config?: AppConfig }, options: SeedOptions = {}): Promise<boolean> {
  const em = deps.orm.em.fork();
  const owner = DEMO_PEOPLE.find((person) => person.role === 'owner')!;
  const present = options.onlyIntoEmptyDatabase === false ? await em.count(User, { email: owner.email }) : await em.count(User, {});
  if (present) return false;
  const buildId = await seedBuild(em);
  try {
    // Loaded only when there is something to seed, so a start with data already in place stays quick.
    const { seedHistory } = await import('./demo-receipts');
    await seedHistory(deps, buildId);
    // The history was filed outside any request: its ledger totals are brought up to date as a request's would be.
    await em.transactional((tx) => refreshLedgerTotals(tx, buildId));
    // Statistics for the tables just filled, as PostgreSQL's manual advises after a bulk load ("Populating a
    // Database": run ANALYZE afterwards): autovacuum would not analyze tables this small, and without statistics the
    // planner picked plans for the receipts list several times slower (`npm run bench`, list routes).
    await em.execute(`analyze ${SEEDED_TABLES.join(', ')}`);
  } catch (error) {
    // A half-made history would stop the next start from seeding at all: take it all away again.
    const cleanup = deps.orm.em.fork();
    await cleanup.nativeDelete(Build, { id: buildId });
    await cleanup.nativeDelete(User, { email: { $in: DEMO_PEOPLE.map((person) => person.email) } });
    throw error;
  }
  return true;
}

/** The tables the seed fills. */
const SEEDED_TABLES = ['app_user', 'build', 'membership', 'vehicle_system', 'part', 'vendor', 'receipt', 'receipt_line', 'core', 'not_duplicate', 'comment', 'audit_event', 'ledger_system_total', 'ledger_part_total'];

async function seedBuild(em: EntityManager): Promise<string> {
  return em.transactional(async (tx) => {
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const people = DEMO_PEOPLE.map((person) => ({ person, user: tx.create(User, { email: person.email, displayName: person.displayName, passwordHash }) }));
    const owner = people.find((p) => p.person.role === 'owner')!.user;
    const build = await createBuild(tx, owner, DEMO_BUILD);
    for (const { person, user } of people) if (person.role !== 'owner') tx.create(Membership, { build, user, role: person.role });
    build.contingencyBudget = new Decimal(DEMO_CONTINGENCY);
    const systems = new Map((await tx.find(VehicleSystem, { build })).map((s) => [s.name, s]));
    for (const [name, budget] of Object.entries(DEMO_BUDGETS)) systems.get(name)!.budget = new Decimal(budget);
    for (const [system, description, partNumber, quantity, unit, unitCost, status, location] of DEMO_PARTS) {
      tx.create(Part, {
        build,
        system: systems.get(system)!,
        description,
        partNumber,
        quantity: new Decimal(quantity),
        unit: unit as Unit,
        estimatedUnitCost: new Decimal(unitCost),
        status: status as PartStatus,
        storageLocation: location,
        forSale: description.includes('left over'),
        askingPrice: description.includes('left over') ? new Decimal('30.00') : null,
      });
    }
    // The build has its inbox address from the start; one mailing it turned away shows the owner that list.
    const domain = loadConfig().inbox.domain;
    tx.create(MailRefusal, { build, ...DEMO_REFUSED_MAIL, recipient: inboxAddress(build.inboxToken, domain), receivedAt: new Date(Date.now() - 3 * 24 * 60 * 60 * 1000) });
    await tx.flush();
    return build.id;
  });
}

/** The document store npm start uses; when its fake is not up yet, one is started on the same port and folder. */
async function openStore(config: AppConfig): Promise<{ store: ObjectStore; fake: FakeS3 | null }> {
  let fake: FakeS3 | null = null;
  const endpoint = new URL(config.storage.endpoint);
  const local = endpoint.hostname === '127.0.0.1' || endpoint.hostname === 'localhost';
  const answering = await fetch(config.storage.endpoint, { signal: AbortSignal.timeout(1000) }).then(
    () => true,
    () => false,
  );
  // The store's client and the fake are loaded only here: a start that seeds nothing never needs them.
  const { DEFAULT_S3_DIRECTORY, startFakeS3 } = await import('../storage/fake-s3-server');
  const { createObjectStore } = await import('../storage/object-store');
  if (!answering && local) fake = await startFakeS3({ port: Number(endpoint.port || 80), directory: process.env.S3_DIRECTORY ?? DEFAULT_S3_DIRECTORY });
  const store = createObjectStore(config.storage);
  await store.ensureBucket();
  return { store, fake };
}

if (require.main === module) {
  (async () => {
    const started = performance.now();
    const config = loadConfig();
    const orm = await MikroORM.init(ormConfig(config.db));
    try {
      // Only a database without accounts is seeded; look before starting a document store for nothing.
      if (await orm.em.fork().count(User, {})) {
        console.log('Demo data already present: nothing seeded.');
        return;
      }
      const { store, fake } = await openStore(config);
      try {
        const seeded = await seedDemo({ orm, store, config });
        const receipts = await orm.em.fork().count(Receipt, {});
        const cores = await orm.em.fork().count(Core, {});
        console.log(seeded ? `Seeded the demo build: ${receipts} receipts, ${cores} core deposits, in ${((performance.now() - started) / 1000).toFixed(1)} s.` : 'Demo data already present: nothing seeded.');
      } finally {
        store.close();
        await fake?.close();
      }
    } finally {
      await orm.close();
    }
  })().catch((error) => {
    console.error('Seeding failed:', error);
    process.exit(1);
  });
}
