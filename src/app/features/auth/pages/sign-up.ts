// /sign-up: name, e-mail and password; with ?invite=TOKEN it joins that build at the same time.
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import { signUpRequest } from '../../../../../shared/api/auth';
import { safeReturnTo } from '../../../core/auth/return-to';
import { Session } from '../../../core/auth/session';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { BuildsApi } from '../../builds/services/builds-api';
import { AuthApi, SignedInResponse } from '../../../core/auth/auth-api';

@Component({
  selector: 'th-sign-up',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (submitting()) {
      <mat-progress-bar mode="indeterminate" aria-label="Creating your account" />
    }
    <div class="page-narrow">
      <h1 class="page-heading">Create an account</h1>
      @if (invite()) {
        <p class="notice" role="status">Once your account exists you join the build you were invited to.</p>
      }
      <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field class="full-width" subscriptSizing="dynamic">
          <mat-label>Your name</mat-label>
          <input matInput formControlName="displayName" autocomplete="name" />
          <mat-hint>Shown to the people you build with.</mat-hint>
          <mat-error>{{ errorOf(form.controls.displayName) }}</mat-error>
        </mat-form-field>
        <mat-form-field class="full-width" subscriptSizing="dynamic">
          <mat-label>E-mail</mat-label>
          <input matInput formControlName="email" type="email" autocomplete="email" />
          <mat-error>{{ errorOf(form.controls.email) }}</mat-error>
        </mat-form-field>
        <mat-form-field class="full-width" subscriptSizing="dynamic">
          <mat-label>Password</mat-label>
          <input matInput formControlName="password" type="password" autocomplete="new-password" />
          <mat-hint>At least 10 characters.</mat-hint>
          <mat-error>{{ errorOf(form.controls.password) }}</mat-error>
        </mat-form-field>
        <div class="form-actions">
          <button mat-flat-button class="cta" type="submit" [disabled]="submitting()">Create account</button>
        </div>
      </form>
      <div class="form-links">
        <a routerLink="/sign-in" [queryParams]="invite() ? { returnTo: '/invites/' + invite() } : {}">I already have an account</a>
      </div>
    </div>
  `,
})
export class SignUp {
  private readonly authApi = inject(AuthApi);
  private readonly buildsApi = inject(BuildsApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** Query parameters, bound by the router. */
  readonly invite = input<string>();
  readonly returnTo = input<string>();

  protected readonly errorOf = errorOf;
  protected readonly submitting = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    displayName: '',
    email: '',
    password: '',
  });

  protected submit(): void {
    const inviteToken = this.invite() || undefined;
    const request = validateWith(this.form, signUpRequest, { ...this.form.getRawValue(), inviteToken });
    if (!request || this.submitting()) return;
    this.submitting.set(true);
    this.authApi.signUp(request).subscribe({
      next: (response) => {
        this.session.setUser(response.user);
        if (inviteToken) {
          this.goToJoinedBuild(response);
        } else {
          this.submitting.set(false);
          void this.router.navigateByUrl(safeReturnTo(this.returnTo()));
        }
      },
      error: (error: unknown) => {
        applyFieldErrors(this.form, toApiError(error).fields);
        this.submitting.set(false);
      },
    });
  }

  /** The build just joined: from the answer when the server names it, else the new account's only build. */
  private goToJoinedBuild(response: SignedInResponse): void {
    const buildId$ = response.buildId
      ? of(response.buildId)
      : this.buildsApi.list().pipe(
          map((builds) => (builds.length === 1 ? builds[0].id : null)),
          catchError(() => of(null)),
        );
    buildId$.subscribe((buildId) => {
      this.submitting.set(false);
      void this.router.navigateByUrl(buildId ? `/builds/${buildId}` : '/builds');
    });
  }
}
