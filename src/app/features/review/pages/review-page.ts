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
  templateUrl: './review-page.html',
  styleUrl: './review-page.css',
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
