// A timestamp column as the text JSON answers carry (Date#toISOString's form, milliseconds, UTC), made by PostgreSQL:
// lists then parse no Date per row only to print it again (`npm run bench`, list routes).
export function isoTimeSql(column: string): string {
  return `to_char(${column} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
}
