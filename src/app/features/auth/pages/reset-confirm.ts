// /reset-password/:token: sets a new password from the e-mailed link, then on to sign in.
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { resetConfirmRequest } from '../../../../../shared/api/auth';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { AuthApi } from '../../../core/auth/auth-api';

@Component({
  selector: 'th-reset-confirm',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './reset-confirm.html',
})
export class ResetConfirm {
  private readonly authApi = inject(AuthApi);
  private readonly router = inject(Router);

  /** Route parameter, bound by the router. */
  readonly token = input.required<string>();

  protected readonly errorOf = errorOf;
  protected readonly submitting = signal(false);
  protected readonly linkProblem = signal('');
  protected readonly form = inject(NonNullableFormBuilder).group({ password: '' });

  protected submit(): void {
    this.linkProblem.set('');
    const request = validateWith(this.form, resetConfirmRequest, { token: this.token(), password: this.form.controls.password.value });
    if (!request) {
      // The token is not a field the person can fix: say what to do instead.
      if (!resetConfirmRequest.shape.token.safeParse(this.token()).success) {
        this.linkProblem.set('This reset link is incomplete. Copy the whole link from the e-mail, or ask for a new one.');
      }
      return;
    }
    if (this.submitting()) return;
    this.submitting.set(true);
    this.authApi.confirmPasswordReset(request).subscribe({
      next: () => {
        this.submitting.set(false);
        void this.router.navigate(['/sign-in'], { queryParams: { notice: 'password-set' } });
      },
      error: (error: unknown) => {
        const apiError = toApiError(error);
        const unmatched = applyFieldErrors(this.form, apiError.fields);
        if (apiError.fields['token'] || unmatched.length) {
          this.linkProblem.set(apiError.fields['token'] ?? unmatched.join(' '));
        }
        this.submitting.set(false);
      },
    });
  }
}
