// Systems of a build and their budgets: defaults at creation, add, rename, reorder, archive, and the totals.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { SystemDto, SystemsResponse, UpdateSystemRequest } from '../../../shared/api/parts';
import { DEFAULT_SYSTEMS } from '../../../shared/enums';
import { Decimal, fitsMinorUnits, minorUnits, multiply, roundToMinor, sum, toWire } from '../../../shared/money';
import { needsSafetyCaution } from '../../../shared/safety';
import type { Build } from '../builds/build.entity';
import { NotFound, StaleVersion, ValidationFailed } from '../http/errors';
import { buildLedger } from '../ledger/ledger.service';
import { Part } from '../parts/part.entity';
import { VehicleSystem } from './vehicle-system.entity';

export function addDefaultSystems(em: EntityManager, build: Build): void {
  DEFAULT_SYSTEMS.forEach((name, index) => em.create(VehicleSystem, { build, name, sortOrder: index }));
}

/** A budget is an amount a person pays: it must fit the currency's minor units. */
export function checkBudget(build: Build, field: string, amount: Decimal | undefined): void {
  if (amount && !fitsMinorUnits(amount, build.currency)) {
    const places = minorUnits(build.currency);
    throw new ValidationFailed({ [field]: `${build.currency} amounts have ${places === 0 ? 'no decimals' : `at most ${places} decimals`}.` });
  }
}

export function partEstimate(part: Pick<Part, 'quantity' | 'estimatedUnitCost'>, currency: string): Decimal {
  return roundToMinor(multiply(part.estimatedUnitCost, part.quantity), currency);
}

export async function findSystem(em: EntityManager, build: Build, systemId: string, field?: string): Promise<VehicleSystem> {
  const system = await em.findOne(VehicleSystem, { id: systemId, build });
  if (!system) {
    if (field) throw new ValidationFailed({ [field]: 'No such system on this build.' });
    throw new NotFound('That system');
  }
  return system;
}

export async function systemsOverview(em: EntityManager, build: Build, includeArchived: boolean): Promise<SystemsResponse> {
  const systems = await em.find(VehicleSystem, includeArchived ? { build } : { build, archivedAt: null }, { orderBy: { sortOrder: 'asc', createdAt: 'asc' } });
  const parts = await em.find(Part, { build }, { fields: ['system', 'quantity', 'estimatedUnitCost'] });
  const bySystem = new Map<string, Decimal[]>();
  for (const part of parts) {
    const list = bySystem.get(part.system.id) ?? [];
    list.push(partEstimate(part, build.currency));
    bySystem.set(part.system.id, list);
  }
  const places = minorUnits(build.currency);
  const dtos: SystemDto[] = systems.map((system) => ({
    id: system.id,
    name: system.name,
    budget: toWire(system.budget, places),
    estimate: toWire(sum(bySystem.get(system.id) ?? []), places),
    partCount: bySystem.get(system.id)?.length ?? 0,
    sortOrder: system.sortOrder,
    archived: system.archivedAt !== null,
    safetyCaution: needsSafetyCaution(system.name),
    version: system.version,
  }));
  // The totals are the ledger's, so this page and every other show one value for one name.
  const ledger = await buildLedger(em, build);
  return {
    currency: build.currency,
    systems: dtos,
    contingencyBudget: ledger.contingencyBudget,
    budgetWithContingency: ledger.budgetWithContingency,
    planned: ledger.total.planned,
    buildVersion: build.version,
  };
}

export async function createSystem(em: EntityManager, build: Build, input: { name: string; budget?: Decimal }): Promise<VehicleSystem> {
  checkBudget(build, 'budget', input.budget);
  const last = await em.findOne(VehicleSystem, { build }, { orderBy: { sortOrder: 'desc' } });
  const system = em.create(VehicleSystem, { build, name: input.name, budget: input.budget ?? new Decimal(0), sortOrder: (last?.sortOrder ?? -1) + 1 });
  await em.flush();
  return system;
}

export async function updateSystem(em: EntityManager, build: Build, systemId: string, input: Omit<UpdateSystemRequest, 'budget'> & { budget?: Decimal }) {
  const system = await findSystem(em, build, systemId);
  if (system.version !== input.version) {
    const current = (await systemsOverview(em, build, true)).systems.find((s) => s.id === system.id);
    throw new StaleVersion('This system', current);
  }
  checkBudget(build, 'budget', input.budget);
  if (input.name !== undefined) system.name = input.name;
  if (input.budget !== undefined) system.budget = input.budget;
  if (input.sortOrder !== undefined) system.sortOrder = input.sortOrder;
  if (input.archived !== undefined) system.archivedAt = input.archived ? system.archivedAt ?? new Date() : null;
  await em.flush();
  return system;
}

export async function updateContingency(em: EntityManager, build: Build, amount: Decimal, version: number): Promise<void> {
  if (build.version !== version) throw new StaleVersion('This build');
  checkBudget(build, 'contingencyBudget', amount);
  build.contingencyBudget = amount;
  await em.flush();
}
