// The form in which two part numbers are compared: "44-120", "44 120", "44.120" and "44120" are one number.
// The same rule is written twice, once for code and once for SQL, and the two must stay alike.

/** Lower case, letters and digits only (spaces, dashes, dots, slashes and every other mark removed). */
export function partNumberKey(partNumber: string): string {
  return partNumber.toLowerCase().replace(/[^a-z0-9]+/g, '');
}

/** partNumberKey as an SQL expression over a column; also the expression of the indexes that serve the lookups. */
export function partNumberKeySql(column: string): string {
  return `regexp_replace(lower(${column}), '[^a-z0-9]+', '', 'g')`;
}
