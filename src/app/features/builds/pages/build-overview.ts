// /builds/:buildId: the build at a glance (money, what needs attention, or first steps when it is new), what the build is,
// the person's role on it, and for the owner edit, archive and restore.
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { Observable, Subscription, catchError, filter, forkJoin, of, switchMap } from 'rxjs';
import type { LedgerDto } from '../../../../../shared/api/ledger';
import type { SystemsResponse } from '../../../../../shared/api/parts';
import type { CoreDto, ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import { BUILD_STATUS_LABELS, ROLE_LABELS } from '../../../../../shared/enums';
import { confirmAction } from '../../../ui/confirm-dialog';
import { formatCalendarDate } from '../../../ui/dates';
import { LedgerApi } from '../../ledger/services/ledger-api';
import { SystemsApi } from '../../parts/services/systems-api';
import { ReceiptsApi } from '../../receipts/services/receipts-api';
import { ReviewApi } from '../../review/services/review-api';
import { AttentionList } from '../components/attention-list';
import { FirstSteps } from '../components/first-steps';
import { MoneyGlance } from '../components/money-glance';
import { attentionItems, todayIso } from '../models/at-a-glance';
import { currencyName } from '../models/currencies';
import { BuildsApi } from '../services/builds-api';
import { CurrentBuild } from '../services/current-build';

/** What the overview loaded; a source that failed is null (the interceptor has told the person why). */
interface Glance {
  ledger: LedgerDto | null;
  receipts: ReceiptSummaryDto[] | null;
  reviewQueue: ReceiptSummaryDto[] | null;
  cores: CoreDto[] | null;
  systems: SystemsResponse | null;
}

@Component({
  selector: 'th-build-overview',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, AttentionList, FirstSteps, MoneyGlance],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './build-overview.html',
  styleUrl: './build-overview.css',
})
export class BuildOverview {
  protected readonly current = inject(CurrentBuild);
  private readonly buildsApi = inject(BuildsApi);
  private readonly ledgerApi = inject(LedgerApi);
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly reviewApi = inject(ReviewApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly statusLabels = BUILD_STATUS_LABELS;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly currencyName = currencyName;
  protected readonly formatDate = formatCalendarDate;
  protected readonly isOwner = computed(() => this.current.build()?.role === 'owner');
  protected readonly busy = signal(false);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly loading = signal(false);
  protected readonly glance = signal<Glance | null>(null);
  private loadingGlance: Subscription | null = null;

  /** Nothing planned and nothing bought: first steps say more than a page of zeros. */
  protected readonly isNew = computed(() => {
    const glance = this.glance();
    if (!glance?.receipts || !glance.systems) return false;
    return glance.receipts.length === 0 && glance.systems.systems.every((system) => system.partCount === 0);
  });
  protected readonly complete = computed(() => {
    const glance = this.glance();
    return !!glance && !!glance.ledger && !!glance.receipts && !!glance.reviewQueue && !!glance.cores;
  });
  protected readonly attention = computed(() => {
    const glance = this.glance();
    const role = this.current.build()?.role;
    if (!glance || !role) return [];
    return attentionItems({
      role,
      receipts: glance.receipts ?? [],
      reviewQueue: glance.reviewQueue ?? [],
      cores: glance.cores ?? [],
      ledger: glance.ledger,
      today: todayIso(),
    });
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
    this.destroyRef.onDestroy(() => this.loadingGlance?.unsubscribe());
  }

  /** Every source at once; one that fails leaves the others on screen rather than blanking the page. */
  private load(buildId: string): void {
    const orNull = <T>(source: Observable<T>) => source.pipe(catchError(() => of(null)));
    this.loadingGlance?.unsubscribe();
    this.loading.set(true);
    this.loadingGlance = forkJoin({
      ledger: orNull(this.ledgerApi.ledger(buildId)),
      receipts: orNull(this.receiptsApi.list(buildId)),
      reviewQueue: orNull(this.reviewApi.queue(buildId)),
      cores: orNull(this.receiptsApi.cores(buildId)),
      systems: orNull(this.systemsApi.list(buildId, true)),
    }).subscribe((glance) => {
      this.glance.set(glance);
      this.loading.set(false);
    });
  }

  protected archive(): void {
    const build = this.current.build();
    if (!build) return;
    confirmAction(this.dialog, {
      title: 'Archive this build?',
      message:
        'It leaves your list of builds and nothing in it is deleted. Find it again with "Show archived" and restore it whenever you like.',
      confirmLabel: 'Archive build',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.busy.set(true);
          return this.buildsApi.archive(build.id);
        }),
      )
      .subscribe({
        next: () => {
          this.busy.set(false);
          this.current.set({ ...build, archived: true });
          this.snackBar.open(`${build.name} is archived.`, 'Dismiss', { duration: 6000 });
        },
        error: () => this.busy.set(false),
      });
  }

  protected restore(): void {
    const build = this.current.build();
    if (!build) return;
    this.busy.set(true);
    this.buildsApi.restore(build.id).subscribe({
      next: (restored) => {
        this.busy.set(false);
        this.current.set(restored);
        this.snackBar.open(`${restored.name} is back in your builds.`, 'Dismiss', { duration: 6000 });
      },
      error: () => this.busy.set(false),
    });
  }
}
