// /builds: the builds the person belongs to, one card each, with a way to start a new one.
import { ChangeDetectionStrategy, Component, effect, inject, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import type { BuildDto } from '../../../../../shared/api/builds';
import { BUILD_STATUS_LABELS, ROLE_LABELS } from '../../../../../shared/enums';
import { EmptyState } from '../../../ui/empty-state';
import { BuildsApi } from '../services/builds-api';

@Component({
  selector: 'th-build-list',
  imports: [MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule, MatSlideToggleModule, RouterLink, EmptyState],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading your builds" />
    }
    <div class="page">
      <div class="list-header">
        <h1 class="page-heading">Your builds</h1>
        <a mat-flat-button class="cta" routerLink="/builds/new">
          <mat-icon aria-hidden="true">add</mat-icon>
          New build
        </a>
      </div>
      <mat-slide-toggle [checked]="showArchived()" (change)="showArchived.set($event.checked)">Show archived</mat-slide-toggle>

      @if (loaded() && builds().length === 0) {
        <th-empty-state class="empty" icon="garage" [heading]="showArchived() ? 'No builds here yet' : 'No builds yet'">
          <p>
            Start with the car you are working on: create a build, give it the vehicle and the currency you pay in,
            then invite the people who help or check the spending.
          </p>
          <a mat-flat-button class="cta" emptyStateActions routerLink="/builds/new">New build</a>
        </th-empty-state>
      } @else {
        <ul class="cards">
          @for (build of builds(); track build.id) {
            <li>
              <mat-card appearance="outlined" class="build-card">
                <mat-card-header>
                  <mat-icon mat-card-avatar aria-hidden="true" class="card-icon">directions_car</mat-icon>
                  <mat-card-title>
                    <h2 class="card-title"><a [routerLink]="['/builds', build.id]">{{ build.name }}</a></h2>
                  </mat-card-title>
                  <mat-card-subtitle>{{ build.vehicle || 'Vehicle not described yet' }}</mat-card-subtitle>
                </mat-card-header>
                <mat-card-content>
                  <dl class="facts">
                    <div><dt>Status</dt><dd>{{ statusLabel(build) }}</dd></div>
                    <div><dt>Your role</dt><dd>{{ roleLabels[build.role] }}</dd></div>
                    <div><dt>Currency</dt><dd>{{ build.currency }}</dd></div>
                  </dl>
                  @if (build.archived) {
                    <p class="archived"><mat-icon aria-hidden="true" inline>inventory_2</mat-icon> Archived</p>
                  }
                </mat-card-content>
              </mat-card>
            </li>
          }
        </ul>
      }
    </div>
  `,
  styles: `
    .list-header {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px 16px;
    }
    .empty {
      margin-top: 24px;
    }
    .cards {
      list-style: none;
      margin: 16px 0 0;
      padding: 0;
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(280px, 1fr));
      gap: 16px;
    }
    .build-card {
      height: 100%;
    }
    .card-icon {
      color: var(--mat-sys-primary);
      font-size: 32px;
      width: 40px;
      height: 40px;
    }
    .card-title {
      font: inherit;
      margin: 0;
    }
    .card-title a {
      color: inherit;
    }
    .facts {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 24px;
      margin: 12px 0 0;
    }
    .facts dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .facts dd {
      margin: 0;
    }
    .archived {
      display: flex;
      align-items: center;
      gap: 4px;
      margin: 12px 0 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class BuildList {
  private readonly buildsApi = inject(BuildsApi);

  protected readonly roleLabels = ROLE_LABELS;
  protected readonly showArchived = signal(false);
  protected readonly builds = signal<BuildDto[]>([]);
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);

  constructor() {
    effect(() => {
      const includeArchived = this.showArchived();
      untracked(() => this.load(includeArchived));
    });
  }

  protected statusLabel(build: BuildDto): string {
    return BUILD_STATUS_LABELS[build.status];
  }

  private load(includeArchived: boolean): void {
    this.loading.set(true);
    this.buildsApi.list(includeArchived).subscribe({
      next: (builds) => {
        this.builds.set(builds);
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
  }
}
