// /sign-in: e-mail and password, then back to where the person was going.
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { signInRequest } from '../../../../../shared/api/auth';
import { safeReturnTo } from '../../../core/auth/return-to';
import { Session } from '../../../core/auth/session';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { AuthApi } from '../../../core/auth/auth-api';

const notices: Record<string, string> = {
  'password-set': 'Your new password is set. Sign in with it.',
};

@Component({
  selector: 'th-sign-in',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sign-in.html',
})
export class SignIn {
  private readonly authApi = inject(AuthApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** Query parameters, bound by the router. */
  readonly returnTo = input<string>();
  readonly notice = input<string>();

  protected readonly errorOf = errorOf;
  protected readonly submitting = signal(false);
  protected readonly noticeText = computed(() => notices[this.notice() ?? ''] ?? '');
  /** Someone following an invite link who has no account yet should land on sign-up with the invite. */
  protected readonly signUpLink = computed(() => {
    const invite = /^\/invites\/([^/?#]+)$/.exec(this.returnTo() ?? '');
    return invite ? { path: '/sign-up', query: { invite: invite[1] } } : { path: '/sign-up', query: {} };
  });

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: '',
    password: '',
  });

  protected submit(): void {
    const request = validateWith(this.form, signInRequest, this.form.getRawValue());
    if (!request || this.submitting()) return;
    this.submitting.set(true);
    this.authApi.signIn(request).subscribe({
      next: (response) => {
        this.session.setUser(response.user);
        this.submitting.set(false);
        void this.router.navigateByUrl(safeReturnTo(this.returnTo()));
      },
      error: (error: unknown) => {
        applyFieldErrors(this.form, toApiError(error).fields);
        this.submitting.set(false);
      },
    });
  }
}
