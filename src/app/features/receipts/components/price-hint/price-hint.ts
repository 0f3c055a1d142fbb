// On the check screen, under a purchase line: how far its price is above the lowest this build paid for the same item
// on another filed receipt, when that is more than the shared threshold; nothing otherwise.
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { PriceHistoryResponse } from '../../../../../../shared/api/price-history';
import type { ReceiptLineDto } from '../../../../../../shared/api/receipts';
import { toDecimal } from '../../../../../../shared/money';
import { isAboveLowest, itemKey, lineUnitPrice, lowestOf, percentAbove } from '../../../../../../shared/price-history';
import { formatCalendarDate } from '../../../../ui/dates';
import { moneyText } from '../../../../ui/money';

export type PriceHintLine = Pick<ReceiptLineDto, 'kind' | 'partNumber' | 'description' | 'quantity' | 'unitPrice' | 'amount'>;

@Component({
  selector: 'th-price-hint',
  imports: [MatIconModule],
  templateUrl: './price-hint.html',
  styleUrl: './price-hint.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PriceHint {
  readonly line = input.required<PriceHintLine>();
  /** The receipt being checked: its own earlier prices (filed before a reopening) are not compared with. */
  readonly receiptId = input.required<string>();
  /** Every price filed before, items seen once included; null until it arrives. */
  readonly history = input.required<PriceHistoryResponse | null>();
  readonly locale = input.required<string>();

  protected readonly words = computed(() => {
    const line = this.line();
    const history = this.history();
    if (!history || line.kind !== 'part') return '';
    const key = itemKey(line.partNumber, line.description);
    const others = history.items.find((item) => item.key === key)?.prices.filter((price) => price.receiptId !== this.receiptId()) ?? [];
    const lowest = lowestOf(others);
    const price = lineUnitPrice(line, history.currency);
    if (!lowest || price === null) return '';
    const lowestPrice = toDecimal(lowest.unitPrice);
    if (!isAboveLowest(price, lowestPrice)) return '';
    const where = [lowest.vendor ? ` at ${lowest.vendor}` : '', lowest.purchaseDate ? `, ${formatCalendarDate(lowest.purchaseDate, this.locale())}` : ''].join('');
    return `${percentAbove(price, lowestPrice)} % above the lowest this build paid: ${moneyText(lowestPrice, history.currency, this.locale())}${where}`;
  });
}
