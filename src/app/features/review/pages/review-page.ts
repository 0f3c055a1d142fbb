// /builds/:buildId/review: the partner's queue of filed receipts not yet reviewed, beside the chosen receipt (its
// image, its lines and where they went) with Approve and Question; crew read it without the verdict buttons.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import type { SystemDto } from '../../../../../shared/api/parts';
import type { ReceiptDto, ReceiptLineDto, ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import { reviewRequest } from '../../../../../shared/api/review';
import { RECEIPT_LINE_KIND_LABELS, REVIEW_STATE_LABELS, type ReviewState } from '../../../../../shared/enums';
import { add, subtract, toDecimal } from '../../../../../shared/money';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { CurrentBuild } from '../../builds/services/current-build';
import { SystemsApi } from '../../parts/services/systems-api';
import { ReceiptPages } from '../../receipts/components/receipt-pages';
import { ReceiptsApi } from '../../receipts/services/receipts-api';
import { ReviewPanel } from '../components/review-panel';
import { ReviewApi, type ReviewResult } from '../services/review-api';
import { ReviewVerdict, type Verdict } from '../components/review-verdict/review-verdict';
import { REVIEW_STATE_ICONS } from '../models/review-state';


@Component({
  selector: 'th-review-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    RouterLink,
    EmptyState,
    MoneyPipe,
    ReceiptPages,
    ReviewPanel,
    ReviewVerdict,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the receipts to review" />
    }
    <div class="page review-page">
      <div class="page-header">
        <h1 class="page-heading">Review</h1>
        <mat-slide-toggle [checked]="showReviewed()" (change)="setShowReviewed($event.checked)">Show approved and questioned too</mat-slide-toggle>
      </div>
      @if (!canReview()) {
        <p class="notice" role="note">
          <mat-icon aria-hidden="true" class="inline-icon">visibility</mat-icon>
          You can read the queue and comment; the owner or a reviewer approves or questions receipts.
        </p>
      }
      @if (message()) {
        <p class="notice" role="status">{{ message() }}</p>
      }
      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }

      @if (loaded() && queue().length === 0) {
        <th-empty-state icon="fact_check" [heading]="showReviewed() ? 'No filed receipts yet' : 'Nothing waiting for review'">
          <p>
            Receipts come here once they are filed: someone uploads a receipt on the Receipts screen, checks its lines, assigns
            them to parts or systems and files it. {{ canReview() ? 'You then approve it, or question it with a comment.' : '' }}
          </p>
          <a mat-stroked-button emptyStateActions routerLink="../receipts">
            <mat-icon aria-hidden="true">receipt_long</mat-icon> Go to Receipts
          </a>
        </th-empty-state>
      } @else if (loaded()) {
        <div class="layout">
          <section class="queue" aria-labelledby="queue-heading">
            <h2 id="queue-heading" class="section-heading">
              {{ showReviewed() ? 'Filed receipts' : 'Waiting for review' }} <span class="count">({{ queue().length }})</span>
            </h2>
            <ul class="queue-list">
              @for (item of queue(); track item.id) {
                <li>
                  <button type="button" class="queue-item" [class.selected]="item.id === selectedId()" [attr.aria-current]="item.id === selectedId() ? 'true' : null" (click)="select(item.id)">
                    <span class="thumb" aria-hidden="true">
                      @if (!noImage().has(item.id)) {
                        <img [src]="pageUrl(item.id)" alt="" loading="lazy" (error)="markNoImage(item.id)" />
                      } @else {
                        <mat-icon>{{ item.contentType === 'application/pdf' ? 'picture_as_pdf' : 'description' }}</mat-icon>
                      }
                    </span>
                    <span class="item-main">
                      <span class="item-shop">{{ item.vendorName || item.originalFilename }}</span><span class="visually-hidden">, </span>
                      <span class="item-meta">{{ dateText(item.purchaseDate) }} · by {{ item.uploadedBy }}</span>
                      @if (item.reviewState !== 'none') {
                        <span class="visually-hidden">, </span>
                        <span class="item-state state-{{ item.reviewState }}">
                          <mat-icon aria-hidden="true">{{ stateIcons[item.reviewState] }}</mat-icon> {{ reviewLabels[item.reviewState] }}
                        </span>
                      }
                    </span>
                    <span class="visually-hidden">, </span>
                    <span class="item-total tabular">{{ item.total ? (item.total | money: currency() : locale()) : 'No total' }}</span>
                  </button>
                </li>
              }
            </ul>
          </section>

          <section class="detail" aria-labelledby="detail-heading">
            @if (receipt(); as receipt) {
              <div class="detail-head">
                <h2 id="detail-heading" class="section-heading">{{ receipt.vendorName || receipt.originalFilename }}</h2>
                <a mat-button [routerLink]="['../receipts', receipt.id]">
                  <mat-icon aria-hidden="true">open_in_new</mat-icon> Open on the check screen
                </a>
              </div>
              <dl class="figures">
                <div><dt>Date</dt><dd>{{ dateText(receipt.purchaseDate) }}</dd></div>
                <div><dt>Uploaded by</dt><dd>{{ receipt.uploadedBy }}</dd></div>
                <div><dt>Tax</dt><dd class="tabular">{{ (receipt.tax ?? '0') | money: currency() : locale() }}</dd></div>
                <div><dt>Shipping</dt><dd class="tabular">{{ (receipt.shipping ?? '0') | money: currency() : locale() }}</dd></div>
                <div><dt>Discount</dt><dd class="tabular">{{ (receipt.discount ?? '0') | money: currency() : locale() }}</dd></div>
                <div><dt>Total</dt><dd class="tabular total">{{ receipt.total ? (receipt.total | money: currency() : locale()) : 'Not read' }}</dd></div>
              </dl>
              @if (receipt.differenceAccepted) {
                <p class="notice" role="note">
                  <mat-icon aria-hidden="true" class="inline-icon">info</mat-icon> The owner accepted a difference from the printed total:
                  {{ receipt.differenceReason }}
                </p>
              }

              @if (canReview() && receipt.state === 'filed') {
                <th-review-verdict [buildId]="buildId()" [receipt]="receipt" (decided)="decided(receipt, $event)" (stale)="stale(receipt.id)" />
              }

              <div class="receipt-body">
                <div class="lines-wrap">
                  <h3 id="lines-heading" class="sub-heading">Lines and where they went</h3>
                  <div class="table-scroll" role="region" aria-labelledby="lines-heading" tabindex="0">
                    <table class="line-table">
                      <thead>
                        <tr>
                          <th scope="col">Line</th>
                          <th scope="col">Assigned to</th>
                          <th scope="col" class="number">Amount</th>
                          <th scope="col" class="number">Tax</th>
                          <th scope="col" class="number">Shipping</th>
                          <th scope="col" class="number">With tax and shipping</th>
                        </tr>
                      </thead>
                      <tbody>
                        @for (line of receipt.lines; track line.id) {
                          <tr [class.active]="activeLineId() === line.id" (mouseenter)="activeLineId.set(line.id)" (mouseleave)="activeLineId.set(null)">
                            <td data-label="Line">
                              <span class="line-description">{{ line.description }}</span>
                              <span class="line-kind">{{ kindLabels[line.kind] }}{{ line.partNumber ? ' · ' + line.partNumber : '' }}{{ line.quantity !== '1' ? ' · qty ' + line.quantity : '' }}</span>
                            </td>
                            <td data-label="Assigned to">
                              @if (line.systemId) {
                                {{ systemName(line.systemId) }}{{ line.partDescription ? ' · ' + line.partDescription : '' }}
                              } @else {
                                <span class="unassigned"><mat-icon aria-hidden="true">error_outline</mat-icon> Not assigned</span>
                              }
                            </td>
                            <td class="number tabular" data-label="Amount">{{ line.amount | money: currency() : locale() }}</td>
                            <td class="number tabular" data-label="Tax">{{ line.allocatedTax | money: currency() : locale() }}</td>
                            <td class="number tabular" data-label="Shipping">{{ line.allocatedShipping | money: currency() : locale() }}</td>
                            <td class="number tabular line-total" data-label="With tax and shipping">{{ lineTotal(line) | money: currency() : locale() }}</td>
                          </tr>
                        } @empty {
                          <tr><td colspan="6" class="muted">This receipt has no lines.</td></tr>
                        }
                      </tbody>
                    </table>
                  </div>
                </div>
                <th-receipt-pages class="receipt-image" [buildId]="buildId()" [receiptId]="receipt.id" [pages]="receipt.pages" [activeBox]="activeBox()" [baseWidth]="360" />
              </div>

              <th-review-panel [buildId]="buildId()" [receipt]="receipt" [systems]="systems()" />
            } @else if (selectedId()) {
              <p class="muted" id="detail-heading">Loading the receipt…</p>
            } @else {
              <p class="muted" id="detail-heading">Choose a receipt from the list to see it here.</p>
            }
          </section>
        </div>
      }
    </div>
  `,
  styles: `
    .review-page {
      max-width: 1400px;
    }
    .page-header {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px 16px;
      margin-bottom: 12px;
    }
    .inline-icon {
      vertical-align: middle;
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .layout {
      display: grid;
      grid-template-columns: minmax(260px, 340px) minmax(0, 1fr);
      gap: 24px;
      align-items: start;
    }
    @media (max-width: 899.98px) {
      .layout {
        grid-template-columns: minmax(0, 1fr);
      }
    }
    .section-heading {
      font: var(--mat-sys-title-large);
      margin: 0 0 8px;
    }
    .sub-heading {
      font: var(--mat-sys-title-medium);
      margin: 0 0 8px;
    }
    .count {
      color: var(--mat-sys-on-surface-variant);
      font-weight: 400;
    }
    .queue-list {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    .queue-item {
      display: flex;
      gap: 12px;
      align-items: center;
      width: 100%;
      padding: 8px;
      text-align: left;
      font: inherit;
      color: inherit;
      background: var(--mat-sys-surface);
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      cursor: pointer;
    }
    .queue-item:hover {
      background: var(--mat-sys-surface-container-low);
    }
    .queue-item.selected {
      border: 2px solid var(--mat-sys-primary);
      padding: 7px;
      background: var(--mat-sys-surface-container);
    }
    .queue-item:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .thumb {
      flex: 0 0 44px;
      height: 56px;
      display: flex;
      align-items: center;
      justify-content: center;
      overflow: hidden;
      border-radius: 6px;
      background: var(--mat-sys-surface-container-high);
    }
    .thumb img {
      width: 100%;
      height: 100%;
      object-fit: cover;
      object-position: top;
    }
    .item-main {
      flex: 1;
      min-width: 0;
      display: flex;
      flex-direction: column;
      gap: 2px;
    }
    .item-shop {
      font-weight: 600;
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
    }
    .item-meta,
    .item-state {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .item-state {
      display: flex;
      align-items: center;
      gap: 4px;
    }
    .item-state mat-icon {
      width: 16px;
      height: 16px;
      font-size: 16px;
    }
    .state-approved mat-icon {
      color: var(--mat-sys-primary);
    }
    .state-questioned mat-icon {
      color: var(--mat-sys-error);
    }
    .item-total {
      font-weight: 600;
      white-space: nowrap;
    }
    .detail-head {
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      justify-content: space-between;
      gap: 8px;
    }
    .figures {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(120px, 1fr));
      gap: 8px 16px;
      margin: 8px 0 16px;
    }
    .figures dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .figures dd {
      margin: 0;
    }
    .figures .total {
      font-weight: 700;
    }
    /* The lines come first (they are what is reviewed); the slip sits beside them only where both fit. */
    .receipt-body {
      display: grid;
      grid-template-columns: minmax(0, 1fr);
      gap: 16px;
      align-items: start;
    }
    @media (min-width: 1500px) {
      .receipt-body {
        grid-template-columns: minmax(0, 1fr) minmax(0, 380px);
      }
    }
    /* Phones: each line becomes a small card, every figure named by its column. */
    @media (max-width: 599.98px) {
      .line-table thead {
        position: absolute;
        width: 1px;
        height: 1px;
        overflow: hidden;
        clip: rect(0 0 0 0);
      }
      .line-table tr {
        display: block;
        padding: 8px 0;
        border-bottom: 1px solid var(--mat-sys-outline-variant);
      }
      .line-table td {
        display: flex;
        justify-content: space-between;
        gap: 12px;
        border: none;
        padding: 2px 0;
        text-align: right;
      }
      .line-table td::before {
        content: attr(data-label);
        text-align: left;
        color: var(--mat-sys-on-surface-variant);
        font: var(--mat-sys-body-small);
      }
      .line-table td[data-label='Line'] {
        display: block;
        text-align: left;
      }
      .line-table td[data-label='Line']::before {
        content: none;
      }
      .line-table .line-total {
        font-weight: 600;
      }
    }
    .table-scroll {
      overflow-x: auto;
    }
    .line-table {
      border-collapse: collapse;
      width: 100%;
    }
    .line-table th {
      text-align: left;
      font: var(--mat-sys-label-large);
      padding: 8px 6px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: bottom;
    }
    .line-table td {
      padding: 6px;
      vertical-align: top;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .line-table tr.active td {
      background: color-mix(in srgb, var(--th-brass, #b8892b) 10%, transparent);
    }
    .line-table .number {
      text-align: right;
      white-space: nowrap;
    }
    .line-description {
      display: block;
    }
    .line-kind {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .unassigned {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      color: var(--mat-sys-error);
    }
  `,
})
export class ReviewPage {
  private readonly reviewApi = inject(ReviewApi);
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly current = inject(CurrentBuild);

  /** Route parameter, bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly kindLabels = RECEIPT_LINE_KIND_LABELS;
  protected readonly reviewLabels = REVIEW_STATE_LABELS;
  protected readonly stateIcons = REVIEW_STATE_ICONS;

  protected readonly queue = signal<ReceiptSummaryDto[]>([]);
  protected readonly systems = signal<SystemDto[]>([]);
  protected readonly receipt = signal<ReceiptDto | null>(null);
  protected readonly selectedId = signal<string | null>(null);
  protected readonly showReviewed = signal(false);
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly problem = signal('');
  protected readonly message = signal('');
  protected readonly activeLineId = signal<string | null>(null);
  protected readonly noImage = signal<ReadonlySet<string>>(new Set());

  protected readonly currency = computed(() => this.receipt()?.currency ?? this.current.build()?.currency ?? '');
  protected readonly locale = computed(() => this.receipt()?.locale ?? this.current.build()?.locale ?? 'en-US');
  protected readonly canReview = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'reviewer';
  });
  protected readonly activeBox = computed(() => this.receipt()?.lines.find((line) => line.id === this.activeLineId())?.box ?? null);

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => {
        this.loadQueue();
        this.systemsApi.list(buildId).subscribe({ next: (response) => this.systems.set(response.systems), error: () => this.systems.set([]) });
      });
    });
  }

  protected pageUrl(receiptId: string): string {
    return this.receiptsApi.pageUrl(this.buildId(), receiptId, 0);
  }

  protected markNoImage(receiptId: string): void {
    this.noImage.update((ids) => new Set(ids).add(receiptId));
  }

  protected dateText(date: string | null): string {
    return date ? formatCalendarDate(date, this.locale()) : 'No date';
  }

  protected systemName(systemId: string): string {
    return this.systems().find((system) => system.id === systemId)?.name ?? 'A system';
  }

  /** What the line cost in all: its amount with its share of tax and shipping, less its share of the discount. */
  protected lineTotal(line: ReceiptLineDto): string {
    return subtract(add(add(toDecimal(line.amount), toDecimal(line.allocatedTax)), toDecimal(line.allocatedShipping)), toDecimal(line.allocatedDiscount)).toString();
  }

  protected setShowReviewed(show: boolean): void {
    this.showReviewed.set(show);
    this.message.set('');
    this.loadQueue();
  }

  protected select(receiptId: string): void {
    this.selectedId.set(receiptId);
    this.activeLineId.set(null);
    this.receipt.set(null);
    this.receiptsApi.get(this.buildId(), receiptId).subscribe({
      next: (receipt) => {
        if (this.selectedId() === receiptId) this.receipt.set(receipt);
      },
      error: (error: unknown) => this.problem.set(toApiError(error).message),
    });
  }

  protected decided(receipt: ReceiptDto, result: ReviewResult & { verdict: Verdict }): void {
    const name = receipt.vendorName || receipt.originalFilename;
    this.message.set(`${result.verdict === 'approved' ? 'Approved' : 'Questioned'}: ${name}${receipt.purchaseDate ? ' of ' + this.dateText(receipt.purchaseDate) : ''}.`);
    this.afterVerdict(receipt.id, result.reviewState, result.version);
  }

  protected stale(receiptId: string): void {
    this.problem.set('Someone changed this receipt meanwhile. It is shown as saved now: look at it again before you decide.');
    this.loadQueue(receiptId);
  }

  /** The receipt leaves the queue (or shows its new state among the reviewed) and the next one opens. */
  private afterVerdict(receiptId: string, reviewState: ReviewState, version: number): void {
    const list = this.queue();
    const index = list.findIndex((item) => item.id === receiptId);
    const remaining = this.showReviewed()
      ? list.map((item) => (item.id === receiptId ? { ...item, reviewState, version } : item))
      : list.filter((item) => item.id !== receiptId);
    this.queue.set(remaining);
    const waiting = remaining.filter((item) => item.reviewState === 'none' || item.reviewState === 'answered');
    const next = waiting.find((item) => remaining.indexOf(item) >= index) ?? waiting[0];
    if (next) this.select(next.id);
    else if (this.showReviewed()) this.select(receiptId);
    else {
      this.selectedId.set(null);
      this.receipt.set(null);
    }
  }

  /** Loads the queue (or every filed receipt) and opens `prefer`, else the first one. */
  private loadQueue(prefer?: string): void {
    this.loading.set(true);
    const source = this.showReviewed() ? this.receiptsApi.list(this.buildId(), { state: 'filed' }) : this.reviewApi.queue(this.buildId());
    source.subscribe({
      next: (receipts) => {
        this.queue.set(receipts);
        this.loading.set(false);
        this.loaded.set(true);
        const keep = prefer ?? this.selectedId();
        const open = receipts.find((item) => item.id === keep) ?? receipts[0];
        if (open) this.select(open.id);
        else {
          this.selectedId.set(null);
          this.receipt.set(null);
        }
      },
      error: (error: unknown) => {
        this.loading.set(false);
        this.problem.set(toApiError(error).message);
      },
    });
  }
}
