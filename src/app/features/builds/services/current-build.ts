// The build a build page is showing, shared by the section shell and its pages.
import { Injectable, inject, signal } from '@angular/core';
import type { BuildDto } from '../../../../../shared/api/builds';
import { toApiError } from '../../../core/http/api-error';
import { BuildsApi } from './builds-api';

@Injectable()
export class CurrentBuild {
  private readonly buildsApi = inject(BuildsApi);

  readonly build = signal<BuildDto | null>(null);
  readonly loading = signal(false);
  /** What went wrong loading it, in words for the page ("not found" included). */
  readonly problem = signal('');

  load(buildId: string): void {
    this.loading.set(true);
    this.problem.set('');
    this.buildsApi.get(buildId).subscribe({
      next: (build) => {
        this.build.set(build);
        this.loading.set(false);
      },
      error: (error: unknown) => {
        const apiError = toApiError(error);
        this.build.set(null);
        this.problem.set(
          apiError.status === 404
            ? 'This build does not exist, or you are not a member of it. Ask its owner for an invite if you think you should be.'
            : apiError.message,
        );
        this.loading.set(false);
      },
    });
  }

  set(build: BuildDto): void {
    this.build.set(build);
  }
}
