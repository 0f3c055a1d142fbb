// A money figure in a table that opens the receipt lines behind it; a zero has no lines, so it stays plain text.
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { toDecimal } from '../../../../shared/money';
import { MoneyPipe } from '../money';

@Component({
  selector: 'th-figure-button',
  imports: [MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './figure-button.html',
})
export class FigureButton {
  readonly amount = input.required<string>();
  readonly currency = input.required<string>();
  readonly locale = input.required<string>();
  /** What the figure is, for screen readers: "Net cost of Cooling". */
  readonly what = input.required<string>();
  readonly open = output<void>();

  protected readonly zero = computed(() => toDecimal(this.amount()).isZero());
}
