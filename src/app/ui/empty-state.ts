// An empty screen that says what to do first: an icon, a heading, a sentence and an action.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

@Component({
  selector: 'th-empty-state',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-icon class="empty-icon" aria-hidden="true">{{ icon() }}</mat-icon>
    <h2 class="empty-heading">{{ heading() }}</h2>
    <div class="empty-text"><ng-content /></div>
    <div class="empty-actions"><ng-content select="[emptyStateActions]" /></div>
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      align-items: center;
      text-align: center;
      padding: 40px 16px;
      border: 1px dashed var(--mat-sys-outline-variant);
      border-radius: 16px;
      background: var(--mat-sys-surface-container-low);
    }
    .empty-icon {
      width: 48px;
      height: 48px;
      font-size: 48px;
      color: var(--mat-sys-primary);
    }
    .empty-heading {
      font: var(--mat-sys-title-large);
      margin: 12px 0 8px;
    }
    .empty-text {
      max-width: 48ch;
      color: var(--mat-sys-on-surface-variant);
    }
    .empty-actions {
      margin-top: 16px;
    }
  `,
})
export class EmptyState {
  readonly icon = input('inbox');
  readonly heading = input.required<string>();
}
