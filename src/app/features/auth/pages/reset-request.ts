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
  template: `
    @if (submitting()) {
      <mat-progress-bar mode="indeterminate" aria-label="Sending" />
    }
    <div class="page-narrow">
      <h1 class="page-heading">Reset your password</h1>
      @if (sent()) {
        <p class="notice" role="status">If an account exists for that address, a link is on its way.</p>
        <p>The link works for a limited time. Check your spam folder if nothing arrives within a few minutes.</p>
      } @else {
        <p>Enter the e-mail address you sign in with and we will send a link to set a new password.</p>
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <mat-form-field class="full-width" subscriptSizing="dynamic">
            <mat-label>E-mail</mat-label>
            <input matInput formControlName="email" type="email" autocomplete="email" />
            <mat-error>{{ errorOf(form.controls.email) }}</mat-error>
          </mat-form-field>
          <div class="form-actions">
            <button mat-flat-button class="cta" type="submit" [disabled]="submitting()">Send reset link</button>
          </div>
        </form>
      }
      <div class="form-links">
        <a routerLink="/sign-in">Back to sign in</a>
      </div>
    </div>
  `,
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
