// Under a part on the Parts page: the lowest and the last price the build paid for it, when it was bought on more than
// one filed receipt (matched by part number, else by description, as shared/price-history.ts says).
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PriceHistoryResponse } from '../../../../../../shared/api/price-history';
import type { PartDto } from '../../../../../../shared/api/parts';
import { itemKey } from '../../../../../../shared/price-history';
import { formatCalendarDate } from '../../../../ui/dates';
import { moneyText } from '../../../../ui/money';

@Component({
  selector: 'th-prices-paid',
  templateUrl: './prices-paid.html',
  styleUrl: './prices-paid.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PricesPaid {
  readonly part = input.required<Pick<PartDto, 'partNumber' | 'description'>>();
  /** The build's price history; null until it arrives. */
  readonly history = input.required<PriceHistoryResponse | null>();
  readonly locale = input.required<string>();

  protected readonly item = computed(() => {
    const part = this.part();
    const key = itemKey(part.partNumber, part.description);
    return this.history()?.items.find((candidate) => candidate.key === key) ?? null;
  });

  protected readonly words = computed(() => {
    const item = this.item();
    const currency = this.history()?.currency ?? '';
    if (!item) return '';
    return `Paid before: lowest ${moneyText(item.lowest.unitPrice, currency, this.locale())}, last ${moneyText(item.last.unitPrice, currency, this.locale())}`;
  });

  /** Every price, for a screen reader and a pointer's title: shop, date and unit price. */
  protected readonly details = computed(() => {
    const item = this.item();
    const currency = this.history()?.currency ?? '';
    if (!item) return '';
    return item.prices
      .map((price) => `${price.vendor ?? 'No shop named'}, ${formatCalendarDate(price.purchaseDate, this.locale())}: ${moneyText(price.unitPrice, currency, this.locale())}`)
      .join('; ');
  });
}
