// Calls to /api/auth: who is signed in, sign-up and its mailed link, sign-in, sign-out and password reset.
import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  MeResponse,
  ResetConfirmRequest,
  ResetRequest,
  SignInRequest,
  SignUpConfirmRequest,
  SignUpMailedResponse,
  SignUpRequest,
  UserDto,
} from '../../../../shared/api/auth';

export interface SignedInResponse {
  user: UserDto;
  /** Present when sign-up accepted an invite: the build just joined. */
  buildId?: string;
}

@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  me(): Observable<MeResponse> {
    return this.http.get<MeResponse>('/api/auth/me');
  }

  /** Signed in at once with an invite for its own address; otherwise "check your mail" (202), whatever the address. */
  signUp(request: SignUpRequest): Observable<SignedInResponse | SignUpMailedResponse> {
    return this.http.post<SignedInResponse | SignUpMailedResponse>('/api/auth/sign-up', request);
  }

  /** The mailed link's token: makes the account and signs it in. */
  confirmSignUp(request: SignUpConfirmRequest): Observable<SignedInResponse> {
    return this.http.post<SignedInResponse>('/api/auth/sign-up/confirm', request);
  }

  signIn(request: SignInRequest): Observable<SignedInResponse> {
    return this.http.post<SignedInResponse>('/api/auth/sign-in', request);
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/sign-out', null);
  }

  requestPasswordReset(request: ResetRequest): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset', request);
  }

  confirmPasswordReset(request: ResetConfirmRequest): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset/confirm', request);
  }
}
