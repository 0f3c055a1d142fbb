// /builds/:buildId/parts: the bill of materials grouped by system, with totals against budget, inline status, bulk changes and import.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { forkJoin } from 'rxjs';
import type { PriceHistoryResponse } from '../../../../../shared/api/price-history';
import type { ImportResultDto, PartDto, SystemDto } from '../../../../../shared/api/parts';
import { PART_STATUSES, PART_STATUS_LABELS, PartStatus } from '../../../../../shared/enums';
import { compareWithBudget, comparisonWords } from '../../../../../shared/build-figures';
import { Decimal, toWire } from '../../../../../shared/money';
import { toApiError } from '../../../core/http/api-error';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe, moneyText } from '../../../ui/money';
import { injectNarrowScreen } from '../../../ui/narrow-screen';
import { CurrentBuild } from '../../builds/services/current-build';
import { ImportDialog, ImportDialogData } from '../components/import-dialog';
import { PartFormData, PartFormDialog, PartFormResult } from '../components/part-form-dialog';
import { BudgetStanding, amountOf, budgetStanding, sumOf } from '../models/budget-math';
import { PartsApi } from '../services/parts-api';
import { SystemsApi } from '../services/systems-api';
import { PriceHistoryApi } from '../../receipts/services/price-history-api';
import { SafetyNote } from '../../../ui/safety-note/safety-note';
import { PricesPaid } from '../components/prices-paid/prices-paid';
import { WarrantyStatus } from '../components/warranty-status/warranty-status';
import { openWarrantyDialog } from '../components/warranty-dialog/warranty-dialog';

/** A system as the table groups by it, with its estimate summed from the parts on screen. */
interface SystemGroup {
  system: SystemDto;
  estimate: Decimal;
  budget: Decimal;
  standing: BudgetStanding;
}

type TableRow =
  | { kind: 'group'; group: SystemGroup; shownCount: number }
  | { kind: 'part'; part: PartDto }
  | { kind: 'total'; group: SystemGroup };

const SORTERS: Record<string, (a: PartDto, b: PartDto) => number> = {
  description: (a, b) => a.description.localeCompare(b.description),
  partNumber: (a, b) => a.partNumber.localeCompare(b.partNumber),
  quantity: (a, b) => amountOf(a.quantity).comparedTo(amountOf(b.quantity)),
  unitCost: (a, b) => amountOf(a.estimatedUnitCost).comparedTo(amountOf(b.estimatedUnitCost)),
  total: (a, b) => amountOf(a.estimatedTotal).comparedTo(amountOf(b.estimatedTotal)),
  status: (a, b) => PART_STATUSES.indexOf(a.status) - PART_STATUSES.indexOf(b.status),
  location: (a, b) => a.storageLocation.localeCompare(b.storageLocation),
};

@Component({
  selector: 'th-parts-page',
  imports: [SafetyNote, WarrantyStatus, PricesPaid,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    RouterLink,
    EmptyState,
    MoneyPipe,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './parts-page.html',
  styleUrl: './parts-page.css',
})
export class PartsPage {
  private readonly partsApi = inject(PartsApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly priceHistoryApi = inject(PriceHistoryApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly statuses = PART_STATUSES;
  protected readonly statusLabels = PART_STATUS_LABELS;

  protected readonly parts = signal<PartDto[]>([]);
  protected readonly systems = signal<SystemDto[]>([]);
  protected readonly currency = signal('');
  /** What the build paid for items bought on more than one receipt; null until it arrives (or when it cannot be had). */
  protected readonly priceHistory = signal<PriceHistoryResponse | null>(null);
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly busy = signal(false);

  protected readonly filterText = signal('');
  protected readonly systemFilter = signal('');
  protected readonly sort = signal<Sort>({ active: '', direction: '' });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  private readonly selected = signal<ReadonlySet<string>>(new Set());

  protected readonly locale = computed(() => this.current.build()?.locale ?? 'en-US');
  protected readonly canEdit = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'crew';
  });
  protected readonly activeSystems = computed(() => this.systems().filter((system) => !system.archived));
  /** Phones: part number, quantity, unit cost and location go under the description, so the figures stay in view. */
  protected readonly narrow = injectNarrowScreen();
  protected readonly partColumns = computed(() => {
    const columns = this.narrow()
      ? ['description', 'total', 'status']
      : ['description', 'partNumber', 'quantity', 'unitCost', 'total', 'status', 'location'];
    return this.canEdit() ? ['select', ...columns] : columns;
  });
  /** The totals row's label spans the columns before "Estimated total", its budget cell those after. */
  protected readonly totalLabelSpan = computed(() => this.partColumns().indexOf('total'));
  protected readonly totalBudgetSpan = computed(() => this.partColumns().length - this.totalLabelSpan() - 1);

  /** Each system's figures from all of its parts, whatever the filter shows. */
  /** "planned $45.00 under budget": the words every screen uses for this comparison. */
  protected comparisonText(group: SystemGroup): string {
    const comparison = compareWithBudget('planned', toWire(group.estimate), toWire(group.budget));
    return comparisonWords(comparison, moneyText(comparison.amount, this.currency(), this.locale()));
  }

  private readonly groups = computed(() => {
    const bySystem = new Map<string, string[]>();
    for (const part of this.parts()) bySystem.set(part.systemId, [...(bySystem.get(part.systemId) ?? []), part.estimatedTotal]);
    const groups = new Map<string, SystemGroup>();
    for (const system of this.systems()) {
      const estimate = sumOf(bySystem.get(system.id) ?? []);
      const budget = amountOf(system.budget);
      groups.set(system.id, { system, estimate, budget, standing: budgetStanding(estimate, budget) });
    }
    return groups;
  });

  /** Parts passing the filters, in system order, sorted within each system by the chosen column. */
  protected readonly visibleParts = computed(() => {
    const text = this.filterText().trim().toLowerCase();
    const systemId = this.systemFilter();
    const order = new Map(this.systems().map((system, index) => [system.id, system.archived ? 100_000 + index : index]));
    const { active, direction } = this.sort();
    const sorter = direction ? SORTERS[active] : undefined;
    return this.parts()
      .filter((part) => !systemId || part.systemId === systemId)
      .filter(
        (part) =>
          !text ||
          part.description.toLowerCase().includes(text) ||
          part.partNumber.toLowerCase().includes(text) ||
          part.storageLocation.toLowerCase().includes(text),
      )
      .map((part, index) => ({ part, index }))
      .sort((a, b) => {
        const bySystem = (order.get(a.part.systemId) ?? 0) - (order.get(b.part.systemId) ?? 0);
        if (bySystem !== 0) return bySystem;
        const byColumn = sorter ? sorter(a.part, b.part) * (direction === 'desc' ? -1 : 1) : 0;
        return byColumn || a.index - b.index;
      })
      .map(({ part }) => part);
  });

  private readonly pageParts = computed(() => {
    const start = this.pageIndex() * this.pageSize();
    return this.visibleParts().slice(start, start + this.pageSize());
  });

  /** The page's parts under a heading per system, each system closed by its totals row. */
  protected readonly rows = computed<TableRow[]>(() => {
    const rows: TableRow[] = [];
    const groups = this.groups();
    const shownBySystem = new Map<string, number>();
    for (const part of this.visibleParts()) shownBySystem.set(part.systemId, (shownBySystem.get(part.systemId) ?? 0) + 1);
    let currentGroup: SystemGroup | undefined;
    for (const part of this.pageParts()) {
      if (currentGroup?.system.id !== part.systemId) {
        if (currentGroup) rows.push({ kind: 'total', group: currentGroup });
        currentGroup = groups.get(part.systemId) ?? this.unknownGroup(part.systemId);
        rows.push({ kind: 'group', group: currentGroup, shownCount: shownBySystem.get(part.systemId) ?? 0 });
      }
      rows.push({ kind: 'part', part });
    }
    if (currentGroup) rows.push({ kind: 'total', group: currentGroup });
    return rows;
  });

  /** The risky systems the page lists, named in the caution. */
  protected readonly cautionSystems = computed(() => {
    const systemId = this.systemFilter();
    if (systemId) return this.systems().filter((system) => system.id === systemId && system.safetyCaution).map((system) => system.name);
    return this.rows().flatMap((row) => (row.kind === 'group' && row.group.system.safetyCaution ? [row.group.system.name] : []));
  });
  protected readonly showCaution = computed(() => {
    const systemId = this.systemFilter();
    if (systemId) return this.systems().find((system) => system.id === systemId)?.safetyCaution ?? false;
    return this.rows().some((row) => row.kind === 'group' && row.group.system.safetyCaution);
  });

  protected readonly selectedCount = computed(() => this.selected().size);
  protected readonly allOnPageSelected = computed(() => {
    const page = this.pageParts();
    return page.length > 0 && page.every((part) => this.selected().has(part.id));
  });
  protected readonly someOnPageSelected = computed(() => !this.allOnPageSelected() && this.pageParts().some((part) => this.selected().has(part.id)));

  protected readonly isGroupRow = (_index: number, row: TableRow) => row.kind === 'group';
  protected readonly isPartRow = (_index: number, row: TableRow) => row.kind === 'part';
  protected readonly isTotalRow = (_index: number, row: TableRow) => row.kind === 'total';

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  /** Table rows are untyped in templates; this keeps the lookup typed. */
  protected statusLabelOf(part: PartDto): string {
    return PART_STATUS_LABELS[part.status];
  }

  protected systemName(systemId: string): string {
    return this.systems().find((system) => system.id === systemId)?.name ?? '';
  }

  protected setFilter(text: string): void {
    this.filterText.set(text);
    this.pageIndex.set(0);
  }

  protected setSystemFilter(systemId: string): void {
    this.systemFilter.set(systemId);
    this.pageIndex.set(0);
  }

  protected sortBy(sort: Sort): void {
    this.sort.set(sort);
    this.pageIndex.set(0);
  }

  protected onPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }

  protected isSelected(part: PartDto): boolean {
    return this.selected().has(part.id);
  }

  protected toggle(part: PartDto, checked: boolean): void {
    const next = new Set(this.selected());
    if (checked) next.add(part.id);
    else next.delete(part.id);
    this.selected.set(next);
  }

  protected toggleAllOnPage(checked: boolean): void {
    const next = new Set(this.selected());
    for (const part of this.pageParts()) {
      if (checked) next.add(part.id);
      else next.delete(part.id);
    }
    this.selected.set(next);
  }

  protected clearSelection(): void {
    this.selected.set(new Set());
  }

  protected openAdd(): void {
    this.openPartForm({ systemId: this.systemFilter() || undefined });
  }

  protected openEdit(part: PartDto): void {
    this.openPartForm({ part });
  }

  protected openWarranty(part: PartDto): void {
    openWarrantyDialog(this.dialog, this.buildId(), part).subscribe((saved) => saved && this.replace(saved));
  }

  protected openImport(): void {
    this.dialog
      .open<ImportDialog, ImportDialogData, ImportResultDto>(ImportDialog, {
        data: { buildId: this.buildId(), currency: this.currency(), locale: this.locale() },
        width: '960px',
        maxWidth: '96vw',
        autoFocus: 'first-tabbable',
      })
      .afterClosed()
      .subscribe((result) => {
        if (!result) return;
        const left = result.dropped ? `; ${result.dropped} ${result.dropped === 1 ? 'row' : 'rows'} left out` : '';
        this.snackBar.open(`Imported ${result.imported} ${result.imported === 1 ? 'part' : 'parts'}${left}.`, 'Dismiss', { duration: 6000 });
        this.load(this.buildId());
      });
  }

  protected changeStatus(part: PartDto, status: PartStatus): void {
    if (status === part.status) return;
    this.busy.set(true);
    this.partsApi.update(this.buildId(), part.id, { status, version: part.version }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.replace(saved);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const apiError = toApiError(error);
        const saved = apiError.current as PartDto | undefined;
        if (apiError.status === 409 && saved?.id === part.id) {
          this.replace(saved);
          this.snackBar.open(
            `Someone else changed "${part.description}" in the meantime; it now shows the saved version (${PART_STATUS_LABELS[saved.status]}). Set the status again if you still need to.`,
            'Dismiss',
            { duration: 10000 },
          );
        } else {
          // Put the select back to the saved status: a fresh row object redraws it.
          this.replace({ ...part });
        }
      },
    });
  }

  protected bulkMove(system: SystemDto): void {
    const partIds = [...this.selected()];
    this.busy.set(true);
    this.partsApi.bulk(this.buildId(), { action: 'move', partIds, systemId: system.id }).subscribe({
      next: (saved) => {
        this.afterBulk(saved);
        this.snackBar.open(`Moved ${saved.length} ${saved.length === 1 ? 'part' : 'parts'} to ${system.name}.`, 'Dismiss', { duration: 6000 });
      },
      error: () => this.busy.set(false),
    });
  }

  protected bulkStatus(status: PartStatus): void {
    const partIds = [...this.selected()];
    this.busy.set(true);
    this.partsApi.bulk(this.buildId(), { action: 'status', partIds, status }).subscribe({
      next: (saved) => {
        this.afterBulk(saved);
        this.snackBar.open(`${saved.length} ${saved.length === 1 ? 'part is' : 'parts are'} now ${PART_STATUS_LABELS[status]}.`, 'Dismiss', {
          duration: 6000,
        });
      },
      error: () => this.busy.set(false),
    });
  }

  private afterBulk(saved: PartDto[]): void {
    this.busy.set(false);
    const byId = new Map(saved.map((part) => [part.id, part]));
    this.parts.update((parts) => parts.map((part) => byId.get(part.id) ?? part));
    this.clearSelection();
  }

  private openPartForm(options: { part?: PartDto; systemId?: string }): void {
    const ownSystem = options.part ? this.systems().find((system) => system.id === options.part!.systemId) : undefined;
    const systems = ownSystem?.archived ? [...this.activeSystems(), ownSystem] : this.activeSystems();
    this.dialog
      .open<PartFormDialog, PartFormData, PartFormResult>(PartFormDialog, {
        data: { buildId: this.buildId(), currency: this.currency(), locale: this.locale(), systems, ...options },
        width: '680px',
        maxWidth: '96vw',
        autoFocus: 'first-tabbable',
      })
      .afterClosed()
      .subscribe((result) => {
        if (!result) return;
        if ('deleted' in result) {
          this.parts.update((parts) => parts.filter((part) => part.id !== result.deleted));
          this.selected.update((selected) => new Set([...selected].filter((id) => id !== result.deleted)));
        } else if (options.part) {
          this.replace(result.saved);
        } else {
          this.parts.update((parts) => [...parts, result.saved]);
          this.snackBar.open(`Added "${result.saved.description}".`, 'Dismiss', { duration: 5000 });
        }
      });
  }

  private replace(saved: PartDto): void {
    this.parts.update((parts) => parts.map((part) => (part.id === saved.id ? saved : part)));
  }

  private unknownGroup(systemId: string): SystemGroup {
    const system: SystemDto = {
      id: systemId,
      name: 'Unknown system',
      budget: '0',
      estimate: '0',
      partCount: 0,
      sortOrder: 0,
      archived: false,
      safetyCaution: false,
      version: 1,
    };
    return { system, estimate: new Decimal(0), budget: new Decimal(0), standing: budgetStanding(new Decimal(0), new Decimal(0)) };
  }

  private load(buildId: string): void {
    this.loading.set(true);
    forkJoin({ systems: this.systemsApi.list(buildId, true), parts: this.partsApi.list(buildId) }).subscribe({
      next: ({ systems, parts }) => {
        this.currency.set(systems.currency);
        this.systems.set(systems.systems);
        this.parts.set(parts);
        this.selected.set(new Set());
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
    this.priceHistoryApi.priceHistory(buildId).subscribe({ next: (history) => this.priceHistory.set(history), error: () => this.priceHistory.set(null) });
  }
}
