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
  review: 'rate_review',
  cores: 'autorenew',
  over_budget: 'warning',
  duplicates: 'content_copy',
};

const LINKS: Record<AttentionItem['kind'], string> = {
  to_check: 'receipts',
  reading: 'receipts',
  failed: 'receipts',
  review: 'review',
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
  duplicates: { duplicates: 'only' },
};

@Component({
  selector: 'th-attention-list',
  imports: [MatIconModule, RouterLink, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 id="attention-heading" class="card-heading">Needs attention</h2>
    @if (items().length > 0) {
      <ul class="items">
        @for (item of items(); track item.kind) {
          <li [class.urgent]="item.kind === 'failed' || item.kind === 'over_budget' || (item.kind === 'cores' && item.overdue > 0)">
            <mat-icon aria-hidden="true">{{ icons[item.kind] }}</mat-icon>
            <div class="text">
              @switch (item.kind) {
                @case ('to_check') {
                  <a [routerLink]="links.to_check" [queryParams]="queries.to_check">{{ receipts(item.count) }} ready to check</a>
                  <span class="detail">Read into lines; they count in the ledger once checked and filed.</span>
                }
                @case ('reading') {
                  <a [routerLink]="links.reading">{{ receipts(item.count) }} being read</a>
                  <span class="detail">Usually a few seconds each; they then wait to be checked.</span>
                }
                @case ('failed') {
                  <a [routerLink]="links.failed" [queryParams]="queries.failed">{{ receipts(item.count) }} could not be read</a>
                  <span class="detail">Try a sharper photo in good light, or add the lines by hand.</span>
                }
                @case ('review') {
                  <a [routerLink]="links.review">{{ receipts(item.count) }} waiting for {{ role() === 'reviewer' ? 'your review' : 'review' }}</a>
                  <span class="detail">Filed, not yet approved or questioned.</span>
                }
                @case ('cores') {
                  <a [routerLink]="links.cores"
                    >{{ item.count }} core {{ item.count === 1 ? 'deposit' : 'deposits' }} owed,
                    <span class="tabular">{{ item.amount | money: currency() : locale() }}</span></a
                  >
                  @if (item.overdue > 0) {
                    <span class="detail overdue">
                      <strong>{{ item.overdue === item.count ? 'Overdue' : item.overdue + ' overdue' }}:</strong>
                      the earliest was due {{ dateText(item.nearestDue) }}. Hand the old parts back to get the deposits refunded.
                    </span>
                  } @else {
                    <span class="detail">Next one due {{ dateText(item.nearestDue) }}: hand the old part back to get the deposit refunded.</span>
                  }
                }
                @case ('over_budget') {
                  <a [routerLink]="links.over_budget">{{ item.count }} {{ item.count === 1 ? 'system' : 'systems' }} over budget</a>
                  <span class="detail">{{ item.systems.join(', ') }}: net cost already past the budget.</span>
                }
                @case ('duplicates') {
                  <a [routerLink]="links.duplicates" [queryParams]="queries.duplicates">{{ receipts(item.count) }} may be duplicates</a>
                  <span class="detail">Same shop, date and total as another receipt, or the same file.</span>
                }
              }
            </div>
          </li>
        }
      </ul>
    } @else if (complete()) {
      <p class="calm">
        <mat-icon aria-hidden="true">check_circle</mat-icon>
        <span>Nothing needs attention: every receipt is checked and reviewed, no core deposit is owed and no system is over its budget.</span>
      </p>
    }
    @if (!complete()) {
      <p class="notice notice-error" role="alert">Part of this overview could not be loaded. Reload the page to try again.</p>
    }
  `,
  styles: `
    .card-heading {
      font: var(--mat-sys-title-large);
      margin: 0 0 8px;
    }
    .items {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 10px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    li:last-child {
      border-bottom: none;
    }
    li mat-icon {
      flex: none;
      color: var(--mat-sys-primary);
    }
    li.urgent mat-icon {
      color: var(--mat-sys-error);
    }
    .text {
      display: flex;
      flex-direction: column;
      gap: 2px;
      min-width: 0;
    }
    a {
      font: var(--mat-sys-title-small);
      color: var(--mat-sys-primary);
      /* A thumb-sized target on a phone. */
      min-height: 24px;
      overflow-wrap: anywhere;
    }
    .detail {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .overdue {
      color: var(--mat-sys-error);
    }
    .calm {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      margin: 0;
    }
    .calm mat-icon {
      flex: none;
      color: var(--mat-sys-primary);
    }
  `,
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
