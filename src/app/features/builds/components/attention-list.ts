// "Needs attention": one line per kind of thing waiting, each a count with a link to where it is dealt with, filtered to it where the page can.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { BuildRole } from '../../../../../shared/enums';
import { formatCalendarDate } from '../../../ui/dates';
import { MoneyPipe } from '../../../ui/money';
import type { AttentionItem } from '../models/at-a-glance';

const ICONS: Record<AttentionItem['kind'], string> = {
  to_check: 'fact_check',
  reading: 'hourglass_top',
  failed: 'error',
  questions: 'help',
  review: 'rate_review',
  answers: 'forum',
  cores: 'autorenew',
  over_budget: 'warning',
  duplicates: 'content_copy',
};

const LINKS: Record<AttentionItem['kind'], string> = {
  to_check: 'receipts',
  reading: 'receipts',
  failed: 'receipts',
  questions: 'receipts',
  review: 'review',
  answers: 'review',
  cores: 'cores',
  over_budget: 'ledger',
  duplicates: 'receipts',
};

/**
 * Filters the receipts list reads from its URL, so a count opens on the receipts it counted. "Being read" counts queued
 * and reading receipts, two states the list's one state filter cannot hold at once, so it opens the whole list.
 */
const QUERIES: Partial<Record<AttentionItem['kind'], Record<string, string>>> = {
  to_check: { state: 'to_check' },
  failed: { state: 'failed' },
  questions: { review: 'questioned' },
  duplicates: { duplicates: 'only' },
};

@Component({
  selector: 'th-attention-list',
  imports: [MatIconModule, RouterLink, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './attention-list.html',
  styleUrl: './attention-list.css',
})
export class AttentionList {
  readonly items = input.required<AttentionItem[]>();
  readonly role = input.required<BuildRole>();
  readonly currency = input.required<string>();
  readonly locale = input.required<string>();
  /** False when one of the sources failed: then "nothing needs attention" would not be known to be true. */
  readonly complete = input(true);

  protected readonly icons = ICONS;
  protected readonly links = LINKS;
  protected readonly queries = QUERIES;

  protected receipts(count: number): string {
    return `${count} ${count === 1 ? 'receipt' : 'receipts'}`;
  }

  protected dateText(value: string): string {
    return formatCalendarDate(value, this.locale());
  }
}
