// The root component: the top bar above whichever page the address shows.
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterOutlet } from '@angular/router';
import { TopBar } from './core/layout/top-bar';

@Component({
  selector: 'th-root',
  imports: [RouterOutlet, TopBar],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <a class="skip-link" href="#main">Skip to content</a>
    <th-top-bar />
    <main id="main" tabindex="-1">
      <router-outlet />
    </main>
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      min-height: 100%;
    }
    main {
      flex: 1;
      display: flex;
      flex-direction: column;
      outline: none;
    }
    .skip-link {
      position: absolute;
      left: 8px;
      top: -48px;
      z-index: 10;
      padding: 8px 12px;
      border-radius: 8px;
      background: var(--mat-sys-primary);
      color: var(--mat-sys-on-primary);
    }
    .skip-link:focus {
      top: 8px;
    }
  `,
})
export class App {}
