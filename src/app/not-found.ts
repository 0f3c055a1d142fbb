// The page for an address that leads nowhere.
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { EmptyState } from './ui/empty-state';

@Component({
  selector: 'th-not-found',
  imports: [EmptyState, MatButtonModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="page">
      <h1 class="page-heading">Page not found</h1>
      <th-empty-state icon="wrong_location" heading="Nothing lives at this address">
        <p>The link may be mistyped or out of date. Your builds are one click away.</p>
        <a mat-flat-button emptyStateActions routerLink="/builds">Go to your builds</a>
      </th-empty-state>
    </div>
  `,
})
export class NotFound {}
