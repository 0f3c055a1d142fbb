// `npm run scan -- [--locale TAG] [--workers N] FILE...`: reads receipts without the web server or the
// database and prints one JSON object per line.
import { readFile } from 'node:fs/promises';
import { toScanOutput } from '../../../../shared/api/receipt-reading';
import { DEFAULT_LOCALE, checkLocale, closeReaders, readDocument, setOcrWorkers } from './read-document';

const USAGE = 'Usage: npm run scan -- [--locale TAG] [--workers N] FILE...';

async function main(argv: string[]): Promise<number> {
  let locale = DEFAULT_LOCALE;
  let workers = 1;
  const files: string[] = [];
  for (let index = 0; index < argv.length; index += 1) {
    const argument = argv[index];
    if (argument === '--locale' || argument === '--workers') {
      const value = argv[index + 1];
      if (!value) throw new Error(`${argument} needs a value. ${USAGE}`);
      if (argument === '--locale') locale = checkLocale(value);
      else {
        workers = Math.max(1, Math.min(4, Math.floor(Number(value)) || 1));
        setOcrWorkers(workers);
      }
      index += 1;
    } else if (argument.startsWith('--locale=')) locale = checkLocale(argument.slice('--locale='.length));
    else if (argument === '--help' || argument === '-h') {
      console.log(USAGE);
      return 0;
    } else files.push(argument);
  }
  if (files.length === 0) {
    console.error(USAGE);
    return 2;
  }
  let failures = 0;
  const readOne = async (file: string): Promise<string> => {
    try {
      const receipt = await readDocument(await readFile(file), { locale });
      return JSON.stringify(toScanOutput(file, receipt));
    } catch (error) {
      failures += 1;
      // One line per file either way, so a caller can pair input and output.
      const missing = (error as NodeJS.ErrnoException).code === 'ENOENT';
      return JSON.stringify({ file, error: missing ? `There is no file at ${file}.` : error instanceof Error ? error.message : String(error) });
    }
  };
  try {
    // As many files at a time as there are OCR workers; output stays in the order of the arguments.
    for (let start = 0; start < files.length; start += workers) {
      const lines = await Promise.all(files.slice(start, start + workers).map(readOne));
      for (const line of lines) process.stdout.write(`${line}\n`);
    }
  } finally {
    await closeReaders();
  }
  return failures === 0 ? 0 : 1;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 2;
  },
);
