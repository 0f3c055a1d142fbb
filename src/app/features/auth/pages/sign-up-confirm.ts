// /sign-up/confirm/:token: the link mailed after sign-up; sends its token at once, which makes the account and signs
// it in, then opens the builds.
import { ChangeDetectionStrategy, Component, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { signUpConfirmRequest } from '../../../../../shared/api/auth';
import { AuthApi } from '../../../core/auth/auth-api';
import { Session } from '../../../core/auth/session';
import { toApiError } from '../../../core/http/api-error';

@Component({
  selector: 'th-sign-up-confirm',
  imports: [MatButtonModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sign-up-confirm.html',
  styleUrl: './sign-up-confirm.css',
})
export class SignUpConfirm {
  private readonly authApi = inject(AuthApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** Route parameter, bound by the router. */
  readonly token = input.required<string>();

  protected readonly working = signal(false);
  protected readonly problem = signal('');

  constructor() {
    effect(() => {
      const token = this.token();
      untracked(() => this.confirm(token));
    });
  }

  private confirm(token: string): void {
    const checked = signUpConfirmRequest.safeParse({ token });
    if (!checked.success) {
      this.problem.set('This link is incomplete. Copy the whole link from the e-mail, or sign up again for a new one.');
      return;
    }
    this.working.set(true);
    this.problem.set('');
    this.authApi.confirmSignUp(checked.data).subscribe({
      next: ({ user }) => {
        this.session.setUser(user);
        this.working.set(false);
        void this.router.navigateByUrl('/builds');
      },
      error: (error: unknown) => {
        const apiError = toApiError(error);
        this.problem.set(apiError.fields['token'] ?? apiError.message);
        this.working.set(false);
      },
    });
  }
}
