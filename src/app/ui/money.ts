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

@Pipe({ name: 'money' })
export class MoneyPipe implements PipeTransform {
  transform(amount: string | Decimal | null | undefined, currency: string, locale: string, maxDecimals?: number): string {
    return moneyText(amount, currency, locale, maxDecimals);
  }
}
