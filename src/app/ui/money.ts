// Shows an amount from the API (a decimal string) in the build's currency and locale; money stays a Decimal throughout.
import { Pipe, PipeTransform } from '@angular/core';
import { Decimal, formatMoney, parseMoney, toWire } from '../../../shared/money';

/** Display text for an amount, or '' when there is none; `maxDecimals` 4 shows unit prices such as 0.125 in full. */
export function moneyText(amount: string | Decimal | null | undefined, currency: string, locale: string, maxDecimals?: number): string {
  if (amount === null || amount === undefined || amount === '' || !currency) return '';
  let value: Decimal;
  if (typeof amount === 'string') {
    const parsed = parseMoney(amount);
    if (!parsed.ok) return amount;
    value = parsed.value;
  } else {
    value = amount;
  }
  try {
    return formatMoney(value, currency, locale || 'en-US', maxDecimals === undefined ? {} : { maxDecimals });
  } catch {
    // An unknown currency code: show the plain amount rather than nothing.
    return toWire(value);
  }
}

/** An axis figure in whole currency units ("$3,500", "3.500 €"): a chart's scale needs no cents. */
export function wholeMoneyText(value: number, currency: string, locale: string): string {
  try {
    return new Intl.NumberFormat(locale || 'en-US', { style: 'currency', currency, minimumFractionDigits: 0, maximumFractionDigits: 0 }).format(value);
  } catch {
    return String(Math.round(value));
  }
}

/** The currency's sign in this locale ("$", "€", "RM"...) and whether the locale writes it before the figure. */
export function currencySign(currency: string, locale: string): { sign: string; before: boolean } {
  try {
    const parts = new Intl.NumberFormat(locale || 'en-US', { style: 'currency', currency }).formatToParts(1);
    const at = parts.findIndex((part) => part.type === 'currency');
    const number = parts.findIndex((part) => part.type === 'integer');
    return { sign: parts[at]?.value ?? currency, before: at < number };
  } catch {
    return { sign: currency, before: false };
  }
}

@Pipe({ name: 'money' })
export class MoneyPipe implements PipeTransform {
  transform(amount: string | Decimal | null | undefined, currency: string, locale: string, maxDecimals?: number): string {
    return moneyText(amount, currency, locale, maxDecimals);
  }
}
