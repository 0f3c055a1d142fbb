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
  templateUrl: './build-list.html',
  styleUrl: './build-list.css',
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
