// CSV as RFC 4180 describes it (CRLF, quoted fields), with text cells neutralised against spreadsheet formula
// injection as the OWASP "CSV Injection" guidance describes.
//
// Written here rather than by a CSV library: a record is a few lines of RFC 4180, and the library's per-field options
// and per-record stream writes took about five times as long as the rest of a large export (`npm run bench`).
import { Readable, Transform } from 'node:stream';

const FORMULA_START = /^[=+\-@\t\r]/;
/** RFC 4180 §2.6: a field holding a comma, a double quote, CR or LF is enclosed in double quotes. */
const NEEDS_QUOTES = /[",\r\n]/;
/** Text goes out in chunks of about this many characters, not one small write per record. */
const CHUNK_CHARS = 64 * 1024;

/** Text a person typed (descriptions, shop names) is prefixed with a quote when a spreadsheet would run it. */
export function neutralise(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** One record with its CRLF; a quote inside a quoted field is doubled (RFC 4180 §2.7). */
export function csvRecord(fields: readonly string[]): string {
  let record = '';
  for (let index = 0; index < fields.length; index += 1) {
    const field = fields[index];
    if (index > 0) record += ',';
    record += NEEDS_QUOTES.test(field) ? `"${field.replace(/"/g, '""')}"` : field;
  }
  return `${record}\r\n`;
}

/**
 * Rows in, CSV text out: the header row first (also when no row comes), then one record per row. Backpressure is the
 * pipe's: a slow reader stops the rows upstream.
 */
export function csvEncoder<Row>(columns: readonly string[], record: (row: Row) => readonly string[]): Transform {
  let pending = csvRecord(columns);
  return new Transform({
    writableObjectMode: true,
    transform(row: Row, _encoding, done) {
      pending += csvRecord(record(row));
      if (pending.length < CHUNK_CHARS) return done();
      const chunk = pending;
      pending = '';
      done(null, chunk);
    },
    flush(done) {
      done(null, pending);
    },
  });
}

/** A small CSV made whole in memory (the build sheet), as a stream like the large ones. */
export function csvDocument(columns: readonly string[], records: readonly (readonly string[])[]): Readable {
  return Readable.from([csvRecord(columns) + records.map(csvRecord).join('')]);
}
