// /builds/:buildId/cores: core deposits with their due dates, one click to record where each stands, overdue ones marked.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { CoreDto } from '../../../../../shared/api/receipts';
import { CORE_STATE_LABELS, CoreState } from '../../../../../shared/enums';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { CurrentBuild } from '../../builds/services/current-build';
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
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="loading() ? 'Loading the core deposits' : 'Saving'" />
    }
    <div class="page">
      <h1 class="page-heading">Cores and returns</h1>
      <p class="intro">
        A core deposit is paid when you buy a rebuilt part; you get it back when you hand in the old part before its due date.
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
                <span class="core-description">{{ core.description }}{{ core.partNumber ? ' · ' + core.partNumber : '' }}</span>
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
  protected readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly stateLabels = CORE_STATE_LABELS;
  protected readonly nextStates = NEXT_STATES;
  protected readonly cores = signal<CoreDto[]>([]);
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
      untracked(() => this.load(buildId));
    });
  }

  /** Only a deposit still owed can be late; ISO dates compare as text. */
  protected isOverdue(core: CoreDto): boolean {
    return core.state === 'owed' && core.dueDate < this.today;
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
}
