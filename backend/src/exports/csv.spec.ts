// The CSV writer (csv-stringify) against RFC 4180 and read back by csv-parse.
import { parse } from 'csv-parse/sync';
import fc from 'fast-check';
import { text } from 'node:stream/consumers';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { csvDocument, csvEncoder, csvRecord } from './csv';

describe('csvRecord', () => {
  it('quotes a field with a comma, a quote, CR or LF and doubles its quotes (RFC 4180 §2.6, §2.7)', () => {
    expect(csvRecord(['plain', 'a,b', 'say "hi"', 'two\r\nlines', 'bare\nLF', 'bare\rCR', ''])).toBe(
      'plain,"a,b","say ""hi""","two\r\nlines","bare\nLF","bare\rCR",\r\n',
    );
  });

  it('is read back by csv-parse to the same fields, whatever the text', () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.string({ unit: fc.constantFrom('a', ',', '"', '\r', '\n', ' ', 'é') }), { minLength: 2, maxLength: 5 }), { minLength: 1, maxLength: 5 }), (records) => {
        const written = records.map(csvRecord).join('');
        expect(parse(written, { record_delimiter: '\r\n', relax_column_count: true })).toEqual(records);
      }),
      { numRuns: 300 },
    );
  });
});

describe('csvEncoder', () => {
  it('writes the header and one record per row, in order, across chunks', async () => {
    const rows = Array.from({ length: 5000 }, (_, index) => ({ id: index, name: `part, no. ${index}` }));
    let written = '';
    const encoder = csvEncoder(['id', 'name'], (row: { id: number; name: string }) => [String(row.id), row.name]);
    encoder.on('data', (chunk: Buffer) => (written += chunk.toString('utf8')));
    await pipeline(Readable.from(rows), encoder);
    const records = written.split('\r\n');
    expect(records).toHaveLength(5002);
    expect(records[0]).toBe('id,name');
    expect(records[1]).toBe('0,"part, no. 0"');
    expect(records[5000]).toBe('4999,"part, no. 4999"');
    expect(records[5001]).toBe('');
  });

  it('writes the header alone when no row comes', async () => {
    const encoder = csvEncoder(['id'], (row: string) => [row]);
    const [written] = await Promise.all([text(encoder), pipeline(Readable.from([]), encoder)]);
    expect(written).toBe('id\r\n');
  });
});

describe('csvDocument', () => {
  it('writes the header then the records', async () => {
    expect(await text(csvDocument(['a', 'b'], [['1', 'x"y'], ['2', '']]))).toBe('a,b\r\n1,"x""y"\r\n2,\r\n');
  });
});
