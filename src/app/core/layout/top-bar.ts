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
  templateUrl: './top-bar.html',
  styleUrl: './top-bar.css',
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
