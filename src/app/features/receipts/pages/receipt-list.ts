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
import { RECEIPT_STATES, RECEIPT_STATE_LABELS, ReceiptState } from '../../../../../shared/enums';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { CurrentBuild } from '../../builds/services/current-build';
import { SystemsApi } from '../../parts/services/systems-api';
import { ReceiptsApi, ReceiptsFilter } from '../services/receipts-api';
import { ReceiptUploads } from '../services/receipt-uploads';

const FILTER_KEYS = ['state', 'vendor', 'systemId', 'from', 'to'] as const;
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

/**
 * The filters a URL asks for (?state=filed&vendor=ridge&systemId=…&from=2026-01-01&to=2026-03-31). A state or date the
 * server would refuse (an old bookmark, a hand-typed URL) is left out, so the list still shows instead of an error.
 */
function filterFromQuery(query: ParamMap): ReceiptsFilter {
  const filter: ReceiptsFilter = {};
  const state = query.get('state');
  if (state && (RECEIPT_STATES as readonly string[]).includes(state)) filter.state = state as ReceiptState;
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
  template: `
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the receipts" />
    }
    <div class="page">
      <div class="page-header">
        <h1 class="page-heading">Receipts</h1>
        <a mat-button routerLink="../cores">
          <mat-icon aria-hidden="true">autorenew</mat-icon>
          Cores and returns
        </a>
      </div>

      @if (canEdit()) {
        <section class="add" aria-labelledby="add-heading">
          <h2 id="add-heading" class="visually-hidden">Add receipts</h2>
          <div class="add-actions">
            <input
              id="receipt-camera"
              class="visually-hidden"
              type="file"
              accept="image/*,application/pdf"
              capture="environment"
              (change)="picked($event)"
            />
            <label class="cta add-main" for="receipt-camera">
              <mat-icon aria-hidden="true">add_a_photo</mat-icon>
              Add receipts
            </label>
            <input id="receipt-files" class="visually-hidden" type="file" accept="image/*,application/pdf" multiple (change)="picked($event)" />
            <label class="add-files" for="receipt-files">
              <mat-icon aria-hidden="true">upload_file</mat-icon>
              Choose several files
            </label>
          </div>
          <p class="add-hint">On a phone, "Add receipts" opens the camera. Accepted: {{ acceptedLabel }}, up to {{ maxMegabytes }} MB each.</p>
          @if (uploads().length > 0) {
            <ul class="uploads" aria-label="Uploads">
              @for (upload of uploads(); track upload.key) {
                <li class="upload" [class.refused]="upload.status === 'refused'">
                  <span class="upload-name">{{ upload.name }}</span>
                  @switch (upload.status) {
                    @case ('sending') {
                      <mat-progress-bar mode="determinate" [value]="upload.percent" [attr.aria-label]="'Uploading ' + upload.name" />
                      <span class="tabular">{{ upload.percent }}%</span>
                    }
                    @case ('done') {
                      <span class="upload-done"><mat-icon aria-hidden="true">check_circle</mat-icon> Uploaded, reading now</span>
                    }
                    @case ('refused') {
                      <span class="upload-refused" role="alert"><mat-icon aria-hidden="true">error</mat-icon> {{ upload.message }}</span>
                    }
                  }
                </li>
              }
            </ul>
          }
        </section>
      }

      @if (loaded() && receipts().length === 0 && !filtering()) {
        <th-empty-state icon="receipt_long" heading="No receipts yet">
          @if (canEdit()) {
            <p>
              Take a photo of a receipt or choose a PDF invoice with "Add receipts". Tallyhood reads the shop, date, lines and
              totals; you then check them and assign each line to a part or a system.
            </p>
          } @else {
            <p>The owner and crew add receipts here. Once they do, you see each one with its lines and totals.</p>
          }
        </th-empty-state>
      } @else if (loaded()) {
        <div class="filters" role="search" aria-label="Filter receipts">
          <mat-form-field subscriptSizing="dynamic" class="filter-vendor">
            <mat-label>Shop</mat-label>
            <mat-icon matIconPrefix aria-hidden="true">search</mat-icon>
            <input matInput [value]="filter().vendor ?? ''" (input)="vendorTyped($any($event.target).value)" autocomplete="off" />
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>State</mat-label>
            <mat-select [value]="filter().state ?? ''" (selectionChange)="setFilter({ state: $event.value || undefined })">
              <mat-option value="">Any state</mat-option>
              @for (state of states; track state) {
                <mat-option [value]="state">{{ stateLabels[state] }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>System</mat-label>
            <mat-select [value]="filter().systemId ?? ''" (selectionChange)="setFilter({ systemId: $event.value || undefined })">
              <mat-option value="">All systems</mat-option>
              @for (system of systems(); track system.id) {
                <mat-option [value]="system.id">{{ system.name }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic" class="filter-date">
            <mat-label>Bought from</mat-label>
            <input matInput type="date" [value]="filter().from ?? ''" (change)="setFilter({ from: $any($event.target).value || undefined })" />
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic" class="filter-date">
            <mat-label>Bought to</mat-label>
            <input matInput type="date" [value]="filter().to ?? ''" (change)="setFilter({ to: $any($event.target).value || undefined })" />
          </mat-form-field>
          <mat-checkbox class="filter-duplicates" [checked]="duplicatesOnly()" (change)="showDuplicatesOnly($event.checked)">
            Possible duplicates only
          </mat-checkbox>
        </div>

        @if (shown().length === 0) {
          <p class="no-match">No receipt matches these filters. Clear a filter to see more.</p>
        }
        <ul class="receipts" aria-label="Receipts">
          @for (receipt of shown(); track receipt.id) {
            <li>
              <a class="receipt" [routerLink]="receipt.id">
                <span class="thumb" aria-hidden="true">
                  @if (hasPageImage(receipt)) {
                    <img [src]="pageUrl(receipt)" alt="" loading="lazy" (error)="noImage(receipt.id)" />
                  } @else {
                    <mat-icon>{{ receipt.contentType === 'application/pdf' ? 'picture_as_pdf' : 'description' }}</mat-icon>
                  }
                </span>
                <span class="receipt-main">
                  <span class="receipt-shop">{{ receipt.vendorName || receipt.originalFilename }}</span>
                  <span class="receipt-date">{{ receipt.purchaseDate ? dateText(receipt.purchaseDate) : 'No date yet' }}</span>
                  @if (receipt.duplicateOf.length > 0) {
                    <span class="duplicate">
                      <mat-icon aria-hidden="true">content_copy</mat-icon>
                      Possible duplicate: another receipt has the same shop, date and total, or the same file.
                    </span>
                  }
                </span>
                <span class="receipt-side">
                  <span class="receipt-total tabular">{{ receipt.total ? (receipt.total | money: currency() : locale()) : 'No total yet' }}</span>
                  <span class="state" [class]="'state state-' + receipt.state">
                    <mat-icon aria-hidden="true">{{ stateIcons[receipt.state] }}</mat-icon>
                    {{ stateLabels[receipt.state] }}@if (receipt.state === 'reading') {
                      {{ ' ' + receipt.readingProgress }}%
                    }
                  </span>
                </span>
              </a>
            </li>
          }
        </ul>
      }
    </div>
  `,
  styles: `
    .page-header {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px 16px;
    }
    .add {
      padding: 16px;
      margin-bottom: 16px;
      border-radius: 16px;
      background: var(--mat-sys-surface-container-low);
      border: 1px solid var(--mat-sys-outline-variant);
    }
    .add-actions {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: center;
    }
    .add-main,
    .add-files {
      display: inline-flex;
      align-items: center;
      gap: 8px;
      min-height: 48px;
      padding: 0 20px;
      border-radius: 24px;
      cursor: pointer;
      font: var(--mat-sys-label-large);
    }
    .add-main {
      background: var(--th-brass);
      color: var(--th-on-brass);
      font-size: 1.1rem;
      min-height: 56px;
      padding: 0 28px;
    }
    .add-files {
      border: 1px solid var(--mat-sys-outline);
      color: var(--mat-sys-primary);
    }
    input[type='file']:focus-visible + label {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .add-hint {
      margin: 8px 0 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .uploads {
      list-style: none;
      padding: 0;
      margin: 12px 0 0;
      display: grid;
      gap: 8px;
    }
    .upload {
      display: grid;
      grid-template-columns: minmax(0, 1fr) minmax(120px, 2fr) auto;
      gap: 8px 12px;
      align-items: center;
    }
    .upload.refused {
      grid-template-columns: minmax(0, 1fr) minmax(0, 3fr);
    }
    .upload-name {
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
    }
    .upload-done,
    .upload-refused,
    .duplicate,
    .state {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    .upload-refused {
      color: var(--mat-sys-error);
    }
    .filters {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      margin-bottom: 12px;
    }
    .filters mat-form-field {
      flex: 0 1 170px;
    }
    .filter-duplicates {
      align-self: center;
    }
    .filters .filter-vendor {
      flex: 1 1 160px;
    }
    .filters .filter-date {
      flex: 0 1 150px;
    }
    .receipts {
      list-style: none;
      padding: 0;
      margin: 0;
      display: grid;
      gap: 8px;
    }
    .receipt {
      display: flex;
      gap: 12px;
      align-items: center;
      padding: 8px 12px;
      border-radius: 12px;
      border: 1px solid var(--mat-sys-outline-variant);
      color: inherit;
      text-decoration: none;
    }
    .receipt:hover {
      background: var(--mat-sys-surface-container-low);
    }
    .receipt:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .thumb {
      flex: 0 0 56px;
      height: 72px;
      display: flex;
      align-items: center;
      justify-content: center;
      overflow: hidden;
      border-radius: 8px;
      background: var(--mat-sys-surface-container-high);
    }
    .thumb img {
      width: 100%;
      height: 100%;
      object-fit: cover;
      object-position: top;
    }
    .receipt-main,
    .receipt-side {
      display: flex;
      flex-direction: column;
      gap: 2px;
    }
    .receipt-main {
      flex: 1;
      min-width: 0;
    }
    .receipt-side {
      align-items: flex-end;
      text-align: right;
    }
    .receipt-shop {
      font: var(--mat-sys-title-medium);
    }
    .receipt-date {
      color: var(--mat-sys-on-surface-variant);
    }
    .duplicate {
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-small);
    }
    .state {
      font: var(--mat-sys-label-medium);
    }
    .state mat-icon,
    .duplicate mat-icon {
      width: 18px;
      height: 18px;
      font-size: 18px;
    }
    .state-to_check {
      color: var(--mat-sys-primary);
    }
    .state-failed {
      color: var(--mat-sys-error);
    }
    .no-match {
      padding: 16px 0;
    }
  `,
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
