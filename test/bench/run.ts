// `npm run bench`: speed, memory and accuracy figures, printed; targets live here, never in timed tests.
import { benchLedger } from './ledger-bench';
import { benchReadingAccuracy } from './reading-accuracy';

async function main() {
  const sections: [string, () => Promise<Record<string, string | number>>][] = [
    ['Receipt reading (fixture set)', benchReadingAccuracy],
    ['Ledger and exports (seeded builds)', benchLedger],
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
