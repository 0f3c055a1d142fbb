// One named figure, one value: the ledger against every other place the build's money is shown through the API (the
// systems summary behind Parts and Budgets, the lines behind a figure, the build sheet, the core list). Used on
// hand-worked builds and on the demo build.
import type { LedgerDto, LedgerLinesResponse } from '../../shared/api/ledger';
import type { BuildSheetDto } from '../../shared/api/exports';
import type { SystemsResponse } from '../../shared/api/parts';
import type { CoreDto } from '../../shared/api/receipts';
import { FIGURE_NAMES } from '../../shared/build-figures';
import { sum, toDecimal, toWire } from '../../shared/money';
import type { ApiClient } from './api-client';

/** Checks every agreement and answers what was read, for the caller's own hand-worked checks. */
export async function expectOneValuePerFigure(client: ApiClient, buildId: string, minorUnits: number) {
  const base = `/api/builds/${buildId}`;
  const ledger = (await client.get(`${base}/ledger`)).body as LedgerDto;
  const summary = (await client.get(`${base}/systems`)).body as SystemsResponse;
  const sheet = (await client.get(`${base}/exports/build-sheet`)).body as BuildSheetDto;
  const cores = (await client.get(`${base}/cores`)).body.cores as CoreDto[];
  const linesOf = async (figure: string) => ((await client.get(`${base}/ledger/lines?figure=${figure}`)).body as LedgerLinesResponse).total;
  const ledgerSystem = (id: string) => ledger.systems.find((s) => s.systemId === id)!;

  // Every figure on the wire is written to the currency's minor unit.
  const wire = minorUnits === 0 ? /^-?\d+$/ : new RegExp(`^-?\\d+\\.\\d{${minorUnits}}$`);
  for (const figures of [ledger.total, ...ledger.systems]) {
    for (const name of FIGURE_NAMES) if (name in figures) expect([name, figures[name as keyof typeof figures]]).toEqual([name, expect.stringMatching(wire)]);
  }
  // Parts and Budgets read the systems summary: the same budget with contingency, planned and per-system figures.
  expect(summary.budgetWithContingency).toBe(ledger.budgetWithContingency);
  expect(summary.planned).toBe(ledger.total.planned);
  for (const system of summary.systems) {
    expect([system.name, system.budget, system.estimate]).toEqual([system.name, ledgerSystem(system.id).budget, ledgerSystem(system.id).planned]);
  }
  // The lines behind a figure add up to it.
  for (const figure of ['spent', 'netCost', 'coreDepositsOutstanding', 'returnsAwaitingRefund'] as const) {
    expect([figure, await linesOf(figure)]).toEqual([figure, ledger.total[figure]]);
  }
  // The build sheet (what a buyer reads) says the same net cost, per system and in all.
  expect(sheet.total.netCost).toBe(ledger.total.netCost);
  for (const system of sheet.systems) expect([system.name, system.netCost]).toEqual([system.name, ledgerSystem(system.systemId).netCost]);
  // The core list shows each deposit as the ledger counts it; the ones not yet refunded or lost are the outstanding figure.
  const held = cores.filter((core) => core.state === 'owed' || core.state === 'dropped_off');
  expect(toWire(sum(held.map((core) => toDecimal(core.amount))), minorUnits)).toBe(ledger.total.coreDepositsOutstanding);
  return { ledger, cores, ledgerSystem };
}
