// /builds/:buildId/cores: core deposits with their due dates and returns (can still go back, awaiting a refund, refunded),
// each moved on in one click; overdue deposits and closing return windows marked.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { NgTemplateOutlet } from '@angular/common';
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
    { state: 'owed', label: 'Undo handing in', icon: 'undo' },
  ],
  refunded: [{ state: 'dropped_off', label: 'Undo refund', icon: 'undo' }],
  forfeited: [{ state: 'owed', label: 'Undo deposit lost', icon: 'undo' }],
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
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, NgTemplateOutlet, RouterLink, EmptyState, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './cores-page.html',
  styleUrl: './cores-page.css',
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

  /** Returnable lines split by the person's own calendar: the closed ones wait in a folded group below. */
  protected readonly openReturns = computed(() => (this.returns()?.returnable ?? []).filter((item) => this.daysLeft(item) >= 0));
  protected readonly closedReturns = computed(() => (this.returns()?.returnable ?? []).filter((item) => this.daysLeft(item) < 0));

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
