// Calls to /api/auth: who is signed in, sign-up, sign-in, sign-out and password reset.
import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  MeResponse,
  ResetConfirmRequest,
  ResetRequest,
  SignInRequest,
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

  signUp(request: SignUpRequest): Observable<SignedInResponse> {
    return this.http.post<SignedInResponse>('/api/auth/sign-up', request);
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
