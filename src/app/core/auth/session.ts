// The signed-in person, as a signal, loaded once from GET /api/auth/me.
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { UserDto } from '../../../../shared/api/auth';
import { AuthApi } from './auth-api';
import { forgetCachedAnswers } from '../offline/cached-answers';

@Injectable({ providedIn: 'root' })
export class Session {
  private readonly authApi = inject(AuthApi);
  private readonly currentUser = signal<UserDto | null>(null);
  private loading: Promise<UserDto | null> | null = null;

  readonly user = this.currentUser.asReadonly();
  readonly signedIn = computed(() => this.currentUser() !== null);

  /** Loads the user once; guards wait on it. A failed load counts as signed out and is retried next time. */
  load(): Promise<UserDto | null> {
    this.loading ??= firstValueFrom(this.authApi.me()).then(
      (response) => {
        this.currentUser.set(response.user);
        return response.user;
      },
      () => {
        this.loading = null;
        return null;
      },
    );
    return this.loading;
  }

  setUser(user: UserDto): void {
    this.currentUser.set(user);
    this.loading = Promise.resolve(user);
  }

  clear(): void {
    this.currentUser.set(null);
    this.loading = Promise.resolve(null);
    void forgetCachedAnswers();
  }
}
