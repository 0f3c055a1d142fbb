// The bar across the top: the product's name and mark, and the signed-in person's menu.
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink } from '@angular/router';
import { AuthApi } from '../auth/auth-api';
import { LogoMark } from '../../ui/logo-mark';
import { Session } from '../auth/session';

@Component({
  selector: 'th-top-bar',
  imports: [MatToolbarModule, MatButtonModule, MatIconModule, MatMenuModule, RouterLink, LogoMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-toolbar class="top-bar">
      <a class="brand" routerLink="/builds">
        <th-logo-mark [size]="28" />
        <span class="brand-name">Tallyhood</span>
      </a>
      <span class="spacer"></span>
      @if (session.user(); as user) {
        <button mat-icon-button type="button" [matMenuTriggerFor]="accountMenu" aria-label="Account menu">
          <mat-icon aria-hidden="true">account_circle</mat-icon>
        </button>
        <mat-menu #accountMenu="matMenu" xPosition="before">
          <div class="account-summary">
            <span class="account-name">{{ user.displayName }}</span>
            <span class="account-email">{{ user.email }}</span>
          </div>
          <a mat-menu-item routerLink="/builds">
            <mat-icon aria-hidden="true">garage</mat-icon>
            <span>Your builds</span>
          </a>
          <button mat-menu-item type="button" (click)="signOut()">
            <mat-icon aria-hidden="true">logout</mat-icon>
            <span>Sign out</span>
          </button>
        </mat-menu>
      }
    </mat-toolbar>
  `,
  styles: `
    .top-bar {
      background: var(--mat-sys-surface-container);
      color: var(--mat-sys-on-surface);
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      gap: 8px;
    }
    .brand {
      display: inline-flex;
      align-items: center;
      gap: 10px;
      color: inherit;
      text-decoration: none;
      border-radius: 8px;
      padding: 4px;
    }
    .brand-name {
      font: var(--mat-sys-title-large);
      font-weight: 600;
      letter-spacing: 0.01em;
      color: var(--th-brand-petrol);
    }
    .spacer {
      flex: 1;
    }
    .account-summary {
      display: flex;
      flex-direction: column;
      padding: 8px 16px 12px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      margin-bottom: 4px;
    }
    .account-name {
      font: var(--mat-sys-title-small);
    }
    .account-email {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class TopBar {
  protected readonly session = inject(Session);
  private readonly authApi = inject(AuthApi);
  private readonly router = inject(Router);

  protected signOut(): void {
    this.authApi.signOut().subscribe({
      next: () => {
        this.session.clear();
        void this.router.navigateByUrl('/sign-in');
      },
    });
  }
}
