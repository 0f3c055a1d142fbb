// `npm run bench`: speed, memory and accuracy figures, printed; targets live here, never in timed tests.
import { benchLedger } from './ledger-bench';
import { benchListLoad } from './list-load';
import { benchReadingAccuracy } from './reading-accuracy';
import { benchRealReceipts } from './real-receipts';

async function main() {
  const sections: [string, () => Promise<Record<string, string | number>>][] = [
    ['Receipt reading (fixture set)', benchReadingAccuracy],
    // Real scans from outside the repository (../shared/receipts-real/sroie or REAL_RECEIPTS); skipped when absent.
    ['Receipt reading (real receipts)', () => benchRealReceipts()],
    ['Ledger and exports (seeded builds)', benchLedger],
    ['List routes under load (demo build, 20 clients)', benchListLoad],
  ];
  for (const [title, run] of sections) {
    console.log(`\n== ${title}`);
    const figures = await run();
    for (const [name, value] of Object.entries(figures)) console.log(`${name.padEnd(44)} ${value}`);
  }
}

main()
  .then(() => process.exit(0))
  .catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
