// How every bench section prints its figures, whether run by `npm run bench` or on its own with tsx.
import os from 'node:os';

export type Figures = Record<string, string | number>;

export function printFigures(figures: Figures): void {
  // Other work on the machine moves every timing: the load average says how much there was.
  console.log(`${'machine load average (1, 5, 15 min)'.padEnd(48)} ${os.loadavg().map((load) => load.toFixed(2)).join(', ')}`);
  for (const [name, value] of Object.entries(figures)) console.log(`${name.padEnd(48)} ${value}`);
}

/** Runs one section as a script: prints its figures, exits 0, or prints the error and exits 1. */
export function runSection(section: () => Promise<Figures>): void {
  section()
    .then((figures) => {
      printFigures(figures);
      process.exit(0);
    })
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
