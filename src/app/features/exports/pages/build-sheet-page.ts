// /builds/:buildId/exports/build-sheet: the build sheet laid out for paper (A4 or Letter): fitted parts by system with
// cost and date, a summary per system, totals, the safety caution and the "records, not tax advice" line.
import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { BuildSheetDto, BuildSheetPartDto } from '../../../../../shared/api/exports';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { ExportsApi } from '../services/exports-api';

@Component({
  selector: 'th-build-sheet-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, EmptyState, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // Unencapsulated: the print rules must reach the app's frame (top bar, section rail) to hide it on paper.
  encapsulation: ViewEncapsulation.None,
  template: `
    @if (loading()) {
      <mat-progress-bar class="no-print" mode="indeterminate" aria-label="Loading the build sheet" />
    }
    <div class="page sheet-page">
      <div class="sheet-actions no-print">
        <a mat-button routerLink=".."><mat-icon aria-hidden="true">arrow_back</mat-icon> Exports</a>
        <button mat-flat-button class="cta" type="button" (click)="print()" [disabled]="!sheet()">
          <mat-icon aria-hidden="true">print</mat-icon> Print
        </button>
      </div>
      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }
      @if (sheet(); as sheet) {
        <article class="sheet" aria-labelledby="sheet-heading">
          <header class="sheet-header">
            <h1 id="sheet-heading" class="sheet-title">Build sheet: {{ sheet.buildName }}</h1>
            <dl class="sheet-facts">
              <div><dt>Vehicle</dt><dd>{{ sheet.vehicle || 'Not given' }}</dd></div>
              <div><dt>Currency</dt><dd>{{ sheet.currency }}</dd></div>
              <div><dt>Prepared on</dt><dd>{{ today() }}</dd></div>
            </dl>
          </header>

          <p class="sheet-caution" role="note">
            <mat-icon aria-hidden="true">health_and_safety</mat-icon>
            <span><strong>Safety: </strong>{{ sheet.safetyCaution }}</span>
          </p>

          @if (sheet.parts.length === 0) {
            <th-empty-state icon="build" heading="No fitted parts yet">
              <p>
                The sheet lists parts whose status is "Installed". Mark parts as installed on the Parts screen once they are on the
                car; their cost comes from the filed receipts they are assigned to.
              </p>
              <a mat-stroked-button emptyStateActions class="no-print" routerLink="../../parts">
                <mat-icon aria-hidden="true">list_alt</mat-icon> Go to Parts
              </a>
            </th-empty-state>
          } @else {
            @for (group of groups(); track group.systemId) {
              <section class="sheet-system" [attr.aria-labelledby]="'system-' + group.systemId">
                <h2 class="sheet-system-name" [id]="'system-' + group.systemId">
                  {{ group.name }}
                  @if (group.safetyCaution) {
                    <span class="critical"><mat-icon aria-hidden="true">warning</mat-icon> safety-critical</span>
                  }
                </h2>
                <table class="sheet-table">
                  <thead>
                    <tr>
                      <th scope="col">Part</th>
                      <th scope="col">Part no.</th>
                      <th scope="col" class="number">Qty</th>
                      <th scope="col">Bought on</th>
                      <th scope="col" class="number">Cost</th>
                    </tr>
                  </thead>
                  <tbody>
                    @for (part of group.parts; track $index) {
                      <tr>
                        <td>{{ part.description }}</td>
                        <td>{{ part.partNumber || '—' }}</td>
                        <td class="number tabular">{{ part.quantity }} {{ part.unit }}</td>
                        <td class="tabular">{{ part.boughtOn ? dateText(part.boughtOn) : 'No receipt' }}</td>
                        <td class="number tabular">{{ part.cost === null ? 'No receipt' : (part.cost | money: sheet.currency : sheet.locale) }}</td>
                      </tr>
                    }
                  </tbody>
                </table>
              </section>
            }
          }

          <section class="sheet-summary" aria-labelledby="summary-heading">
            <h2 id="summary-heading" class="sheet-system-name">Summary by system</h2>
            <table class="sheet-table">
              <thead>
                <tr>
                  <th scope="col">System</th>
                  <th scope="col" class="number">Parts fitted</th>
                  <th scope="col" class="number">Fitted cost</th>
                  <th scope="col" class="number">Net cost</th>
                </tr>
              </thead>
              <tbody>
                @for (system of sheet.systems; track system.systemId) {
                  <tr>
                    <th scope="row">{{ system.name }}</th>
                    <td class="number tabular">{{ system.fittedParts }}</td>
                    <td class="number tabular">{{ system.fittedCost | money: sheet.currency : sheet.locale }}</td>
                    <td class="number tabular">{{ system.netCost | money: sheet.currency : sheet.locale }}</td>
                  </tr>
                } @empty {
                  <tr><td colspan="4">No money recorded yet.</td></tr>
                }
              </tbody>
              <tfoot>
                <tr>
                  <th scope="row">Total</th>
                  <td class="number tabular">{{ sheet.total.fittedParts }}</td>
                  <td class="number tabular">{{ sheet.total.fittedCost | money: sheet.currency : sheet.locale }}</td>
                  <td class="number tabular">{{ sheet.total.netCost | money: sheet.currency : sheet.locale }}</td>
                </tr>
              </tfoot>
            </table>
            <p class="sheet-explain">
              Cost of a part: what its receipt lines cost with their share of tax and shipping, less discounts. Fitted cost: the
              parts above. Net cost: everything spent on the system (fitted or not, fees included), less returns refunded.
            </p>
          </section>

          <p class="sheet-tax" role="note">{{ sheet.taxNote }}</p>
        </article>
      }
    </div>
  `,
  styles: `
    .sheet-page {
      max-width: 900px;
    }
    .sheet-actions {
      display: flex;
      flex-wrap: wrap;
      justify-content: space-between;
      align-items: center;
      gap: 8px;
      margin-bottom: 8px;
    }
    .sheet-title {
      font: var(--mat-sys-headline-small);
      margin: 0 0 8px;
    }
    .sheet-facts {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 32px;
      margin: 0 0 16px;
    }
    .sheet-facts dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .sheet-facts dd {
      margin: 0;
    }
    .sheet-caution mat-icon,
    .sheet-system-name mat-icon {
      flex: none;
    }
    .sheet-caution {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      padding: 12px 16px;
      border: 2px solid var(--th-brass, #b8892b);
      border-radius: 8px;
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      margin: 0 0 20px;
    }
    .sheet-system-name {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px;
      font: var(--mat-sys-title-medium);
      margin: 20px 0 6px;
    }
    .sheet-system-name .critical {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .sheet-system-name .critical mat-icon {
      width: 18px;
      height: 18px;
      font-size: 18px;
    }
    .sheet-table {
      width: 100%;
      border-collapse: collapse;
    }
    @media (max-width: 599.98px) {
      .sheet-table th,
      .sheet-table td {
        padding: 4px 3px;
        font-size: 0.875rem;
      }
    }
    .sheet-table th,
    .sheet-table td {
      text-align: left;
      padding: 4px 6px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    .sheet-table thead th {
      font: var(--mat-sys-label-large);
    }
    .sheet-table .number {
      text-align: right;
      white-space: nowrap;
    }
    .sheet-table tfoot th,
    .sheet-table tfoot td {
      font-weight: 700;
      border-top: 2px solid var(--mat-sys-on-surface);
    }
    .sheet-explain,
    .sheet-tax {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .sheet-tax {
      margin-top: 16px;
      font-weight: 600;
    }
    @media print {
      /* Paper shows the sheet alone: no top bar, section rail, breadcrumb or buttons. */
      th-top-bar,
      .skip-link,
      th-build-shell .sections,
      th-build-shell .context,
      .no-print {
        display: none !important;
      }
      th-build-shell .content {
        padding: 0 !important;
      }
      @page {
        margin: 15mm;
      }
      body {
        background: #fff;
        color: #000;
        font-size: 11pt;
      }
      .sheet-page {
        max-width: none;
        padding: 0;
      }
      .sheet-caution {
        background: #fff;
        color: #000;
      }
      .sheet-table tr {
        break-inside: avoid;
      }
      .sheet-system-name {
        break-after: avoid;
      }
    }
  `,
})
export class BuildSheetPage {
  private readonly exportsApi = inject(ExportsApi);

  /** Route parameter, bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly sheet = signal<BuildSheetDto | null>(null);
  protected readonly loading = signal(false);
  protected readonly problem = signal('');

  /** The parts in their systems, in the order the server gives (the build's system order). */
  protected readonly groups = computed(() => {
    const sheet = this.sheet();
    if (!sheet) return [];
    const groups: { systemId: string; name: string; safetyCaution: boolean; parts: BuildSheetPartDto[] }[] = [];
    for (const part of sheet.parts) {
      let group = groups.find((candidate) => candidate.systemId === part.systemId);
      if (!group) {
        group = { systemId: part.systemId, name: part.system, safetyCaution: sheet.systems.find((system) => system.systemId === part.systemId)?.safetyCaution ?? false, parts: [] };
        groups.push(group);
      }
      group.parts.push(part);
    }
    return groups;
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  protected today(): string {
    const now = new Date();
    const iso = `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
    return formatCalendarDate(iso, this.sheet()?.locale ?? 'en-US');
  }

  protected dateText(date: string): string {
    return formatCalendarDate(date, this.sheet()?.locale ?? 'en-US');
  }

  protected print(): void {
    window.print();
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.exportsApi.buildSheet(buildId).subscribe({
      next: (sheet) => {
        this.sheet.set(sheet);
        this.loading.set(false);
      },
      error: (error: unknown) => {
        this.loading.set(false);
        this.problem.set(`The build sheet could not be loaded. ${toApiError(error).message}`);
      },
    });
  }
}
