// CSV as RFC 4180 describes it (CRLF, quoted fields), written by csv-stringify, with text cells neutralised against
// spreadsheet formula injection as the OWASP "CSV Injection" guidance describes.
//
// Records go to csv-stringify's synchronous writer in batches: one stream write per record took about five times as
// long as the rest of a large export (`npm run bench`).
import { stringify, type Options } from 'csv-stringify/sync';
import { Readable, Transform } from 'node:stream';

const FORMULA_START = /^[=+\-@\t\r]/;
/** RFC 4180: CRLF between records; a field holding a comma, a double quote, CR or LF is quoted, its quotes doubled
 * (csv-stringify quotes a bare CR or LF only when asked). */
const RFC_4180: Options = { record_delimiter: 'windows', eof: true, quoted_match: /[\r\n]/ };
/** Rows are written this many at a time, so the text goes out in chunks of tens of kilobytes. */
const BATCH_ROWS = 500;

/** Text a person typed (descriptions, shop names) is prefixed with a quote when a spreadsheet would run it. */
export function neutralise(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Records with their CRLFs. */
export function csvRecords(records: readonly (readonly string[])[]): string {
  return stringify(records as string[][], RFC_4180);
}

/** One record with its CRLF; a quote inside a quoted field is doubled (RFC 4180 §2.7). */
export function csvRecord(fields: readonly string[]): string {
  return csvRecords([fields]);
}

/**
 * Rows in, CSV text out: the header row first (also when no row comes), then one record per row. Backpressure is the
 * pipe's: a slow reader stops the rows upstream.
 */
export function csvEncoder<Row>(columns: readonly string[], record: (row: Row) => readonly string[]): Transform {
  let pending: (readonly string[])[] = [columns];
  return new Transform({
    writableObjectMode: true,
    transform(row: Row, _encoding, done) {
      pending.push(record(row));
      if (pending.length < BATCH_ROWS) return done();
      const batch = pending;
      pending = [];
      done(null, csvRecords(batch));
    },
    flush(done) {
      done(null, pending.length ? csvRecords(pending) : '');
    },
  });
}

/** A small CSV made whole in memory (the build sheet), as a stream like the large ones. */
export function csvDocument(columns: readonly string[], records: readonly (readonly string[])[]): Readable {
  return Readable.from([csvRecords([columns, ...records])]);
}
