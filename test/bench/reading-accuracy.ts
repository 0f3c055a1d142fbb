// Field accuracy of receipt reading over the generated fixture set (total, date, tax, vendor, line-amount F1)
// and its timings. Run directly: npx tsx test/bench/reading-accuracy.ts
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { toScanOutput, type ScanOutput } from '../../shared/api/receipt-reading';
import { closeReaders, ocrPool, readDocument } from '../../backend/src/receipts/reading/read-document';
import type { GroundTruth } from '../fixtures/receipts/generate';

export const FIXTURE_FOLDER = path.resolve(__dirname, '../fixtures/receipts/generated');

export function loadFixtures(options: { subsetOnly?: boolean } = {}): GroundTruth[] {
  const files = JSON.parse(readFileSync(path.join(FIXTURE_FOLDER, 'index.json'), 'utf8')) as string[];
  return files
    .map((file) => JSON.parse(readFileSync(path.join(FIXTURE_FOLDER, file.replace(/\.[a-z]+$/, '.json')), 'utf8')) as GroundTruth)
    .filter((truth) => !options.subsetOnly || truth.subset);
}

export interface FixtureResult {
  truth: GroundTruth;
  read: ScanOutput;
  ms: number;
}

export interface AccuracyReport {
  receipts: number;
  total: number;
  subtotal: number;
  date: number;
  tax: number;
  vendor: number;
  currency: number;
  lineAmountPrecision: number;
  lineAmountRecall: number;
  lineAmountF1: number;
  /** Kind and amount both right. */
  lineKindF1: number;
  /** Fixtures whose every field and line came out right. */
  exact: number;
}

const sameVendor = (left: string | null, right: string | null) => (left ?? '').replace(/\s+/g, ' ').trim().toLowerCase() === (right ?? '').replace(/\s+/g, ' ').trim().toLowerCase();

/** Matches predicted to true values as multisets: the count each side has in common. */
function commonCount(predicted: string[], expected: string[]): number {
  const remaining = new Map<string, number>();
  for (const value of expected) remaining.set(value, (remaining.get(value) ?? 0) + 1);
  let common = 0;
  for (const value of predicted) {
    const left = remaining.get(value) ?? 0;
    if (left > 0) {
      common += 1;
      remaining.set(value, left - 1);
    }
  }
  return common;
}

const ratio = (part: number, whole: number) => (whole === 0 ? 1 : part / whole);
const f1 = (precision: number, recall: number) => (precision + recall === 0 ? 0 : (2 * precision * recall) / (precision + recall));

export function scoreResults(results: FixtureResult[]): AccuracyReport {
  const share = (test: (result: FixtureResult) => boolean) => ratio(results.filter(test).length, results.length);
  let predictedLines = 0;
  let expectedLines = 0;
  let matchedAmounts = 0;
  let matchedKinds = 0;
  for (const { truth, read } of results) {
    predictedLines += read.lines.length;
    expectedLines += truth.lines.length;
    matchedAmounts += commonCount(read.lines.map((line) => line.amount), truth.lines.map((line) => line.amount));
    matchedKinds += commonCount(read.lines.map((line) => `${line.kind} ${line.amount}`), truth.lines.map((line) => `${line.kind} ${line.amount}`));
  }
  const precision = ratio(matchedAmounts, predictedLines);
  const recall = ratio(matchedAmounts, expectedLines);
  const exact = (result: FixtureResult) => {
    const { truth, read } = result;
    const lines = (output: ScanOutput) => JSON.stringify(output.lines.map(({ kind, partNumber, quantity, unitPrice, amount }) => [kind, partNumber, quantity, unitPrice, amount]));
    return (
      read.total === truth.total &&
      read.subtotal === truth.subtotal &&
      read.tax === truth.tax &&
      read.shipping === truth.shipping &&
      read.discount === truth.discount &&
      read.date === truth.date &&
      read.currency === truth.currency &&
      sameVendor(read.vendor, truth.vendor) &&
      lines(read) === lines(truth)
    );
  };
  return {
    receipts: results.length,
    total: share(({ truth, read }) => read.total === truth.total),
    subtotal: share(({ truth, read }) => read.subtotal === truth.subtotal),
    date: share(({ truth, read }) => read.date === truth.date),
    tax: share(({ truth, read }) => read.tax === truth.tax),
    vendor: share(({ truth, read }) => sameVendor(read.vendor, truth.vendor)),
    currency: share(({ truth, read }) => read.currency === truth.currency),
    lineAmountPrecision: precision,
    lineAmountRecall: recall,
    lineAmountF1: f1(precision, recall),
    lineKindF1: f1(ratio(matchedKinds, predictedLines), ratio(matchedKinds, expectedLines)),
    exact: share(exact),
  };
}

/** Reads fixtures one after another through readDocument (the OCR pool must be started or it starts here). */
export async function readFixtures(fixtures: GroundTruth[]): Promise<FixtureResult[]> {
  const results: FixtureResult[] = [];
  for (const truth of fixtures) {
    const bytes = readFileSync(path.join(FIXTURE_FOLDER, truth.file));
    const began = performance.now();
    const receipt = await readDocument(bytes, { locale: truth.locale });
    results.push({ truth, read: toScanOutput(truth.file, receipt), ms: performance.now() - began });
  }
  return results;
}

const round = (value: number, places = 3) => Number(value.toFixed(places));

export async function benchReadingAccuracy(): Promise<Record<string, string | number>> {
  return (await measureReading()).figures;
}

async function measureReading(): Promise<{ figures: Record<string, string | number>; results: FixtureResult[] }> {
  const fixtures = loadFixtures();
  try {
    const pool = ocrPool();
    await pool.start();
    const workerStartMs = pool.startMs;
    const results = await readFixtures(fixtures);
    const report = scoreResults(results);
    const images = results.filter((result) => !result.truth.file.endsWith('.pdf'));
    const textPdfs = results.filter((result) => result.truth.layout === 'pdf-invoice');
    const mean = (values: number[]) => (values.length === 0 ? 0 : values.reduce((total, value) => total + value, 0) / values.length);
    const figures = {
      'reading: receipts': report.receipts,
      'reading: total accuracy': round(report.total),
      'reading: subtotal accuracy': round(report.subtotal),
      'reading: date accuracy': round(report.date),
      'reading: tax accuracy': round(report.tax),
      'reading: vendor accuracy': round(report.vendor),
      'reading: currency accuracy': round(report.currency),
      'reading: line-amount precision': round(report.lineAmountPrecision),
      'reading: line-amount recall': round(report.lineAmountRecall),
      'reading: line-amount F1': round(report.lineAmountF1),
      'reading: line kind+amount F1': round(report.lineKindF1),
      'reading: receipts read exactly': round(report.exact),
      'reading: OCR worker start ms': Math.round(workerStartMs),
      'reading: ms per image (warm)': Math.round(mean(images.map((result) => result.ms))),
      // The first PDF also loads pdf.js; the ones after it show the steady cost.
      'reading: ms first text-layer PDF (loads pdf.js)': Math.round(textPdfs[0]?.ms ?? 0),
      'reading: ms per text-layer PDF (warm)': Math.round(mean(textPdfs.slice(1).map((result) => result.ms))),
    };
    return { figures, results };
  } finally {
    await closeReaders();
  }
}

if (require.main === module) {
  const verbose = process.argv.includes('--verbose');
  (async () => {
    const { figures, results } = await measureReading();
    if (verbose) {
      for (const { truth, read, ms } of results) {
        const problems: string[] = [];
        for (const key of ['vendor', 'date', 'currency', 'subtotal', 'tax', 'shipping', 'discount', 'total'] as const) {
          if (key === 'vendor' ? !sameVendor(read.vendor, truth.vendor) : read[key] !== truth[key]) problems.push(`${key}: ${read[key]} ≠ ${truth[key]}`);
        }
        const got = read.lines.map((line) => `${line.kind}:${line.partNumber}:${line.quantity}x${line.unitPrice}=${line.amount}`);
        const want = truth.lines.map((line) => `${line.kind}:${line.partNumber}:${line.quantity}x${line.unitPrice}=${line.amount}`);
        if (got.join() !== want.join()) problems.push(`lines:\n      got  ${got.join(' | ')}\n      want ${want.join(' | ')}`);
        console.log(`${truth.file} (${Math.round(ms)} ms)${problems.length === 0 ? ' ok' : `\n    ${problems.join('\n    ')}`}`);
      }
    }
    for (const [name, value] of Object.entries(figures)) console.log(`${name.padEnd(40)} ${value}`);
  })().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}
