// Seeds the demo build and its people when the database has no accounts yet (run by npm start).
import { MikroORM } from '@mikro-orm/postgresql';
import { hashPassword } from '../auth/passwords';
import { User } from '../auth/user.entity';
import { Membership } from '../builds/membership.entity';
import { createBuild } from '../builds/builds.service';
import { ormConfig } from '../db/mikro-orm.config';
import { Decimal } from '../../../shared/money';
import type { PartStatus } from '../../../shared/enums';
import type { Unit } from '../../../shared/units';
import { Part } from '../parts/part.entity';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { DEMO_BUDGETS, DEMO_BUILD, DEMO_CONTINGENCY, DEMO_PARTS, DEMO_PASSWORD, DEMO_PEOPLE } from './demo-scenario';

export async function seedDemo(orm: MikroORM): Promise<boolean> {
  const em = orm.em.fork();
  if (await em.count(User, {})) return false;
  await em.transactional(async (tx) => {
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
    await tx.flush();
  });
  return true;
}

if (require.main === module) {
  MikroORM.init(ormConfig())
    .then(async (orm) => {
      const seeded = await seedDemo(orm);
      console.log(seeded ? 'Seeded the demo build.' : 'Demo data already present: nothing seeded.');
      await orm.close();
    })
    .catch((error) => {
      console.error('Seeding failed:', error);
      process.exit(1);
    });
}
