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
  template: `
    @if (loading() || busy()) {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="loading() ? 'Loading the build at a glance' : 'Saving'" />
    }
    @if (current.build(); as build) {
      <div class="page">
        <h1 class="page-heading">{{ build.name }}</h1>
        @if (build.archived) {
          <p class="notice" role="status">
            <mat-icon aria-hidden="true" inline>inventory_2</mat-icon>
            This build is archived: it is kept as it is and left out of your list of builds.
          </p>
        }
        @if (glance(); as glance) {
          @if (isNew()) {
            <section class="card" aria-labelledby="first-steps-heading">
              <th-first-steps [role]="build.role" />
            </section>
          } @else {
            <div class="glance">
              @if (glance.ledger; as ledger) {
                <section class="card" aria-labelledby="money-heading">
                  <th-money-glance [ledger]="ledger" [locale]="build.locale" [isOwner]="isOwner()" />
                </section>
              }
              <section class="card" aria-labelledby="attention-heading">
                <th-attention-list [items]="attention()" [role]="build.role" [currency]="build.currency" [locale]="build.locale" [complete]="complete()" />
              </section>
            </div>
          }
        }

        <h2 class="section-heading">Details</h2>
        <dl class="facts">
          <div class="vehicle"><dt>Vehicle</dt><dd>{{ build.vehicle || 'Not described yet' }}</dd></div>
          <div><dt>Status</dt><dd>{{ statusLabels[build.status] }}</dd></div>
          <div><dt>Start date</dt><dd class="tabular">{{ formatDate(build.startedOn, build.locale) }}</dd></div>
          <div><dt>Target date</dt><dd class="tabular">{{ formatDate(build.targetDate, build.locale) }}</dd></div>
          <div><dt>Currency</dt><dd>{{ build.currency }} · {{ currencyName(build.currency) }}</dd></div>
          <div><dt>Language and region</dt><dd>{{ build.locale }}</dd></div>
          <div><dt>Your role</dt><dd>{{ roleLabels[build.role] }}</dd></div>
        </dl>

        @if (isOwner()) {
          <div class="form-actions">
            @if (build.archived) {
              <button mat-flat-button type="button" (click)="restore()" [disabled]="busy()">
                <mat-icon aria-hidden="true">unarchive</mat-icon>
                Restore build
              </button>
            } @else {
              <a mat-flat-button routerLink="edit">
                <mat-icon aria-hidden="true">edit</mat-icon>
                Edit build
              </a>
              <button mat-stroked-button type="button" (click)="archive()" [disabled]="busy()">
                <mat-icon aria-hidden="true">inventory_2</mat-icon>
                Archive build
              </button>
            }
          </div>
        }
      </div>
    }
  `,
  styles: `
    .glance {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(min(100%, 320px), 1fr));
      gap: 16px;
      align-items: start;
    }
    .card {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 16px;
      padding: 16px;
      background: var(--mat-sys-surface-container-low);
      min-width: 0;
    }
    .section-heading {
      font: var(--mat-sys-title-large);
      margin: 24px 0 12px;
    }
    .facts {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(min(100%, 160px), 1fr));
      gap: 16px 24px;
      margin: 0 0 24px;
    }
    /* The vehicle is a sentence, not a figure: it gets a row of its own. */
    .facts .vehicle {
      grid-column: 1 / -1;
    }
    .facts dt {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .facts dd {
      margin: 4px 0 0;
      font: var(--mat-sys-body-large);
    }
  `,
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
