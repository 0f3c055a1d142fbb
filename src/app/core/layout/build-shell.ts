// A build's frame: its sections as a side rail on wide screens and a bottom bar on phones.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { CurrentBuild } from '../../features/builds/services/current-build';
import { CaptureStatus } from '../../features/receipts/components/capture-status';
import { CaptureQueue } from '../../features/receipts/services/capture-queue';

export interface BuildSection {
  /** Relative to /builds/:buildId. */
  path: string;
  label: string;
  icon: string;
  /** False: on phones the section sits in the bottom bar's "More" menu, so the bar keeps four or five items. */
  phoneBar?: boolean;
  /** Put on the phone bar in place of Parts for a reviewer, whose work is reviewing, not the parts list. */
  reviewerPhoneBar?: boolean;
}

/**
 * The build's sections in order; later features add theirs here (Receipts, Ledger, Cores and returns, Review, Exports).
 * The phone bar holds four sections and "More": the rest set `phoneBar: false`.
 */
export const BUILD_SECTIONS: readonly BuildSection[] = [
  { path: '.', label: 'Overview', icon: 'directions_car' },
  { path: 'ledger', label: 'Ledger', icon: 'query_stats' },
  { path: 'receipts', label: 'Receipts', icon: 'receipt_long' },
  { path: 'parts', label: 'Parts', icon: 'list_alt', reviewerPhoneBar: false },
  { path: 'budgets', label: 'Budgets', icon: 'savings', phoneBar: false },
  { path: 'inventory', label: 'Inventory', icon: 'inventory', phoneBar: false },
  { path: 'cores', label: 'Cores and returns', icon: 'autorenew', phoneBar: false },
  { path: 'review', label: 'Review', icon: 'fact_check', phoneBar: false, reviewerPhoneBar: true },
  { path: 'exports', label: 'Exports', icon: 'file_download', phoneBar: false },
  // Crew, mail alerts and the build's details sit under Settings, so the rail keeps to the daily work.
  { path: 'settings', label: 'Settings', icon: 'settings', phoneBar: false },
];

@Component({
  selector: 'th-build-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatIconModule, MatMenuModule, MatProgressBarModule, CaptureStatus],
  providers: [CurrentBuild],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="shell">
      <nav class="sections" aria-label="Build sections">
        <ul>
          @for (section of sections; track section.path; let index = $index) {
            @if (index === 2 && canAddReceipts()) {
              <!-- Phones only: the camera straight from any section; the upload's progress shows on Receipts. -->
              <li class="add-receipt">
                <input id="bar-receipt-camera" class="visually-hidden" type="file" accept="image/*,application/pdf" capture="environment" (change)="photographed($event)" />
                <label for="bar-receipt-camera">
                  <span class="add-receipt-button"><mat-icon aria-hidden="true">add_a_photo</mat-icon></span>
                  <span class="section-label">Add receipt</span>
                </label>
              </li>
            }
            <li [class.off-phone]="!onPhoneBar(section)">
              <a
                [routerLink]="section.path"
                routerLinkActive="active"
                [routerLinkActiveOptions]="{ exact: section.path === '.' }"
                ariaCurrentWhenActive="page"
              >
                <mat-icon aria-hidden="true">{{ section.icon }}</mat-icon>
                <span class="section-label">{{ section.label }}</span>
              </a>
            </li>
          }
          @if (moreSections().length > 0) {
            <li class="more">
              <button type="button" [matMenuTriggerFor]="moreMenu">
                <mat-icon aria-hidden="true">more_horiz</mat-icon>
                <span class="section-label">More</span>
              </button>
              <mat-menu #moreMenu="matMenu" yPosition="above">
                @for (section of moreSections(); track section.path) {
                  <a mat-menu-item [routerLink]="section.path">
                    <mat-icon aria-hidden="true">{{ section.icon }}</mat-icon>
                    <span>{{ section.label }}</span>
                  </a>
                }
              </mat-menu>
            </li>
          }
        </ul>
      </nav>
      <div class="content">
        @if (current.loading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading the build" />
        }
        <div class="context">
          <span>
            <a routerLink="/builds">Your builds</a>
            @if (current.build(); as build) {
              <span aria-hidden="true"> / </span><span class="context-name">{{ build.name }}</span>
            }
          </span>
          <th-capture-status />
        </div>
        @if (current.problem()) {
          <div class="page">
            <p class="notice notice-error" role="alert">{{ current.problem() }}</p>
            <a routerLink="/builds">Back to your builds</a>
          </div>
        } @else {
          <router-outlet />
        }
      </div>
    </div>
  `,
  styles: `
    :host {
      display: flex;
      flex: 1;
    }
    .shell {
      display: flex;
      flex: 1;
      /* Without this a wide table inside a page widens the whole page instead of scrolling in its own box. */
      min-width: 0;
    }
    .sections ul {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .sections a,
    .sections .more button {
      display: flex;
      flex-direction: column;
      align-items: center;
      gap: 4px;
      color: var(--mat-sys-on-surface-variant);
      text-decoration: none;
      font: var(--mat-sys-label-medium);
      border-radius: 16px;
      padding: 8px 4px;
    }
    .sections .more button {
      width: 100%;
      border: none;
      background: none;
      cursor: pointer;
    }
    .sections a mat-icon,
    .sections .more mat-icon {
      padding: 4px 16px;
      border-radius: 16px;
    }
    .sections a:hover mat-icon,
    .sections .more button:hover mat-icon {
      background: var(--mat-sys-surface-container-highest);
    }
    .sections a.active {
      color: var(--mat-sys-on-surface);
      font-weight: 600;
    }
    .sections a.active mat-icon {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .sections a:focus-visible,
    .sections .more button:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .content {
      flex: 1;
      min-width: 0;
    }
    .context {
      box-sizing: border-box;
      max-width: 960px;
      margin: 0 auto;
      padding: 12px 16px 0;
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
      /* The chip of captures waiting to be sent sits at the end of the line, or under it when the line is full. */
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px;
    }
    .context-name {
      color: var(--mat-sys-on-surface);
    }

    /* Desktop and tablet: a side rail. */
    @media (min-width: 600px) {
      .sections {
        flex: 0 0 88px;
        padding-top: 12px;
        background: var(--mat-sys-surface-container-low);
        border-right: 1px solid var(--mat-sys-outline-variant);
      }
      .sections .more,
      .sections .add-receipt {
        display: none;
      }
      .sections ul {
        position: sticky;
        top: 12px;
        display: flex;
        flex-direction: column;
        gap: 8px;
      }
    }
    /* Phones: a bottom bar within thumb reach. */
    @media (max-width: 599.98px) {
      .content {
        padding-bottom: 88px;
      }
      .sections {
        position: fixed;
        z-index: 5;
        left: 0;
        right: 0;
        bottom: 0;
        background: var(--mat-sys-surface-container);
        border-top: 1px solid var(--mat-sys-outline-variant);
        padding: 6px 4px calc(6px + env(safe-area-inset-bottom));
      }
      .sections ul {
        display: flex;
        justify-content: space-around;
      }
      .sections li {
        flex: 1;
      }
      .sections li.off-phone {
        display: none;
      }
      .add-receipt label {
        display: flex;
        flex-direction: column;
        align-items: center;
        gap: 2px;
        margin-top: -22px;
        color: var(--mat-sys-on-surface);
        font: var(--mat-sys-label-small);
        white-space: nowrap;
        cursor: pointer;
      }
      .add-receipt-button {
        display: grid;
        place-items: center;
        width: 56px;
        height: 56px;
        border-radius: 18px;
        background: var(--th-brass);
        color: var(--th-on-brass);
        box-shadow: 0 2px 6px rgb(0 0 0 / 25%);
      }
      .add-receipt input:focus-visible + label .add-receipt-button {
        outline: 2px solid var(--mat-sys-primary);
        outline-offset: 2px;
      }
    }
  `,
})
export class BuildShell {
  protected readonly current = inject(CurrentBuild);
  protected readonly sections = BUILD_SECTIONS;
  protected readonly moreSections = computed(() => BUILD_SECTIONS.filter((section) => !this.onPhoneBar(section)));

  /** Four sections on the phone bar; a reviewer gets Review where the others have Parts. */
  protected onPhoneBar(section: BuildSection): boolean {
    if (this.current.build()?.role === 'reviewer' && section.reviewerPhoneBar !== undefined) return section.reviewerPhoneBar;
    return section.phoneBar !== false;
  }

  private readonly captures = inject(CaptureQueue);
  private readonly router = inject(Router);

  /** Route parameter, bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly canAddReceipts = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'crew';
  });

  /**
   * The photo is saved on the device first, then sent (at once with signal, later without); Receipts shows its
   * progress and then the receipt being read, the chip above what still waits.
   */
  protected photographed(event: Event): void {
    const input = event.target as HTMLInputElement;
    const files = Array.from(input.files ?? []);
    input.value = '';
    if (files.length === 0) return;
    void this.captures.capture(this.buildId(), files);
    void this.router.navigate(['/builds', this.buildId(), 'receipts']);
  }

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.current.load(buildId));
    });
  }
}
