// /invites/:token (public): what the invite offers, and joining, signing in or creating an account to take it.
import { ChangeDetectionStrategy, Component, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { InvitePreviewDto } from '../../../../../shared/api/builds';
import { ROLE_LABELS } from '../../../../../shared/enums';
import { Session } from '../../../core/auth/session';
import { toApiError } from '../../../core/http/api-error';
import { CrewApi } from '../services/crew-api';

@Component({
  selector: 'th-invite-accept',
  imports: [MatButtonModule, MatCardModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './invite-accept.html',
})
export class InviteAccept {
  private readonly crewApi = inject(CrewApi);
  private readonly router = inject(Router);
  protected readonly session = inject(Session);

  /** Route parameter, bound by the router. */
  readonly token = input.required<string>();

  protected readonly roleLabels = ROLE_LABELS;
  protected readonly invite = signal<InvitePreviewDto | null>(null);
  protected readonly problem = signal('');
  protected readonly loading = signal(false);
  protected readonly joining = signal(false);

  constructor() {
    effect(() => {
      const token = this.token();
      untracked(() => this.load(token));
    });
  }

  protected formatDay(timestamp: string): string {
    const date = new Date(timestamp);
    return Number.isNaN(date.getTime()) ? timestamp : new Intl.DateTimeFormat(undefined, { dateStyle: 'long' }).format(date);
  }

  protected join(): void {
    this.joining.set(true);
    this.crewApi.acceptInvite(this.token()).subscribe({
      next: ({ buildId }) => {
        this.joining.set(false);
        void this.router.navigate(['/builds', buildId]);
      },
      error: () => this.joining.set(false),
    });
  }

  private load(token: string): void {
    this.loading.set(true);
    // Whether the person is signed in decides which buttons show.
    void this.session.load();
    this.crewApi.previewInvite(token).subscribe({
      next: (invite) => {
        this.invite.set(invite);
        this.loading.set(false);
      },
      error: (error: unknown) => {
        const apiError = toApiError(error);
        this.problem.set(
          apiError.status === 404
            ? 'The link has expired, was withdrawn, or has already been used. Ask the build’s owner to send a new invite.'
            : apiError.message,
        );
        this.loading.set(false);
      },
    });
  }
}
