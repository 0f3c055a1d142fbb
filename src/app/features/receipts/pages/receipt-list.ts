// /builds/:buildId/receipts: add receipts from the camera or files with a progress bar each, and the build's receipts with filters kept in the URL.
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, ParamMap, Router, RouterLink } from '@angular/router';
import { Subject, Subscription, debounceTime, timer } from 'rxjs';
import type { SystemDto } from '../../../../../shared/api/parts';
import { ACCEPTED_UPLOAD_LABEL, MAX_UPLOAD_BYTES, ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import { RECEIPT_STATES, RECEIPT_STATE_LABELS, REVIEW_STATES, REVIEW_STATE_LABELS, ReceiptState, ReviewState } from '../../../../../shared/enums';
import { REVIEW_STATE_ICONS } from '../../review/models/review-state';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { injectNarrowScreen } from '../../../ui/narrow-screen';
import { CurrentBuild } from '../../builds/services/current-build';
import { SystemsApi } from '../../parts/services/systems-api';
import { ReceiptsApi, ReceiptsFilter } from '../services/receipts-api';
import { ReceiptUploads } from '../services/receipt-uploads';

const FILTER_KEYS = ['state', 'vendor', 'systemId', 'from', 'to', 'review'] as const;
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

/**
 * The filters a URL asks for (?state=filed&vendor=ridge&systemId=…&from=2026-01-01&to=2026-03-31&review=questioned). A state or date the
 * server would refuse (an old bookmark, a hand-typed URL) is left out, so the list still shows instead of an error.
 */
function filterFromQuery(query: ParamMap): ReceiptsFilter {
  const filter: ReceiptsFilter = {};
  const state = query.get('state');
  if (state && (RECEIPT_STATES as readonly string[]).includes(state)) filter.state = state as ReceiptState;
  const review = query.get('review');
  if (review && (REVIEW_STATES as readonly string[]).includes(review)) filter.review = review as ReviewState;
  const vendor = query.get('vendor')?.trim();
  if (vendor) filter.vendor = vendor;
  const systemId = query.get('systemId');
  if (systemId) filter.systemId = systemId;
  for (const key of ['from', 'to'] as const) {
    const date = query.get(key);
    if (date && CALENDAR_DATE.test(date)) filter[key] = date;
  }
  return filter;
}

const sameFilter = (a: ReceiptsFilter, b: ReceiptsFilter) => FILTER_KEYS.every((key) => a[key] === b[key]);

const STATE_ICONS: Record<ReceiptState, string> = {
  queued: 'hourglass_empty',
  reading: 'document_scanner',
  to_check: 'fact_check',
  filed: 'task_alt',
  failed: 'error',
};

@Component({
  selector: 'th-receipt-list',
  imports: [MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, RouterLink, EmptyState, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './receipt-list.html',
  styleUrl: './receipt-list.css',
})
export class ReceiptList {
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly states = RECEIPT_STATES;
  protected readonly stateLabels = RECEIPT_STATE_LABELS;
  protected readonly stateIcons = STATE_ICONS;
  protected readonly reviewStates = REVIEW_STATES;
  protected readonly reviewLabels = REVIEW_STATE_LABELS;
  protected readonly reviewIcons = REVIEW_STATE_ICONS;
  protected readonly acceptedLabel = ACCEPTED_UPLOAD_LABEL;
  protected readonly maxMegabytes = MAX_UPLOAD_BYTES / 1024 / 1024;

  protected readonly receipts = signal<ReceiptSummaryDto[]>([]);
  protected readonly systems = signal<SystemDto[]>([]);
  private readonly uploader = inject(ReceiptUploads);
  /** This build's uploads of the session, including those started from the phone bar's camera button. */
  protected readonly uploads = computed(() => this.uploader.rows().filter((row) => row.buildId === this.buildId()));
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly query = toSignal(this.route.queryParamMap, { requireSync: true });
  /** The URL holds the filters, so a filtered list can be bookmarked or linked to, and Back returns to it. */
  protected readonly filter = computed(() => filterFromQuery(this.query()), { equal: sameFilter });
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  private readonly brokenImages = signal<ReadonlySet<string>>(new Set());
  private refresh: Subscription | null = null;
  private readonly vendorInput = new Subject<string>();

  protected readonly currency = computed(() => this.current.build()?.currency ?? '');
  protected readonly locale = computed(() => this.current.build()?.locale ?? 'en-US');
  protected readonly canEdit = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'crew';
  });
  /** Likely duplicates are flagged by the server on each receipt; this narrows the list to them (?duplicates=only). */
  protected readonly duplicatesOnly = computed(() => this.query().get('duplicates') === 'only');
  protected readonly shown = computed(() => (this.duplicatesOnly() ? this.receipts().filter((receipt) => receipt.duplicateOf.length > 0) : this.receipts()));
  /** Phones: the receipts come first; the filters wait behind one button and the bottom bar's camera adds receipts. */
  protected readonly narrow = injectNarrowScreen();
  protected readonly filtersOpen = signal(false);
  /** How many filters narrow the list, shown on the phone's filter button. */
  protected readonly activeFilterCount = computed(() => Object.values(this.filter()).filter((value) => !!value).length + (this.duplicatesOnly() ? 1 : 0));
  protected readonly filtering = computed(() => this.duplicatesOnly() || Object.values(this.filter()).some((value) => !!value));

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      this.filter();
      untracked(() => this.load(buildId));
    });
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.systemsApi.list(buildId).subscribe({ next: (response) => this.systems.set(response.systems), error: () => this.systems.set([]) }));
    });
    // An upload the server has taken (from this page or the phone bar) shows up in the list.
    effect(() => {
      if (this.uploader.finished() === 0) return;
      untracked(() => this.load(this.buildId(), true));
    });
    // Typing a shop name asks the server once the person pauses.
    this.vendorInput.pipe(debounceTime(300), takeUntilDestroyed()).subscribe((vendor) => this.setFilter({ vendor: vendor || undefined }));
  }

  protected vendorTyped(text: string): void {
    this.vendorInput.next(text.trim());
  }

  /** Writes the changed filters into the URL (a cleared one leaves it); the list follows the URL. */
  protected setFilter(change: Partial<ReceiptsFilter>): void {
    const next: ReceiptsFilter = { ...this.filter(), ...change };
    const queryParams = Object.fromEntries(FILTER_KEYS.map((key) => [key, next[key] || null]));
    // Replacing the entry: each choice in a filter is no page of its own, so Back leaves the list rather than undoing a filter.
    void this.router.navigate([], { relativeTo: this.route, queryParams, queryParamsHandling: 'merge', replaceUrl: true });
  }

  protected showDuplicatesOnly(only: boolean): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: { duplicates: only ? 'only' : null }, queryParamsHandling: 'merge', replaceUrl: true });
  }

  protected dateText(value: string): string {
    return formatCalendarDate(value, this.locale());
  }

  /** The reading worker renders page images; before it has, or when one fails to load, show an icon instead. */
  protected hasPageImage(receipt: ReceiptSummaryDto): boolean {
    return (receipt.state === 'to_check' || receipt.state === 'filed') && !this.brokenImages().has(receipt.id);
  }

  protected pageUrl(receipt: ReceiptSummaryDto): string {
    return this.receiptsApi.pageUrl(this.buildId(), receipt.id, 0);
  }

  protected noImage(receiptId: string): void {
    this.brokenImages.update((broken) => new Set([...broken, receiptId]));
  }

  protected picked(event: Event): void {
    const input = event.target as HTMLInputElement;
    const files = Array.from(input.files ?? []);
    input.value = '';
    this.uploader.send(this.buildId(), files);
  }

  /** While a receipt waits or is read, ask again every two seconds so its state and progress move on their own. */
  private refreshWhileReading(buildId: string, receipts: ReceiptSummaryDto[]): void {
    this.refresh?.unsubscribe();
    if (!receipts.some((receipt) => receipt.state === 'queued' || receipt.state === 'reading')) return;
    this.refresh = timer(2000)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.load(buildId, true));
  }

  /** `quietly`: a background refresh, without the loading bar. */
  private load(buildId: string, quietly = false): void {
    if (!quietly) this.loading.set(true);
    this.receiptsApi.list(buildId, this.filter()).subscribe({
      next: (receipts) => {
        this.receipts.set(receipts);
        this.loading.set(false);
        this.loaded.set(true);
        this.refreshWhileReading(buildId, receipts);
      },
      error: () => this.loading.set(false),
    });
  }
}
