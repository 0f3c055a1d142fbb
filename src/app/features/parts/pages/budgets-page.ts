// /builds/:buildId/budgets: each system's budget against its estimate, the contingency and live totals; the owner edits them.
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, FormControl, FormRecord, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { filter, forkJoin, switchMap } from 'rxjs';
import { SystemDto, SystemsResponse, createSystemRequest, updateSystemRequest } from '../../../../../shared/api/parts';
import { Decimal, MONEY_MESSAGES, minorUnits, parseMoney, sum, toWire } from '../../../../../shared/money';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { confirmAction } from '../../../ui/confirm-dialog';
import { Meter } from '../../../ui/meter';
import { MoneyPipe, currencySign, moneyText } from '../../../ui/money';
import { MoneySummary } from '../../../ui/money-summary/money-summary';
import { LedgerApi } from '../../ledger/services/ledger-api';
import type { LedgerDto } from '../../../../../shared/api/ledger';
import {
  addSystemFigures,
  budgetWithContingency,
  compareWithBudget,
  comparisonWords,
  withBudget,
  type BudgetComparison,
  type FigureName,
} from '../../../../../shared/build-figures';
import { CurrentBuild } from '../../builds/services/current-build';
import { BudgetStanding, amountOf, budgetStanding } from '../models/budget-math';
import { SystemsApi } from '../services/systems-api';
import { SafetyNote } from '../../../ui/safety-note/safety-note';

const CONTINGENCY = 'contingency';

/** An amount a person pays: digits with at most the currency's minor units, zero or more. */
function budgetValidator(places: number, required: boolean): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const text = control.value ?? '';
    if (!required && text.trim() === '') return null;
    const parsed = parseMoney(text, { maxDecimals: places });
    if (!parsed.ok) return { message: parsed.message };
    if (parsed.value.isNegative()) return { message: MONEY_MESSAGES.negative };
    return null;
  };
}

interface SystemLine {
  system: SystemDto;
  budget: Decimal;
  estimate: Decimal;
  /** For the meter's width. */
  standing: BudgetStanding;
  /** What is planned against the budget, in the words every screen uses. */
  comparison: BudgetComparison;
}

@Component({
  selector: 'th-budgets-page',
  imports: [SafetyNote, 
    ReactiveFormsModule,
    MatButtonModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatTooltipModule,
    Meter,
    MoneyPipe,
    MoneySummary,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './budgets-page.html',
  styleUrl: './budgets-page.css',
})
export class BudgetsPage {
  private readonly systemsApi = inject(SystemsApi);
  private readonly ledgerApi = inject(LedgerApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);
  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly errorOf = errorOf;
  protected readonly contingencyKey = CONTINGENCY;

  protected readonly systems = signal<SystemDto[]>([]);
  protected readonly currency = signal('');
  private readonly savedContingency = signal('0');
  private buildVersion = 0;
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly busy = signal(false);
  protected readonly status = signal('');
  protected readonly renaming = signal<string | null>(null);

  /** One money input per active system, keyed by id, plus the contingency. */
  protected readonly budgetForm = new FormRecord<FormControl<string>>({});
  /** What is typed in the money inputs, for the live totals. */
  private readonly typed = signal<Record<string, string>>({});
  private readonly inFlight = new Set<string>();

  protected readonly renameForm = this.formBuilder.group({ name: '' });
  protected readonly addForm = this.formBuilder.group({ name: '', budget: '' });

  protected readonly locale = computed(() => this.current.build()?.locale ?? 'en-US');
  protected readonly isOwner = computed(() => this.current.build()?.role === 'owner');
  /** Budgets are typed beside the build's currency sign, where its locale writes it ($ 5400.00, 5400,00 €). */
  protected readonly sign = computed(() => currencySign(this.currency(), this.locale()));
  private readonly places = computed(() => (this.currency() ? minorUnits(this.currency()) : 2));

  /** A typed amount while it is valid, otherwise the saved one: the totals never show a half-typed figure. */
  private effectiveAmount(key: string, saved: string): Decimal {
    const text = this.typed()[key];
    if (text !== undefined) {
      const parsed = parseMoney(text, { maxDecimals: this.places() });
      if (parsed.ok && !parsed.value.isNegative()) return parsed.value;
    }
    return amountOf(saved);
  }

  protected readonly activeLines = computed<SystemLine[]>(() =>
    this.systems()
      .filter((system) => !system.archived)
      .map((system) => {
        const budget = this.effectiveAmount(system.id, system.budget);
        const estimate = amountOf(system.estimate);
        return {
          system,
          budget,
          estimate,
          standing: budgetStanding(estimate, budget),
          comparison: compareWithBudget('planned', toWire(estimate), toWire(budget)),
        };
      }),
  );
  protected readonly archivedSystems = computed(() => this.systems().filter((system) => system.archived));
  protected readonly contingency = computed(() => this.effectiveAmount(CONTINGENCY, this.savedContingency()));
  protected readonly summaryFigures: readonly FigureName[] = ['budget', 'contingency', 'budgetWithContingency', 'planned', 'planningGap', 'forecast', 'variance'];
  /** The ledger as last loaded: the figures the other screens show. */
  private readonly ledger = signal<LedgerDto | null>(null);
  /** The same ledger with the budgets as typed (while they are valid), worked out by the shared money model. */
  protected readonly liveLedger = computed<LedgerDto | null>(() => {
    const ledger = this.ledger();
    if (!ledger) return null;
    const places = this.places();
    const typed = new Map(this.activeLines().map((line) => [line.system.id, line.budget]));
    const systems = ledger.systems.map((system) => {
      const budget = typed.get(system.systemId);
      return budget ? { ...system, ...withBudget(system, budget, places) } : system;
    });
    const total = addSystemFigures(systems, places);
    const contingency = toWire(this.contingency(), places);
    return { ...ledger, systems, total, contingencyBudget: contingency, budgetWithContingency: budgetWithContingency(total.budget, contingency, places) };
  });
  protected readonly hasCaution = computed(() => this.activeLines().some((line) => line.system.safetyCaution));
  protected readonly cautionSystems = computed(() => this.activeLines().filter((line) => line.system.safetyCaution).map((line) => line.system.name));

  constructor() {
    this.budgetForm.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.typed.set(this.budgetForm.getRawValue()));
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  protected control(key: string): FormControl<string> {
    return this.budgetForm.controls[key] ?? new FormControl('', { nonNullable: true });
  }

  protected saveBudget(system: SystemDto): void {
    const control = this.budgetForm.controls[system.id];
    const latest = this.systems().find((candidate) => candidate.id === system.id) ?? system;
    const amount = this.changedAmount(system.id, latest.budget);
    if (!control || !amount) return;
    this.inFlight.add(system.id);
    this.systemsApi.update(this.buildId(), system.id, { budget: amount, version: latest.version }).subscribe({
      next: (saved) => {
        this.inFlight.delete(system.id);
        this.replace(saved);
        control.setValue(saved.budget);
        this.status.set(`${saved.name} budget saved.`);
      },
      error: (error: unknown) => this.failed(system.id, error, `${latest.name} was changed by someone else`),
    });
  }

  protected saveContingency(): void {
    const amount = this.changedAmount(CONTINGENCY, this.savedContingency());
    if (!amount) return;
    this.inFlight.add(CONTINGENCY);
    this.systemsApi.updateContingency(this.buildId(), { contingencyBudget: amount, version: this.buildVersion }).subscribe({
      next: (response) => {
        this.inFlight.delete(CONTINGENCY);
        this.savedContingency.set(response.contingencyBudget);
        this.buildVersion = response.buildVersion;
        const build = this.current.build();
        if (build) this.current.set({ ...build, version: response.buildVersion });
        this.budgetForm.controls[CONTINGENCY]?.setValue(response.contingencyBudget);
        this.status.set('Contingency saved.');
      },
      error: (error: unknown) => this.failed(CONTINGENCY, error, 'The build was changed by someone else'),
    });
  }

  protected startRename(system: SystemDto): void {
    this.renameForm.reset({ name: system.name });
    this.renaming.set(system.id);
  }

  protected saveName(system: SystemDto): void {
    const name = this.renameForm.getRawValue().name;
    const latest = this.systems().find((candidate) => candidate.id === system.id) ?? system;
    if (!validateWith(this.renameForm, updateSystemRequest, { name, version: latest.version })) return;
    if (name.trim() === latest.name) {
      this.renaming.set(null);
      return;
    }
    this.busy.set(true);
    this.systemsApi.update(this.buildId(), system.id, { name: name.trim(), version: latest.version }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.replace(saved);
        this.renaming.set(null);
        this.status.set(`Renamed to ${saved.name}.`);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const apiError = toApiError(error);
        if (apiError.status === 409) this.conflicted(`${latest.name} was changed by someone else`);
        else applyFieldErrors(this.renameForm, apiError.fields);
      },
    });
  }

  /** Swaps places with the neighbour above (-1) or below (+1). */
  protected move(system: SystemDto, direction: -1 | 1): void {
    const active = this.systems().filter((candidate) => !candidate.archived);
    const index = active.findIndex((candidate) => candidate.id === system.id);
    const neighbour = active[index + direction];
    if (index < 0 || !neighbour) return;
    const mine = active[index];
    // Equal positions (possible after restores) still need an order, so the mover steps past its neighbour.
    const myNewOrder = neighbour.sortOrder === mine.sortOrder ? neighbour.sortOrder + direction : neighbour.sortOrder;
    this.busy.set(true);
    forkJoin([
      this.systemsApi.update(this.buildId(), mine.id, { sortOrder: Math.max(0, myNewOrder), version: mine.version }),
      this.systemsApi.update(this.buildId(), neighbour.id, { sortOrder: mine.sortOrder, version: neighbour.version }),
    ]).subscribe({
      next: (saved) => {
        this.busy.set(false);
        for (const one of saved) this.replace(one);
        this.systems.update((systems) => [...systems].sort((a, b) => a.sortOrder - b.sortOrder));
        this.status.set(`${mine.name} moved ${direction < 0 ? 'up' : 'down'}.`);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        if (toApiError(error).status === 409) this.conflicted('The systems were changed by someone else');
        else this.load(this.buildId());
      },
    });
  }

  protected archive(system: SystemDto): void {
    confirmAction(this.dialog, {
      title: `Archive ${system.name}?`,
      message:
        'Its budget leaves the build budget and it is no longer offered for new parts. Its parts stay, and you can restore it from "Archived systems" at any time.',
      confirmLabel: 'Archive system',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.busy.set(true);
          const latest = this.systems().find((candidate) => candidate.id === system.id) ?? system;
          return this.systemsApi.update(this.buildId(), system.id, { archived: true, version: latest.version });
        }),
      )
      .subscribe({
        next: (saved) => {
          this.busy.set(false);
          this.replace(saved);
          this.snackBar.open(`${saved.name} is archived.`, 'Dismiss', { duration: 6000 });
        this.loadLedger(this.buildId());
        },
        error: (error: unknown) => {
          this.busy.set(false);
          if (toApiError(error).status === 409) this.conflicted(`${system.name} was changed by someone else`);
        },
      });
  }

  protected restore(system: SystemDto): void {
    this.busy.set(true);
    this.systemsApi.update(this.buildId(), system.id, { archived: false, version: system.version }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.replace(saved);
        this.addBudgetControl(saved);
        this.snackBar.open(`${saved.name} is back in the build.`, 'Dismiss', { duration: 6000 });
        this.loadLedger(this.buildId());
      },
      error: (error: unknown) => {
        this.busy.set(false);
        if (toApiError(error).status === 409) this.conflicted(`${system.name} was changed by someone else`);
      },
    });
  }

  protected addSystem(): void {
    const raw = this.addForm.getRawValue();
    const request = { name: raw.name.trim(), ...(raw.budget.trim() ? { budget: raw.budget.trim() } : {}) };
    if (!validateWith(this.addForm, createSystemRequest, request)) return;
    const budgetError = request.budget ? budgetValidator(this.places(), false)(this.addForm.controls.budget) : null;
    if (budgetError) {
      applyFieldErrors(this.addForm, { budget: budgetError['message'] as string });
      return;
    }
    this.busy.set(true);
    this.systemsApi.create(this.buildId(), request).subscribe({
      next: (created) => {
        this.busy.set(false);
        this.systems.update((systems) => [...systems, created]);
        this.addBudgetControl(created);
        this.addForm.reset({ name: '', budget: '' });
        this.status.set(`${created.name} added.`);
        this.loadLedger(this.buildId());
        this.snackBar.open(`${created.name} added.`, 'Dismiss', { duration: 5000 });
      },
      error: (error: unknown) => {
        this.busy.set(false);
        applyFieldErrors(this.addForm, toApiError(error).fields);
      },
    });
  }

  /** The amount to send when the input holds a valid amount different from the saved one; null otherwise. */
  private changedAmount(key: string, saved: string): string | null {
    const control = this.budgetForm.controls[key];
    if (!control || this.inFlight.has(key)) return null;
    control.markAsTouched();
    control.updateValueAndValidity();
    if (control.invalid) return null;
    const parsed = parseMoney(control.value, { maxDecimals: this.places() });
    if (!parsed.ok || parsed.value.equals(amountOf(saved))) return null;
    return toWire(parsed.value, this.places());
  }

  private failed(key: string, error: unknown, conflictWhat: string): void {
    this.inFlight.delete(key);
    const apiError = toApiError(error);
    if (apiError.status === 409) {
      this.conflicted(conflictWhat);
      return;
    }
    const control = this.budgetForm.controls[key];
    const message = Object.values(apiError.fields)[0];
    if (control && message) {
      control.setErrors({ message });
      control.markAsTouched();
    }
  }

  private conflicted(what: string): void {
    this.snackBar.open(`${what} since you opened this page. It now shows the saved figures: enter yours again if needed.`, 'Dismiss', {
      duration: 10000,
    });
    this.load(this.buildId());
  }

  private replace(saved: SystemDto): void {
    this.systems.update((systems) => systems.map((system) => (system.id === saved.id ? saved : system)));
  }

  private addBudgetControl(system: SystemDto): void {
    this.budgetForm.setControl(system.id, new FormControl(system.budget, { nonNullable: true, validators: budgetValidator(this.places(), true) }));
  }

  protected comparisonText(comparison: BudgetComparison): string {
    return comparisonWords(comparison, moneyText(comparison.amount, this.currency(), this.locale()));
  }

  /** Systems added, archived or restored change the ledger's rows: read it again. */
  private loadLedger(buildId: string): void {
    this.ledgerApi.ledger(buildId).subscribe({ next: (ledger) => this.ledger.set(ledger), error: () => this.ledger.set(null) });
  }

  private load(buildId: string): void {
    this.loadLedger(buildId);
    this.loading.set(true);
    this.systemsApi.list(buildId, true).subscribe({
      next: (response: SystemsResponse) => {
        this.currency.set(response.currency);
        this.systems.set(response.systems);
        this.savedContingency.set(response.contingencyBudget);
        this.buildVersion = response.buildVersion;
        for (const key of Object.keys(this.budgetForm.controls)) this.budgetForm.removeControl(key, { emitEvent: false });
        for (const system of response.systems) this.addBudgetControl(system);
        this.budgetForm.setControl(
          CONTINGENCY,
          new FormControl(response.contingencyBudget, { nonNullable: true, validators: budgetValidator(this.places(), true) }),
        );
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
  }
}
