// What to do first on a build with no parts and no receipts, in place of figures that would all be zero.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { BuildRole } from '../../../../../shared/enums';

@Component({
  selector: 'th-first-steps',
  imports: [MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 id="first-steps-heading" class="card-heading">{{ role() === 'reviewer' ? 'Nothing here yet' : 'First steps' }}</h2>
    @if (role() === 'reviewer') {
      <p class="quiet">
        Nothing is planned or bought on this build yet. Once parts and receipts are added, the money and the receipts waiting for your review show
        here.
      </p>
    } @else {
      <p class="quiet">Nothing is planned or bought yet. Start with any of these:</p>
      <ol class="steps">
        <li>
          <mat-icon aria-hidden="true">list_alt</mat-icon>
          <div>
            <span>
              <a routerLink="parts">Add parts</a>
              @if (role() === 'owner') {
                and <a routerLink="budgets">set budgets</a>
              }
            </span>
            <span class="detail">The bill of materials, system by system, with what you expect each part to cost.</span>
          </div>
        </li>
        <li>
          <mat-icon aria-hidden="true">receipt_long</mat-icon>
          <div>
            <a routerLink="receipts">Upload a receipt</a>
            <span class="detail">A photo or a PDF invoice; it is read into lines for you to check.</span>
          </div>
        </li>
        @if (role() === 'owner') {
          <li>
            <mat-icon aria-hidden="true">group_add</mat-icon>
            <div>
              <a routerLink="crew">Invite a partner</a>
              <span class="detail">Someone to review the receipts and see where the money goes, or a helper for the shop.</span>
            </div>
          </li>
        }
      </ol>
    }
  `,
  styles: `
    .card-heading {
      font: var(--mat-sys-title-large);
      margin: 0 0 8px;
    }
    .quiet {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
    .steps {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 10px 0;
    }
    li mat-icon {
      flex: none;
      color: var(--mat-sys-primary);
    }
    li div {
      display: flex;
      flex-direction: column;
      gap: 2px;
      font: var(--mat-sys-title-small);
    }
    a {
      color: var(--mat-sys-primary);
    }
    .detail {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class FirstSteps {
  readonly role = input.required<BuildRole>();
}
