// /reset-password: asks for an e-mail and answers the same whether or not an account uses it.
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { resetRequest } from '../../../../../shared/api/auth';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { AuthApi } from '../../../core/auth/auth-api';

@Component({
  selector: 'th-reset-request',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './reset-request.html',
})
export class ResetRequest {
  private readonly authApi = inject(AuthApi);

  protected readonly errorOf = errorOf;
  protected readonly submitting = signal(false);
  protected readonly sent = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: '' });

  protected submit(): void {
    const request = validateWith(this.form, resetRequest, this.form.getRawValue());
    if (!request || this.submitting()) return;
    this.submitting.set(true);
    this.authApi.requestPasswordReset(request).subscribe({
      next: () => {
        this.submitting.set(false);
        this.sent.set(true);
      },
      error: (error: unknown) => {
        applyFieldErrors(this.form, toApiError(error).fields);
        this.submitting.set(false);
      },
    });
  }
}
