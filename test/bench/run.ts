// `npm run bench`: speed, memory and accuracy figures, printed; targets live here, never in timed tests.
import { benchAccountTiming } from './account-timing';
import { benchCaptureTransfer } from './capture-transfer';
import { benchLedger } from './ledger-bench';
import { printFigures, type Figures } from './print-figures';
import { benchListLoad } from './list-load';
import { benchReadingAccuracy } from './reading-accuracy';
import { benchRealReceipts } from './real-receipts';
import { benchSuggestionQuality } from './suggestion-quality';

async function main() {
  const sections: [string, () => Promise<Figures>][] = [
    ['Receipt reading (fixture set)', benchReadingAccuracy],
    // Real scans from outside the repository (../shared/receipts-real/sroie or REAL_RECEIPTS); skipped when absent.
    ['Receipt reading (real receipts)', () => benchRealReceipts()],
    ['Ledger and exports (seeded builds)', benchLedger],
    ['List routes under load (demo build, 20 clients)', benchListLoad],
    ['Sign-up and reset timing (an address with an account and one without)', benchAccountTiming],
    ['Line suggestions (demo build, leave one out)', benchSuggestionQuality],
    ['Capture transfer (initial JavaScript, a downscaled phone photo)', benchCaptureTransfer],
  ];
  for (const [title, run] of sections) {
    console.log(`\n== ${title}`);
    const figures = await run();
    printFigures(figures);
  }
}

main()
  .then(() => process.exit(0))
  .catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
