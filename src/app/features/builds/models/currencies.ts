// ISO 4217 currencies to choose a build's currency from (the currency-codes package's list).
import { data as currencyRecords } from 'currency-codes';

export interface CurrencyOption {
  code: string;
  name: string;
}

/** Spendable currencies only: the X-codes for gold, funds and testing are not what a build is paid in. */
export const CURRENCY_OPTIONS: readonly CurrencyOption[] = currencyRecords
  .filter((record) => !record.code.startsWith('X') || ['XAF', 'XCD', 'XOF', 'XPF'].includes(record.code))
  .map((record) => ({ code: record.code, name: record.currency }))
  .sort((left, right) => left.code.localeCompare(right.code));

export function currencyName(code: string): string {
  return CURRENCY_OPTIONS.find((option) => option.code === code)?.name ?? code;
}

/** Matches a typed filter against the code and the name ("eur", "euro", "yen"). */
export function filterCurrencies(query: string): CurrencyOption[] {
  const needle = query.trim().toLowerCase();
  if (!needle) return [...CURRENCY_OPTIONS];
  const byCode = CURRENCY_OPTIONS.filter((option) => option.code.toLowerCase().startsWith(needle));
  const byName = CURRENCY_OPTIONS.filter(
    (option) => !option.code.toLowerCase().startsWith(needle) && option.name.toLowerCase().includes(needle),
  );
  return [...byCode, ...byName];
}
