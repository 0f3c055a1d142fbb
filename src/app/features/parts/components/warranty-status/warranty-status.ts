// A part's warranty in words ("Under warranty until …", "Lifetime warranty", "Warranty ended …") with a one-tap link
// to the receipt it rests on, for the counter. Shows nothing for a part without a warranty.
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { PartDto } from '../../../../../../shared/api/parts';
import { formatCalendarDate } from '../../../../ui/dates';
import { todayIso } from '../../../builds/models/at-a-glance';

export type WarrantyState = 'lifetime' | 'under' | 'ended';

@Component({
  selector: 'th-warranty-status',
  imports: [MatIconModule, RouterLink],
  templateUrl: './warranty-status.html',
  styleUrl: './warranty-status.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WarrantyStatus {
  readonly part = input.required<Pick<PartDto, 'description' | 'warranty' | 'warrantyEnds' | 'warrantyReceiptId'>>();
  readonly buildId = input.required<string>();
  readonly locale = input('en-US');
  /** YYYY-MM-DD; the person's own today unless a test fixes it. */
  readonly today = input(todayIso());

  protected readonly state = computed<WarrantyState | null>(() => {
    const { warranty, warrantyEnds } = this.part();
    if (warranty === 'lifetime') return 'lifetime';
    if (warranty === null || !warrantyEnds) return null;
    // The end day is the last day covered.
    return warrantyEnds >= this.today() ? 'under' : 'ended';
  });

  protected readonly words = computed(() => {
    const ends = formatCalendarDate(this.part().warrantyEnds, this.locale());
    switch (this.state()) {
      case 'lifetime':
        return 'Lifetime warranty';
      case 'under':
        return `Under warranty until ${ends}`;
      case 'ended':
        return `Warranty ended ${ends}`;
      default:
        return '';
    }
  });

  protected readonly receiptLink = computed(() => {
    const receiptId = this.part().warrantyReceiptId;
    return receiptId ? ['/builds', this.buildId(), 'receipts', receiptId] : null;
  });
}
