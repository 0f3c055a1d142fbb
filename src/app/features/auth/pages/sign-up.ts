// /sign-up: name, e-mail and password, then "check your mail" (the mailed link finishes it, see sign-up-confirm);
// with ?invite=TOKEN, for the address the invite was sent to, the account is made at once and joins that build.
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import { signUpRequest } from '../../../../../shared/api/auth';
import { Session } from '../../../core/auth/session';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { BuildsApi } from '../../builds/services/builds-api';
import { AuthApi, SignedInResponse } from '../../../core/auth/auth-api';

@Component({
  selector: 'th-sign-up',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sign-up.html',
  styleUrl: './sign-up.css',
})
export class SignUp {
  private readonly authApi = inject(AuthApi);
  private readonly buildsApi = inject(BuildsApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** Query parameter, bound by the router. */
  readonly invite = input<string>();

  protected readonly errorOf = errorOf;
  protected readonly submitting = signal(false);
  /** Set once the server has mailed the address: the page then says to check the mail. */
  protected readonly mailedTo = signal<string | null>(null);
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
        if ('user' in response) {
          // Only an invite for this very address signs in at once.
          this.session.setUser(response.user);
          this.goToJoinedBuild(response);
          return;
        }
        this.submitting.set(false);
        this.mailedTo.set(request.email.toLowerCase());
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
