// /builds/:buildId/cores: core deposits with their due dates and returns (can still go back, awaiting a refund, refunded),
// each moved on in one click; overdue deposits and closing return windows marked.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { AwaitingRefundItemDto, CoreDto, ReturnableItemDto, ReturnsDto } from '../../../../../shared/api/receipts';
import { CORE_STATE_LABELS, CoreState, PART_STATUS_LABELS, type PartStatus } from '../../../../../shared/enums';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { CurrentBuild } from '../../builds/services/current-build';
import { PartsApi } from '../../parts/services/parts-api';
import { ReceiptsApi } from '../services/receipts-api';

/** The next steps a core can take from where it stands, as the buttons beside it. */
const NEXT_STATES: Record<CoreState, { state: CoreState; label: string; icon: string }[]> = {
  owed: [
    { state: 'dropped_off', label: 'Handed in the old part', icon: 'local_shipping' },
    { state: 'forfeited', label: 'Deposit lost', icon: 'money_off' },
  ],
  dropped_off: [
    { state: 'refunded', label: 'Deposit came back', icon: 'payments' },
    { state: 'owed', label: 'Not handed in after all', icon: 'undo' },
  ],
  refunded: [{ state: 'dropped_off', label: 'Refund not received', icon: 'undo' }],
  forfeited: [{ state: 'owed', label: 'Still can hand it in', icon: 'undo' }],
};

/** A return window this close to its end (in days) is marked as closing soon, as the alert mails do. */
export const CLOSING_SOON_DAYS = 7;

/** Whole calendar days from one ISO date to another (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

/** How long a return window has left, in words. */
export function windowText(daysLeft: number): string {
  if (daysLeft < 0) return daysLeft === -1 ? 'Window closed yesterday' : `Window closed ${-daysLeft} days ago`;
  if (daysLeft === 0) return 'Last day today';
  return daysLeft === 1 ? '1 day left' : `${daysLeft} days left`;
}

/** Today as YYYY-MM-DD in the person's own time zone, to compare with calendar due dates. */
export function todayIso(now = new Date()): string {
  const month = String(now.getMonth() + 1).padStart(2, '0');
  const day = String(now.getDate()).padStart(2, '0');
  return `${now.getFullYear()}-${month}-${day}`;
}

@Component({
  selector: 'th-cores-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, EmptyState, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (loading() || busy()) {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="loading() ? 'Loading the core deposits and returns' : 'Saving'" />
    }
    <div class="page">
      <h1 class="page-heading">Cores and returns</h1>
      <p class="intro">
        A core deposit is paid when you buy a rebuilt part; you get it back when you hand in the old part before its due date.
        A part you send back stays listed until the return slip with its refund is filed.
      </p>
      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }
      @if (loaded() && cores().length === 0) {
        <th-empty-state icon="autorenew" heading="No core deposits yet">
          <p>
            When a receipt has a core deposit line and you file it, the deposit shows here with its due date. Start on
            <a routerLink="../receipts">Receipts</a>.
          </p>
        </th-empty-state>
      } @else if (loaded()) {
        <ul class="cores" aria-label="Core deposits">
          @for (core of cores(); track core.id) {
            <li class="core">
              <div class="core-main">
                <span class="core-description">{{ titleOf(core) }}</span>
                <span class="core-shop">
                  <a [routerLink]="['../receipts', core.receiptId]">{{ core.vendorName || 'Receipt' }}</a>
                  {{ core.purchaseDate ? ' · bought ' + dateText(core.purchaseDate) : '' }}
                </span>
                <span class="core-due" [class.overdue]="isOverdue(core)">
                  @if (isOverdue(core)) {
                    <mat-icon aria-hidden="true">schedule</mat-icon> Overdue: was due {{ dateText(core.dueDate) }}
                  } @else {
                    Due back by {{ dateText(core.dueDate) }}
                  }
                </span>
              </div>
              <div class="core-side">
                <span class="tabular core-amount">{{ core.amount | money: currency() : locale() }}</span>
                <span class="core-state">{{ stateLabels[core.state] }}</span>
              </div>
              @if (canEdit()) {
                <div class="core-actions">
                  @for (next of nextStates[core.state]; track next.state) {
                    <button mat-stroked-button type="button" [disabled]="busy()" (click)="move(core, next.state)">
                      <mat-icon aria-hidden="true">{{ next.icon }}</mat-icon>
                      {{ next.label }}
                    </button>
                  }
                </div>
              }
            </li>
          }
        </ul>
      }

      <section class="returns" aria-labelledby="returns-heading">
        <h2 id="returns-heading" class="section-heading">Returns</h2>
        @if (returns(); as returns) {
          <h3 class="group-heading">Can still go back ({{ returns.returnable.length }})</h3>
          @if (returns.returnable.length === 0) {
            <p class="quiet">Nothing bought is within its return window now.</p>
          } @else {
            <ul class="cores" aria-label="Can still go back">
              @for (item of returns.returnable; track item.lineId) {
                <li class="core">
                  <div class="core-main">
                    <span class="core-description">{{ titleOf(item) }}</span>
                    <span class="core-shop">
                      <a [routerLink]="['../receipts', item.receiptId]">{{ item.vendorName || 'Receipt' }}</a>
                      · bought {{ dateText(item.purchaseDate) }}
                    </span>
                    <span class="core-due" [class.overdue]="daysLeft(item) < 0" [class.closing]="isClosingSoon(item)">
                      @if (daysLeft(item) < 0) {
                        <mat-icon aria-hidden="true">event_busy</mat-icon>
                        Could go back until {{ dateText(item.returnableUntil) }} · {{ windowWords(item) }}
                      } @else if (isClosingSoon(item)) {
                        <mat-icon aria-hidden="true">hourglass_bottom</mat-icon>
                        Closing soon: returnable until {{ dateText(item.returnableUntil) }} · {{ windowWords(item) }}
                      } @else {
                        Returnable until {{ dateText(item.returnableUntil) }} · {{ windowWords(item) }}
                      }
                    </span>
                  </div>
                  <div class="core-side">
                    <span class="tabular core-amount">{{ item.amountPaid | money: currency() : locale() }}</span>
                    <span class="core-state">{{ partStatusLabel(item.partStatus) }}</span>
                  </div>
                  @if (canEdit()) {
                    <div class="core-actions">
                      <button mat-stroked-button type="button" [disabled]="busy()" (click)="setPartStatus(item, 'returned')">
                        <mat-icon aria-hidden="true">assignment_return</mat-icon>
                        Sent back
                      </button>
                    </div>
                  }
                </li>
              }
            </ul>
          }

          <h3 class="group-heading">Sent back, refund not filed yet ({{ returns.awaitingRefund.length }})</h3>
          @if (returns.awaitingRefund.length === 0) {
            <p class="quiet">Nothing sent back is waiting for its refund.</p>
          } @else {
            <ul class="cores" aria-label="Sent back, refund not filed yet">
              @for (item of returns.awaitingRefund; track item.lineId) {
                <li class="core">
                  <div class="core-main">
                    <span class="core-description">{{ titleOf(item) }}</span>
                    <span class="core-shop">
                      <a [routerLink]="['../receipts', item.receiptId]">{{ item.vendorName || 'Receipt' }}</a>
                      · bought {{ dateText(item.purchaseDate) }}
                    </span>
                    <span class="core-shop">The refund is recorded when its return slip is filed.</span>
                  </div>
                  <div class="core-side">
                    <span class="tabular core-amount">{{ item.amountPaid | money: currency() : locale() }}</span>
                    <span class="core-state">Owed back</span>
                  </div>
                  @if (canEdit()) {
                    <div class="core-actions">
                      <a mat-flat-button routerLink="../receipts">
                        <mat-icon aria-hidden="true">upload_file</mat-icon>
                        Upload the return slip
                      </a>
                      <button mat-stroked-button type="button" [disabled]="busy()" (click)="setPartStatus(item, 'on_hand')">
                        <mat-icon aria-hidden="true">undo</mat-icon>
                        Keep it after all
                      </button>
                    </div>
                  }
                </li>
              }
            </ul>
          }

          <details class="refunded">
            <summary class="group-heading">Refunded ({{ returns.refunded.length }})</summary>
            @if (returns.refunded.length === 0) {
              <p class="quiet">No refunds filed yet.</p>
            } @else {
              <ul class="cores" aria-label="Refunded">
                @for (item of returns.refunded; track item.lineId) {
                  <li class="core">
                    <div class="core-main">
                      <span class="core-description">{{ titleOf(item) }}</span>
                      <span class="core-shop">
                        <a [routerLink]="['../receipts', item.receiptId]">{{ item.vendorName || 'Receipt' }}</a>
                        · bought {{ dateText(item.purchaseDate) }} for {{ item.amountPaid | money: currency() : locale() }}
                      </span>
                      <span class="core-shop">
                        <a [routerLink]="['../receipts', item.refundReceiptId]">Return slip</a>
                        {{ item.refundDate ? 'of ' + dateText(item.refundDate) : '' }}
                      </span>
                    </div>
                    <div class="core-side">
                      <span class="tabular core-amount">{{ item.refundedAmount | money: currency() : locale() }}</span>
                      <span class="core-state">Refunded</span>
                    </div>
                  </li>
                }
              </ul>
            }
          </details>
        }
      </section>
    </div>
  `,
  styles: `
    .intro {
      color: var(--mat-sys-on-surface-variant);
      max-width: 70ch;
    }
    .cores {
      list-style: none;
      padding: 0;
      margin: 0;
      display: grid;
      gap: 8px;
    }
    .core {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      padding: 12px;
      border-radius: 12px;
      border: 1px solid var(--mat-sys-outline-variant);
    }
    .core-main {
      flex: 1 1 260px;
      display: flex;
      flex-direction: column;
      gap: 2px;
    }
    .core-description {
      font: var(--mat-sys-title-medium);
    }
    .core-shop,
    .core-due {
      color: var(--mat-sys-on-surface-variant);
    }
    .core-due {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    .core-due.overdue {
      color: var(--mat-sys-error);
      font-weight: 600;
    }
    .core-side {
      display: flex;
      flex-direction: column;
      align-items: flex-end;
    }
    .core-amount {
      font: var(--mat-sys-title-medium);
    }
    .core-due.closing {
      color: var(--mat-sys-on-surface);
      font-weight: 600;
    }
    .returns {
      margin-top: 32px;
    }
    .section-heading {
      font: var(--mat-sys-headline-small);
      margin: 0 0 8px;
    }
    .group-heading {
      font: var(--mat-sys-title-medium);
      margin: 20px 0 8px;
    }
    .refunded summary {
      cursor: pointer;
    }
    .quiet {
      color: var(--mat-sys-on-surface-variant);
      margin: 0;
    }
    .core-actions {
      flex: 1 1 100%;
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
  `,
})
export class CoresPage {
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly partsApi = inject(PartsApi);
  protected readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly stateLabels = CORE_STATE_LABELS;
  protected readonly nextStates = NEXT_STATES;
  protected readonly cores = signal<CoreDto[]>([]);
  protected readonly returns = signal<ReturnsDto | null>(null);
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  private readonly today = todayIso();

  protected readonly currency = computed(() => this.current.build()?.currency ?? '');
  protected readonly locale = computed(() => this.current.build()?.locale ?? 'en-US');
  protected readonly canEdit = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'crew';
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => {
        this.load(buildId);
        this.loadReturns(buildId);
      });
    });
  }

  /** Only a deposit still owed can be late; ISO dates compare as text. */
  protected isOverdue(core: CoreDto): boolean {
    return core.state === 'owed' && core.dueDate < this.today;
  }

  protected daysLeft(item: ReturnableItemDto): number {
    return daysBetween(this.today, item.returnableUntil);
  }

  protected isClosingSoon(item: ReturnableItemDto): boolean {
    const days = this.daysLeft(item);
    return days >= 0 && days <= CLOSING_SOON_DAYS;
  }

  protected windowWords(item: ReturnableItemDto): string {
    return windowText(this.daysLeft(item));
  }

  protected partStatusLabel(status: PartStatus): string {
    return PART_STATUS_LABELS[status];
  }

  /** One click on a return: the part's status with the version last seen; a stale version reloads the list. */
  protected setPartStatus(item: ReturnableItemDto | AwaitingRefundItemDto, status: PartStatus): void {
    this.busy.set(true);
    this.problem.set('');
    this.partsApi.update(this.buildId(), item.partId, { status, version: item.partVersion }).subscribe({
      next: () => {
        this.busy.set(false);
        this.loadReturns(this.buildId());
      },
      error: (error: unknown) => {
        const problem = toApiError(error);
        this.problem.set(
          problem.status === 409
            ? `Someone else changed "${item.description}" in the meantime. The list is reloaded: check it and try again.`
            : problem.message,
        );
        this.busy.set(false);
        this.loadReturns(this.buildId());
      },
    });
  }

  /** A core's or a returned line's heading: what it is, and its part number when it has one. */
  protected titleOf(item: { description: string; partNumber: string }): string {
    return item.partNumber ? `${item.description} · ${item.partNumber}` : item.description;
  }

  protected dateText(value: string): string {
    return formatCalendarDate(value, this.locale());
  }

  protected move(core: CoreDto, state: CoreState): void {
    this.busy.set(true);
    this.problem.set('');
    this.receiptsApi.updateCore(this.buildId(), core.id, { state, version: core.version }).subscribe({
      next: (saved) => {
        this.cores.update((cores) => cores.map((candidate) => (candidate.id === saved.id ? saved : candidate)));
        this.busy.set(false);
      },
      error: (error: unknown) => {
        this.problem.set(toApiError(error).message);
        this.busy.set(false);
        this.load(this.buildId());
      },
    });
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.receiptsApi.cores(buildId).subscribe({
      next: (cores) => {
        this.cores.set(cores);
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
  }

  private loadReturns(buildId: string): void {
    this.receiptsApi.returns(buildId).subscribe({
      next: (returns) => this.returns.set(returns),
      error: (error: unknown) => this.problem.set(toApiError(error).message),
    });
  }
}
