// The ledger and the exports against the real PostgreSQL: worked examples by hand to the cent, a property test
// that the systems add up to the build, and the CSVs read back with an independent parser.
import fc from 'fast-check';
import Papa from 'papaparse';
import { User } from '../../backend/src/auth/user.entity';
import { createBuild } from '../../backend/src/builds/builds.service';
import { buildLedger } from '../../backend/src/ledger/ledger.service';
import { fileReceipt } from '../../backend/src/receipts/receipt-filing';
import { ReceiptLine } from '../../backend/src/receipts/receipt-line.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { VehicleSystem } from '../../backend/src/systems/vehicle-system.entity';
import { Decimal, sum, toWire } from '../../shared/money';
import { reconcile } from '../../shared/receipt-math';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt as fileThrough } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function newBuild() {
  const owner = await signedUpClient(t.app, 'ledger');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string; version: number }[];
  const system = (name: string) => systems.find((s) => s.name === name)!;
  return { ...owner, build, system };
}

function filedReceipt(client: ApiClient, buildId: string, header: object, lines: object[]) {
  return fileThrough(t, client, buildId, header, lines);
}

const figures = (ledger: { systems: { name: string }[] }, name: string) => ledger.systems.find((s) => s.name === name) as Record<string, string>;

describe('ledger worked examples (by hand, to the cent)', () => {
  it('allocates tax and shipping, keeps a core deposit outstanding, then refunds it', async () => {
    const { client, build, system } = await newBuild();
    await client.patch(`/api/builds/${build.id}/systems/${system('Engine').id}`, { budget: '500.00', version: system('Engine').version });
    const engine = system('Engine').id;
    const cooling = system('Cooling').id;
    const first = await filedReceipt(client, build.id, { purchaseDate: '2026-10-01', tax: '7.21', shipping: '9.99', total: '139.20' }, [
      { kind: 'part', description: 'Alternator, reman', amount: '60.00', systemId: engine },
      { kind: 'core_charge', description: 'Alternator core', amount: '22.00', systemId: engine },
      { kind: 'part', description: 'Coolant', amount: '30.00', systemId: cooling },
      { kind: 'fee', description: 'Bench test', amount: '10.00', taxable: false, systemId: engine },
    ]);
    // Tax 7.21 over taxable 60 : 22 : 30 -> 3.86, 1.42, 1.93 ; shipping 9.99 over 60 : 30 : 10 (not the deposit) -> 5.99, 3.00, 1.00.
    // Line totals: alternator 69.85, core 23.42, coolant 34.93, fee 11.00 (sum 139.20, the printed total).
    let ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    expect(figures(ledger, 'Engine')).toMatchObject({ budget: '500.00', spent: '104.27', netCost: '80.85', coreDepositsOutstanding: '23.42', forecast: '80.85', variance: '419.15' });
    expect(figures(ledger, 'Cooling')).toMatchObject({ spent: '34.93', netCost: '34.93', coreDepositsOutstanding: '0.00' });
    expect(ledger.total).toMatchObject({ spent: '139.20', netCost: '115.78', coreDepositsOutstanding: '23.42' });

    // The old alternator goes back: the deposit and its tax come back on a later slip.
    const coreLine = first.lines.find((l: { kind: string }) => l.kind === 'core_charge');
    await filedReceipt(client, build.id, { purchaseDate: '2026-10-20', tax: '-1.42', total: '-23.42' }, [
      { kind: 'core_refund', description: 'Core returned', amount: '-22.00', returnOfLineId: coreLine.id },
    ]);
    ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    expect(figures(ledger, 'Engine')).toMatchObject({ spent: '80.85', netCost: '80.85', coreDepositsOutstanding: '0.00' });
    expect(ledger.total.spent).toBe('115.78');
  });

  it('counts a forfeited core as cost', async () => {
    const { client, build, system } = await newBuild();
    await filedReceipt(client, build.id, { purchaseDate: '2026-10-01', total: '140.00' }, [
      { kind: 'part', description: 'Starter', amount: '100.00', systemId: system('Engine').id },
      { kind: 'core_charge', description: 'Starter core', amount: '40.00', systemId: system('Engine').id },
    ]);
    const core = (await client.get(`/api/builds/${build.id}/cores`)).body.cores[0];
    expect(core.dueDate).toBe('2026-10-31');
    await client.patch(`/api/builds/${build.id}/cores/${core.id}`, { state: 'forfeited', version: core.version });
    const ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    expect(figures(ledger, 'Engine')).toMatchObject({ spent: '140.00', netCost: '140.00', coreDepositsOutstanding: '0.00' });
  });

  it('shows a return awaiting its refund, then the refund takes it off the cost', async () => {
    const { client, build, system } = await newBuild();
    const part = (await client.post(`/api/builds/${build.id}/parts`, { systemId: system('Cooling').id, description: 'Thermostat', quantity: '1', unit: 'each', estimatedUnitCost: '20.00' })).body;
    const bought = await filedReceipt(client, build.id, { purchaseDate: '2026-10-01', total: '25.00' }, [{ kind: 'part', description: 'Thermostat', amount: '25.00', partId: part.id }]);
    const current = (await client.get(`/api/builds/${build.id}/parts`)).body.parts[0];
    await client.patch(`/api/builds/${build.id}/parts/${part.id}`, { status: 'returned', version: current.version });
    let ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    expect(figures(ledger, 'Cooling')).toMatchObject({ netCost: '25.00', returnsAwaitingRefund: '25.00', planned: '20.00', remainingEstimate: '0.00' });
    await filedReceipt(client, build.id, { purchaseDate: '2026-10-05', total: '-25.00' }, [{ kind: 'return', description: 'Thermostat back', amount: '-25.00', returnOfLineId: bought.lines[0].id }]);
    ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    expect(figures(ledger, 'Cooling')).toMatchObject({ spent: '0.00', netCost: '0.00', returnsAwaitingRefund: '0.00' });
  });
});

describe('ledger property', () => {
  it('adds the systems up to the build, and the build to the printed totals of its receipts (30 random builds)', async () => {
    const em = t.orm.em.fork();
    const user = await em.findOneOrFail(User, { email: (await signedUpClient(t.app, 'prop')).email });
    const cents = fc.integer({ min: 1, max: 200_000 }).map((c) => new Decimal(c).dividedBy(100));
    const receiptArb = fc.record({
      lines: fc.array(fc.record({ amount: cents, taxable: fc.boolean(), system: fc.nat(11), fee: fc.boolean() }), { minLength: 1, maxLength: 8 }),
      tax: fc.option(cents, { nil: null }),
      shipping: fc.option(cents, { nil: null }),
    });
    await fc.assert(
      fc.asyncProperty(fc.array(receiptArb, { minLength: 1, maxLength: 5 }), async (receipts) => {
        const tx = em.fork();
        const build = await createBuild(tx, user, { ...NEW_BUILD, vehicle: '', locale: 'en-US', status: 'active' });
        const systems = await tx.find(VehicleSystem, { build }, { orderBy: { sortOrder: 'asc' } });
        const printed: Decimal[] = [];
        for (const shape of receipts) {
          if (shape.tax && !shape.lines.some((l) => l.taxable && !l.fee)) shape.lines[0] = { ...shape.lines[0], taxable: true, fee: false };
          const receipt = tx.create(Receipt, { build, uploadedBy: user, originalFilename: 'x.png', documentKey: 'none', contentType: 'image/png', sha256: '0'.repeat(64), size: 1, state: 'to_check', purchaseDate: '2026-11-01' });
          const lines = shape.lines.map((l, position) =>
            tx.create(ReceiptLine, { build, receipt, position, kind: l.fee ? 'fee' : 'part', description: 'x', amount: l.amount, taxable: l.taxable, system: systems[l.system] }),
          );
          receipt.tax = shape.tax;
          receipt.shipping = shape.shipping;
          receipt.total = reconcile(lines, { ...receipt, total: null }).computedTotal;
          printed.push(receipt.total);
          await tx.flush();
          await fileReceipt(tx, receipt, user, 'owner', { version: receipt.version, coreDueDays: 30 });
        }
        const ledger = await buildLedger(tx, build);
        expect(ledger.total.spent).toBe(toWire(sum(printed), 2));
        expect(ledger.total.netCost).toBe(ledger.total.spent);
        for (const key of ['spent', 'netCost', 'forecast', 'forecastAdjusted', 'variance'] as const) {
          expect(toWire(sum(ledger.systems.map((s) => new Decimal(s[key]))), 2)).toBe(ledger.total[key]);
        }
      }),
      { numRuns: 30 },
    );
  });
});

describe('exports', () => {
  it('writes the tax ledger as RFC 4180 CSV, read back with an independent parser, with formulas neutralised', async () => {
    const { client, build, system } = await newBuild();
    await filedReceipt(client, build.id, { vendorName: '=HYPERLINK("x")', purchaseDate: '2026-10-01', tax: '0.80', total: '10.80' }, [
      { kind: 'part', description: 'Fuse, 15 A, "mini", pack of 5\nsecond line', partNumber: '@FS-15', amount: '4.00', systemId: system('Wiring harness').id },
      { kind: 'part', description: '+1 spare relay', partNumber: '-R1', amount: '6.00', systemId: system('Wiring harness').id },
    ]);
    const res = await client.get(`/api/builds/${build.id}/exports/tax-ledger.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const text: string = res.text;
    // RFC 4180 §2: records end with CRLF; a field holding a comma, a quote or a line break is quoted, quotes doubled.
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.split('\r\n')[0]).toBe('date,vendor,receipt number,description,part number,system,kind,quantity,unit price,amount,allocated tax,allocated shipping,allocated discount,net,currency,review state');
    expect(text).toContain('"Fuse, 15 A, ""mini"", pack of 5\nsecond line"');
    // papaparse (an independent parser) reads it back to the same cells.
    const parsed = Papa.parse<string[]>(text, { newline: '\r\n', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const rows = parsed.data.slice(1);
    expect(rows).toEqual([
      ['2026-10-01', `'=HYPERLINK("x")`, '', 'Fuse, 15 A, "mini", pack of 5\nsecond line', "'@FS-15", 'Wiring harness', 'part', '1', '', '4.00', '0.32', '0.00', '0.00', '4.32', 'USD', 'none'],
      ['2026-10-01', `'=HYPERLINK("x")`, '', "'+1 spare relay", "'-R1", 'Wiring harness', 'part', '1', '', '6.00', '0.48', '0.00', '0.00', '6.48', 'USD', 'none'],
    ]);
    // OWASP CSV Injection: every cell starting with = + - @ tab or CR is prefixed; numbers (a refund of -5.00) are not text.
    for (const row of rows) for (const cell of [row[1], row[3], row[4]]) expect(cell).not.toMatch(/^[=+\-@\t\r]/);

    const filtered = await client.get(`/api/builds/${build.id}/exports/tax-ledger.csv?from=2026-11-01`);
    expect(filtered.text.split('\r\n').filter(Boolean)).toHaveLength(1);
    expect((await client.get(`/api/builds/${build.id}/exports/tax-ledger.csv?from=Oct`)).body.error.fields).toEqual({ from: 'Use a date like 2026-11-14.' });
  });

  it('writes the build sheet with fitted parts, system totals and the safety caution, and a ZIP of everything', async () => {
    const { client, build, system } = await newBuild();
    const part = (await client.post(`/api/builds/${build.id}/parts`, { systemId: system('Fuel').id, description: 'Fuel pump', quantity: '1', unit: 'each', estimatedUnitCost: '120.00' })).body;
    await filedReceipt(client, build.id, { purchaseDate: '2026-09-09', total: '119.00' }, [{ kind: 'part', description: 'Fuel pump', amount: '119.00', partId: part.id }]);
    const version = (await client.get(`/api/builds/${build.id}/parts`)).body.parts[0].version;
    await client.patch(`/api/builds/${build.id}/parts/${part.id}`, { status: 'installed', version });
    const sheet = Papa.parse<string[]>((await client.get(`/api/builds/${build.id}/exports/build-sheet.csv`)).text, { newline: '\r\n', skipEmptyLines: true }).data;
    expect(sheet[1]).toEqual(['part', 'Fuel', 'Fuel pump', '', '1', 'each', '119.00', '2026-09-09', 'USD']);
    expect(sheet).toContainEqual(['system total', 'Fuel', 'net cost of the system', '', '', '', '119.00', '', 'USD']);
    expect(sheet.some((row) => row[0] === 'note' && /manufacturer's instructions/.test(row[2]))).toBe(true);

    const raw = client as unknown as { agent: import('supertest').Agent };
    const zip = await raw.agent.get(`/api/builds/${build.id}/exports/archive.zip`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(zip.status).toBe(200);
    const bytes = zip.body as Buffer;
    // ZIP local file headers start "PK\x03\x04" (PKWARE APPNOTE 4.3.7); the names sit in the central directory.
    expect(bytes.subarray(0, 4).toString('latin1')).toBe('PK\u0003\u0004');
    const names = bytes.toString('latin1');
    expect(names).toContain('tax-ledger.csv');
    expect(names).toContain('build-sheet.csv');
    expect(names).toMatch(/receipts\/2026-09-09_unknown-shop_[0-9a-f]{8}\.png/);
  });
});
