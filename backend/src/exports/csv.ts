// CSV as RFC 4180 describes it (CRLF, quoted fields), with text cells neutralised against spreadsheet formula
// injection as the OWASP "CSV Injection" guidance describes.
import { stringify, type Stringifier } from 'csv-stringify';

const FORMULA_START = /^[=+\-@\t\r]/;

/** Text a person typed (descriptions, shop names) is prefixed with a quote when a spreadsheet would run it. */
export function neutralise(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

export function csvStringifier(columns: string[]): Stringifier {
  return stringify({
    header: true,
    columns,
    record_delimiter: '\r\n',
    bom: false,
    // csv-stringify quotes separators and quotes itself; a bare CR or LF inside a field needs this to be quoted too.
    quoted_match: /[\r\n]/,
  });
}
