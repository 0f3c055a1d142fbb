// /builds/:buildId: what the build is, the person's role on it, and for the owner edit, archive and restore.
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { filter, switchMap } from 'rxjs';
import { BUILD_STATUS_LABELS, ROLE_LABELS } from '../../../../../shared/enums';
import { confirmAction } from '../../../ui/confirm-dialog';
import { formatCalendarDate } from '../../../ui/dates';
import { currencyName } from '../models/currencies';
import { BuildsApi } from '../services/builds-api';
import { CurrentBuild } from '../services/current-build';

@Component({
  selector: 'th-build-overview',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (busy()) {
      <mat-progress-bar mode="indeterminate" aria-label="Saving" />
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
        <dl class="facts">
          <div><dt>Vehicle</dt><dd>{{ build.vehicle || 'Not described yet' }}</dd></div>
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
    .facts {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(200px, 1fr));
      gap: 16px 24px;
      margin: 0 0 24px;
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
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly statusLabels = BUILD_STATUS_LABELS;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly currencyName = currencyName;
  protected readonly formatDate = formatCalendarDate;
  protected readonly isOwner = computed(() => this.current.build()?.role === 'owner');
  protected readonly busy = signal(false);

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
