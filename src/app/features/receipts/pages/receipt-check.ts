// /builds/:buildId/receipts/:receiptId: the page image beside the read fields and lines, corrected by keyboard, reconciled live, then filed.
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, computed, effect, inject, input, signal, untracked, viewChildren } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { Observable, Subscription, firstValueFrom, of, switchMap, takeWhile, timer } from 'rxjs';
import type { PartDto, SystemDto } from '../../../../../shared/api/parts';
import type { FileReceiptRequest, ReceiptDto, ReceiptLineDto, UpdateLineRequest, UpdateReceiptRequest } from '../../../../../shared/api/receipts';
import type { PriceHistoryResponse } from '../../../../../shared/api/price-history';
import type { LineSuggestionDto } from '../../../../../shared/api/suggestions';
import { RECEIPT_LINE_KINDS, RECEIPT_LINE_KIND_LABELS, RECEIPT_STATE_LABELS } from '../../../../../shared/enums';
import { parseMoney } from '../../../../../shared/money';
import { ApiError, toApiError } from '../../../core/http/api-error';
import { errorOf } from '../../../core/forms/form-errors';
import { formatCalendarDate } from '../../../ui/dates';
import { moneyText } from '../../../ui/money';
import { CurrentBuild } from '../../builds/services/current-build';
import { PartsApi } from '../../parts/services/parts-api';
import { SystemsApi } from '../../parts/services/systems-api';
import { ReviewPanel } from '../../review/components/review-panel';
import { ReviewVerdict } from '../../review/components/review-verdict/review-verdict';
import { DuplicateNotice } from '../components/duplicate-notice/duplicate-notice';
import { AcceptDifferenceData, AcceptDifferenceDialog } from '../components/accept-difference-dialog';
import { ReceiptPages } from '../components/receipt-pages';
import { ReturnLinkData, ReturnLinkDialog } from '../components/return-link-dialog';
import { SplitDialog, SplitDialogData, SplitShare } from '../components/split-dialog';
import { liveReconciliation } from '../models/live-reconciliation';
import { LINE_FIELD_LABELS, LINE_TEXT_FIELDS, lineGroup, type LineAction, type LineField, type LineGroup } from '../models/line-form';
import { AssignPicker, type Assignment } from '../components/assign-picker/assign-picker';
import { LineCard } from '../components/line-card/line-card';
import { LineMenu } from '../components/line-menu/line-menu';
import { PriceHint } from '../components/price-hint/price-hint';
import { WarrantyHint } from '../components/warranty-hint/warranty-hint';
import { injectNarrowScreen } from '../../../ui/narrow-screen';
import { SafetyNote } from '../../../ui/safety-note/safety-note';
import { PriceHistoryApi } from '../services/price-history-api';
import { ReceiptsApi } from '../services/receipts-api';

/** Below this reading confidence a field is marked "check this". */
const LOW_CONFIDENCE = 0.8;

const HEADER_FIELDS = [
  { name: 'vendorName', label: 'Shop', confidence: 'vendor', money: false },
  { name: 'purchaseDate', label: 'Date', confidence: 'date', money: false },
  { name: 'receiptNumber', label: 'Receipt no.', confidence: 'receiptNumber', money: false },
  { name: 'subtotal', label: 'Subtotal', confidence: 'subtotal', money: true },
  { name: 'tax', label: 'Tax', confidence: 'tax', money: true },
  { name: 'shipping', label: 'Shipping', confidence: 'shipping', money: true },
  { name: 'discount', label: 'Discount', confidence: 'discount', money: true },
  { name: 'total', label: 'Total', confidence: 'total', money: true },
] as const;
type HeaderName = (typeof HEADER_FIELDS)[number]['name'];

/** A typed value against the saved one: amounts compare as decimals ("12" is "12.00"), the rest as text. */
function sameValue(saved: unknown, typed: string | null, numeric: boolean): boolean {
  if (saved === null || saved === undefined || typed === null) return (saved ?? null) === typed;
  const savedText = String(saved);
  if (savedText === typed || !numeric) return savedText === typed;
  const a = parseMoney(savedText);
  const b = parseMoney(typed);
  return a.ok && b.ok && a.value.equals(b.value);
}

/** How each arrow key moves in the lines table: by lines (rows) or by editable cells along a line. */
const ARROW_STEPS: Partial<Record<string, { rows: number; cells: number }>> = {
  ArrowUp: { rows: -1, cells: 0 },
  ArrowDown: { rows: 1, cells: 0 },
  ArrowLeft: { rows: 0, cells: -1 },
  ArrowRight: { rows: 0, cells: 1 },
};

/** True when the caret sits, with nothing selected, at the start or the end of the field's text. */
function caretAtEdge(input: HTMLInputElement, edge: 'start' | 'end'): boolean {
  const { selectionStart, selectionEnd } = input;
  // An input type without a caret has nothing to move through.
  if (selectionStart === null || selectionEnd === null) return true;
  if (selectionStart !== selectionEnd) return false;
  return edge === 'start' ? selectionStart === 0 : selectionStart === input.value.length;
}

@Component({
  selector: 'th-receipt-check',
  imports: [
    ReactiveFormsModule,
    AssignPicker,
    LineCard,
    LineMenu,
    SafetyNote,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    RouterLink,
    ReceiptPages,
    ReviewPanel,
    ReviewVerdict,
    DuplicateNotice,
    WarrantyHint,
    PriceHint,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './receipt-check.html',
  styleUrl: './receipt-check.css',
})
export class ReceiptCheck {
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly partsApi = inject(PartsApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly priceHistoryApi = inject(PriceHistoryApi);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly current = inject(CurrentBuild);

  /** Route parameters, bound by the router. */
  readonly buildId = input.required<string>();
  readonly receiptId = input.required<string>();

  protected readonly headerFields = HEADER_FIELDS;
  protected readonly lineTextFields = LINE_TEXT_FIELDS;
  protected readonly lineFieldLabels = LINE_FIELD_LABELS;
  protected readonly kinds = RECEIPT_LINE_KINDS;
  protected readonly kindLabels = RECEIPT_LINE_KIND_LABELS;
  protected readonly stateLabels = RECEIPT_STATE_LABELS;
  protected readonly errorOf = errorOf;

  protected readonly receipt = signal<ReceiptDto | null>(null);
  protected readonly parts = signal<PartDto[]>([]);
  protected readonly systems = signal<SystemDto[]>([]);
  protected readonly problem = signal('');
  protected readonly busy = signal(false);
  protected readonly activeLineId = signal<string | null>(null);
  protected readonly selected = signal<ReadonlySet<string>>(new Set());
  /** Each line's suggestions by line id; empty until they arrive (and when they cannot be had). */
  protected readonly suggestions = signal<Partial<Record<string, LineSuggestionDto[]>>>({});
  protected readonly suggestionThreshold = signal(1);
  /** Every price filed before, for the hint under a line priced well above the lowest; null until it arrives (or when it cannot be had). */
  protected readonly priceHistory = signal<PriceHistoryResponse | null>(null);
  /** Phones get one card per line instead of the table. */
  protected readonly narrow = injectNarrowScreen();
  protected readonly lineProblems = signal<Partial<Record<string, string>>>({});
  protected readonly fileProblems = signal<string[]>([]);

  protected readonly header = new FormGroup({
    vendorName: new FormControl('', { nonNullable: true }),
    purchaseDate: new FormControl('', { nonNullable: true }),
    receiptNumber: new FormControl('', { nonNullable: true }),
    subtotal: new FormControl('', { nonNullable: true }),
    tax: new FormControl('', { nonNullable: true }),
    shipping: new FormControl('', { nonNullable: true }),
    discount: new FormControl('', { nonNullable: true }),
    total: new FormControl('', { nonNullable: true }),
  });
  protected readonly lineForms = new FormArray<LineGroup>([]);
  /** The table's assign fields, to close one's list when the arrow keys leave it. */
  private readonly pickers = viewChildren(AssignPicker);
  private readonly pickerHosts = viewChildren(AssignPicker, { read: ElementRef });
  /** Bumped on every keystroke, so the live reconciliation (a computed) follows the forms. */
  private readonly formTick = signal(0);
  /** Saves run one after another, so each sends the version the previous one answered with. */
  private saving: Promise<unknown> = Promise.resolve();
  private polling: Subscription | null = null;
  private suggestionsKey = '';

  protected readonly currency = computed(() => this.receipt()?.currency ?? this.current.build()?.currency ?? '');
  protected readonly locale = computed(() => this.receipt()?.locale ?? this.current.build()?.locale ?? 'en-US');
  protected readonly editable = computed(() => this.receipt()?.editable ?? false);
  protected readonly isOwner = computed(() => this.current.build()?.role === 'owner');
  /** The owner and the reviewer give verdicts and may say a likely duplicate is two purchases. */
  protected readonly canReview = computed(() => this.isOwner() || this.current.build()?.role === 'reviewer');
  protected readonly documentUrl = computed(() => this.receiptsApi.documentUrl(this.buildId(), this.receiptId()));

  protected readonly activeBox = computed(() => this.receipt()?.lines.find((line) => line.id === this.activeLineId())?.box ?? null);

  /** Unassigned lines whose best suggestion is sure enough for "accept all". */
  protected readonly acceptableCount = computed(() => {
    const suggestions = this.suggestions();
    const threshold = this.suggestionThreshold();
    return (this.receipt()?.lines ?? []).filter((line) => !line.systemId && (suggestions[line.id]?.[0]?.score ?? 0) >= threshold).length;
  });

  protected readonly live = computed(() => {
    this.formTick();
    if (!this.receipt()) return null;
    const header = this.header.getRawValue();
    return liveReconciliation(
      this.lineForms.controls.map((group) => group.getRawValue()),
      { tax: header.tax, shipping: header.shipping, discount: header.discount, total: header.total },
    );
  });

  protected readonly differenceText = computed(() => {
    const live = this.live();
    if (!live?.ok || live.result.difference === null) return '';
    const difference = live.result.difference;
    const amount = this.money(difference.abs());
    return difference.isPositive()
      ? `The printed total is ${amount} more than the lines, tax and shipping`
      : `The printed total is ${amount} less than the lines, tax and shipping`;
  });

  protected readonly unassignedLines = computed(() => (this.receipt()?.lines ?? []).filter((line) => !line.systemId).length);

  /** Why filing cannot happen yet, in words beside the button; '' when it can. */
  protected readonly fileBlocker = computed(() => {
    this.formTick();
    const unassigned = this.unassignedLines();
    if ((this.receipt()?.lines.length ?? 0) === 0) return 'Add at least one line before filing.';
    if (unassigned > 0) return `Assign ${unassigned === 1 ? 'the last line' : `${unassigned} lines`} to a part or a system before filing.`;
    if (!this.header.controls.purchaseDate.value) return 'Enter the date of purchase before filing.';
    const live = this.live();
    if (!live?.ok) return 'Fix the amounts before filing.';
    if (!live.result.reconciles) {
      return this.isOwner() ? '' : 'The lines do not add up to the printed total; fix them, or ask the owner to accept the difference.';
    }
    return '';
  });

  protected readonly canAcceptDifference = computed(() => {
    const live = this.live();
    return this.isOwner() && !!live?.ok && !live.result.reconciles && live.result.difference !== null && this.unassignedLines() === 0;
  });

  /** The risky systems this receipt's lines went to, named in the caution. */
  protected readonly cautionSystems = computed(() => {
    const used = new Set((this.receipt()?.lines ?? []).map((line) => line.systemId));
    return this.systems().filter((system) => system.safetyCaution && used.has(system.id)).map((system) => system.name);
  });
  protected readonly showCaution = computed(() => this.cautionSystems().length > 0);

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      const receiptId = this.receiptId();
      untracked(() => this.watch(buildId, receiptId));
    });
    effect(() => {
      const buildId = this.buildId();
      untracked(() => {
        this.partsApi.list(buildId).subscribe({ next: (parts) => this.parts.set(parts), error: () => this.parts.set([]) });
        this.systemsApi.list(buildId).subscribe({ next: (response) => this.systems.set(response.systems), error: () => this.systems.set([]) });
        this.priceHistoryApi.priceHistory(buildId, 1).subscribe({ next: (history) => this.priceHistory.set(history), error: () => this.priceHistory.set(null) });
      });
    });
    this.header.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.bump());
    this.lineForms.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.bump());
    // Capture phase: a closed mat-select turns arrow keys into a new value (saved at once) in its own handler, which
    // runs before a bubbling listener on the table would; listening on the way down lets the grid take them first.
    const host = this.host.nativeElement;
    const onKeydown = (event: KeyboardEvent) => this.moveInLines(event);
    host.addEventListener('keydown', onKeydown, true);
    this.destroyRef.onDestroy(() => host.removeEventListener('keydown', onKeydown, true));
  }

  protected isLow(key: string): boolean {
    const confidence = this.receipt()?.fieldConfidence[key];
    return confidence !== undefined && confidence < LOW_CONFIDENCE;
  }

  protected readValue(name: HeaderName, isMoney: boolean): string {
    const value = this.header.controls[name].value;
    if (!value) return 'Not read';
    if (name === 'purchaseDate') return formatCalendarDate(value, this.locale());
    return isMoney ? this.money(value) : value;
  }

  protected isLowLine(line: ReceiptLineDto, field: string): boolean {
    const confidence = line.confidence[field] as number | undefined;
    return confidence !== undefined && confidence < LOW_CONFIDENCE;
  }

  protected money(amount: Parameters<typeof moneyText>[0], maxDecimals?: number): string {
    return moneyText(amount, this.currency(), this.locale(), maxDecimals);
  }

  protected systemName(systemId: string | null): string {
    if (!systemId) return 'Not assigned';
    return this.systems().find((system) => system.id === systemId)?.name ?? 'A system';
  }

  protected toggleSelected(lineId: string, checked: boolean): void {
    this.selected.update((selected) => {
      const next = new Set(selected);
      if (checked) next.add(lineId);
      else next.delete(lineId);
      return next;
    });
  }

  /** Enter moves to the next field, like Tab, unless a menu or autocomplete used it first. */
  protected nextField(event: Event): void {
    const target = event.target as HTMLElement;
    if (event.defaultPrevented || target.tagName !== 'INPUT') return;
    event.preventDefault();
    const fields = Array.from(this.host.nativeElement.querySelectorAll<HTMLElement>('.header-fields input:not([readonly]), .line-table input, .line-table mat-select'));
    const next = fields[fields.indexOf(target) + 1];
    // The value was typed: save it as leaving the field would.
    target.dispatchEvent(new Event('change', { bubbles: true }));
    next?.focus();
  }

  /**
   * Arrow keys in the lines table, after the WAI-ARIA Authoring Practices "grid" pattern: Up and Down go to the same
   * column (data-col) of the line above or below (data-row), Left and Right to the previous or next editable cell of the
   * line. A control that uses arrows itself keeps them: a text field while the caret is inside its text, an open
   * mat-select, the part box's Up and Down (they open and walk its suggestions, which never use Left and Right, so those
   * still leave the box at the edge of its text). A closed
   * mat-select gives all four arrows to the grid (Enter, Space or a letter change it), so walking across a line never
   * changes and saves a kind or a system by accident. The table has no wrapping: at the first or last line nothing moves.
   */
  private moveInLines(event: KeyboardEvent): void {
    const step = ARROW_STEPS[event.key];
    if (!step || event.altKey || event.ctrlKey || event.metaKey || event.shiftKey || event.isComposing) return;
    const from = event.target as HTMLElement;
    const table = from.closest('.line-table');
    const row = Number(from.dataset['row']);
    const column = from.dataset['col'];
    if (!table || !column || !Number.isInteger(row)) return;
    const isText = from instanceof HTMLInputElement;
    const isPartBox = isText && from.getAttribute('aria-autocomplete') !== null;
    // An open mat-select walks its options with every arrow.
    if (!isText && from.getAttribute('aria-expanded') === 'true') return;
    if (isPartBox && step.rows !== 0) return;
    if (isText && step.cells !== 0 && !caretAtEdge(from, step.cells < 0 ? 'start' : 'end')) return;

    let to: HTMLElement | null;
    if (step.rows !== 0) {
      to = table.querySelector<HTMLElement>(`[data-row="${row + step.rows}"][data-col="${column}"]`);
    } else {
      const cells = Array.from(table.querySelectorAll<HTMLElement>(`[data-row="${row}"][data-col]`));
      to = cells[cells.indexOf(from) + step.cells] ?? null;
    }
    // At the edge of the table a text field keeps its default; a closed list still does not turn the key into a value.
    if (!to && isText) return;
    event.preventDefault();
    event.stopPropagation();
    if (!to) return;
    // The suggestions only close by themselves on Tab, Escape or a click elsewhere: close them when leaving by arrow.
    if (isPartBox) this.pickers()[this.pickerHosts().findIndex((host) => host.nativeElement.contains(from))]?.closePanel();
    to.focus();
    if (to instanceof HTMLInputElement) {
      // Up and down select the figure to retype it, as Tab does; sideways the caret continues from the near edge.
      if (step.rows !== 0) to.setSelectionRange(0, to.value.length);
      else if (step.cells > 0) to.setSelectionRange(0, 0);
      else to.setSelectionRange(to.value.length, to.value.length);
    }
  }

  protected saveHeader(name: HeaderName): void {
    const receipt = this.receipt();
    if (!receipt) return;
    const control = this.header.controls[name];
    const text = control.value.trim();
    const field = HEADER_FIELDS.find((candidate) => candidate.name === name)!;
    let value: string | null = text;
    if (field.money) {
      if (text === '') value = null;
      else {
        const parsed = parseMoney(text);
        if (!parsed.ok) {
          control.setErrors({ message: parsed.message });
          control.markAsTouched();
          return;
        }
      }
    }
    if (name === 'purchaseDate' && text === '') value = null;
    if ((receipt[name] ?? '') === (value ?? '')) return;
    this.enqueue(() => this.receiptsApi.update(this.buildId(), this.receiptId(), { [name]: value, version: this.receipt()!.version } as UpdateReceiptRequest), {
      next: (saved) => this.receipt.set(saved),
      error: (error) => {
        control.setErrors({ message: error.fields[name] ?? error.message });
        control.markAsTouched();
      },
    });
  }

  protected saveLine(line: ReceiptLineDto, field: LineField): void {
    const group = this.groupOf(line.id);
    if (!group) return;
    const control = group.controls[field];
    const raw = String(control.value).trim();
    let value: string | null = raw;
    if (field === 'unitPrice' && raw === '') value = null;
    if ((field === 'amount' || field === 'unitPrice' || field === 'quantity') && value !== null) {
      const parsed = parseMoney(value);
      if (!parsed.ok) {
        control.setErrors({ message: parsed.message });
        return;
      }
    }
    // The live line (with the newest version) is read when the save runs, not when it was asked for.
    this.enqueue(
      () => {
        const currentLine = this.lineOf(line.id)!;
        // Enter saves at once and leaving the field then fires "change" again: the same value is not sent twice.
        if (sameValue(currentLine[field], value, field === 'amount' || field === 'unitPrice' || field === 'quantity')) return of(currentLine);
        const request: UpdateLineRequest = { [field]: value, version: currentLine.version };
        return this.receiptsApi.updateLine(this.buildId(), this.receiptId(), line.id, request);
      },
      {
        next: (saved) => this.replaceLine(saved),
        error: (error) => {
          const message = error.fields[field] ?? Object.values(error.fields)[0] ?? error.message;
          if (field === 'kind') this.setLineProblem(line.id, message);
          else control.setErrors({ message });
        },
      },
    );
  }

  /** A part brings its system; a system alone leaves the line without a part. */
  protected assignTo(line: ReceiptLineDto, assignment: Assignment): void {
    this.sendLine(line.id, { partId: assignment.partId, systemId: assignment.systemId });
  }

  protected act(line: ReceiptLineDto, action: LineAction): void {
    if (action === 'newPart') this.newPartFrom(line);
    else if (action === 'linkReturn') this.linkReturn(line);
    else if (action === 'split') this.split(line);
    else this.removeLine(line);
  }

  /** One button takes every sure suggestion at once. */
  protected acceptAll(): void {
    this.enqueue(() => this.receiptsApi.acceptSuggestions(this.buildId(), this.receiptId()), {
      next: (saved) => this.show(saved),
      error: (error) => this.problem.set(error.message),
    });
  }

  protected newPartFrom(line: ReceiptLineDto): void {
    const systemId = this.lineOf(line.id)?.systemId;
    if (!systemId) {
      this.setLineProblem(line.id, 'Choose the system first: the new part goes on that system of the bill of materials.');
      return;
    }
    this.sendLine(line.id, { newPart: { systemId } }, () => this.partsApi.list(this.buildId()).subscribe((parts) => this.parts.set(parts)));
  }

  protected linkReturn(line: ReceiptLineDto): void {
    const data: ReturnLinkData = { buildId: this.buildId(), receiptId: this.receiptId(), description: line.description, currency: this.currency(), locale: this.locale() };
    this.dialog
      .open<ReturnLinkDialog, ReturnLinkData, string>(ReturnLinkDialog, { data, width: '560px' })
      .afterClosed()
      .subscribe((lineId) => {
        if (lineId) this.sendLine(line.id, { returnOfLineId: lineId });
      });
  }

  protected split(line: ReceiptLineDto): void {
    const data: SplitDialogData = {
      description: line.description,
      amount: line.amount,
      currency: this.currency(),
      locale: this.locale(),
      systems: this.systems(),
      systemId: line.systemId,
    };
    this.dialog
      .open<SplitDialog, SplitDialogData, SplitShare[]>(SplitDialog, { data, width: '560px' })
      .afterClosed()
      .subscribe((shares) => {
        if (!shares) return;
        this.enqueue(
          () => this.receiptsApi.splitLine(this.buildId(), this.receiptId(), line.id, { version: this.lineOf(line.id)!.version, shares }),
          { next: (saved) => this.show(saved), error: (error) => this.setLineProblem(line.id, Object.values(error.fields)[0] ?? error.message) },
        );
      });
  }

  protected mergeSelected(): void {
    const lineIds = (this.receipt()?.lines ?? []).filter((line) => this.selected().has(line.id)).map((line) => line.id);
    this.enqueue(() => this.receiptsApi.mergeLines(this.buildId(), this.receiptId(), lineIds), {
      next: (saved) => {
        this.selected.set(new Set());
        this.show(saved);
      },
      error: (error) => this.problem.set(error.message),
    });
  }

  protected addLine(): void {
    this.enqueue(() => this.receiptsApi.addLine(this.buildId(), this.receiptId(), { kind: 'part', description: 'New line', amount: '0' }), {
      next: () => this.reload(),
      error: (error) => this.problem.set(error.message),
    });
  }

  protected removeLine(line: ReceiptLineDto): void {
    this.enqueue(() => this.receiptsApi.removeLine(this.buildId(), this.receiptId(), line.id), {
      next: () => this.reload(),
      error: (error) => this.problem.set(error.message),
    });
  }

  protected file(acceptDifference?: { reason: string }): void {
    this.fileProblems.set([]);
    this.enqueue(
      () => {
        const request: FileReceiptRequest = { version: this.receipt()!.version };
        if (acceptDifference) request.acceptDifference = acceptDifference;
        return this.receiptsApi.file(this.buildId(), this.receiptId(), request);
      },
      {
        next: (saved) => this.show(saved),
        error: (error) => this.fileProblems.set(error.hasFieldErrors ? this.describeFileProblems(error) : [error.message]),
      },
    );
  }

  protected acceptAndFile(): void {
    const data: AcceptDifferenceData = { differenceText: this.differenceText().replace(/^The printed total is /, '') };
    this.dialog
      .open<AcceptDifferenceDialog, AcceptDifferenceData, string>(AcceptDifferenceDialog, { data, width: '480px' })
      .afterClosed()
      .subscribe((reason) => {
        if (reason) this.file({ reason });
      });
  }

  protected reopen(): void {
    this.enqueue(() => this.receiptsApi.reopen(this.buildId(), this.receiptId()), {
      next: (saved) => this.show(saved),
      error: (error) => this.problem.set(error.message),
    });
  }

  /** The server names fields like lines.2.systemId; say which line in words. */
  private describeFileProblems(error: ApiError): string[] {
    return Object.entries(error.fields).map(([path, message]) => {
      const match = /^lines\.(\d+)\./.exec(path);
      return match ? `Line ${Number(match[1]) + 1}: ${message}` : message;
    });
  }

  private sendLine(lineId: string, change: Omit<UpdateLineRequest, 'version'>, after?: () => void): void {
    this.setLineProblem(lineId, '');
    this.enqueue(() => this.receiptsApi.updateLine(this.buildId(), this.receiptId(), lineId, { ...change, version: this.lineOf(lineId)!.version }), {
      next: (saved) => {
        this.replaceLine(saved);
        after?.();
      },
      error: (error) => this.setLineProblem(lineId, Object.values(error.fields)[0] ?? error.message),
    });
  }

  private enqueue<T>(work: () => Observable<T>, handlers: { next: (value: T) => void; error: (error: ApiError) => void }): void {
    this.busy.set(true);
    this.saving = this.saving
      .then(() => firstValueFrom(work(), { defaultValue: undefined as T }))
      .then(
        (value) => handlers.next(value),
        (error: unknown) => {
          const apiError = toApiError(error);
          if (apiError.status === 409) {
            this.problem.set('Someone else changed this receipt meanwhile. It is shown as saved now; make your change again.');
            this.reload();
          } else {
            handlers.error(apiError);
          }
        },
      )
      .finally(() => this.busy.set(false));
  }

  private setLineProblem(lineId: string, message: string): void {
    this.lineProblems.update((problems) => ({ ...problems, [lineId]: message }));
  }

  private lineOf(lineId: string): ReceiptLineDto | undefined {
    return this.receipt()?.lines.find((line) => line.id === lineId);
  }

  private groupOf(lineId: string): LineGroup | undefined {
    const index = this.receipt()?.lines.findIndex((line) => line.id === lineId) ?? -1;
    return index >= 0 ? this.lineForms.at(index) : undefined;
  }

  /** Puts a saved line in place; its form takes the server's figures (an amount worked out from quantity and price). */
  private replaceLine(saved: ReceiptLineDto): void {
    const receipt = this.receipt();
    if (!receipt) return;
    this.receipt.set({ ...receipt, lines: receipt.lines.map((line) => (line.id === saved.id ? saved : line)) });
    const group = this.groupOf(saved.id);
    group?.setValue(lineGroup(saved).getRawValue(), { emitEvent: false });
    this.bump();
  }

  protected reload(): void {
    this.receiptsApi.get(this.buildId(), this.receiptId()).subscribe({ next: (receipt) => this.show(receipt), error: (error: unknown) => this.problem.set(toApiError(error).message) });
  }

  /** Asks every second while the receipt is waiting or being read, then stops. */
  private watch(buildId: string, receiptId: string): void {
    this.polling?.unsubscribe();
    this.polling = timer(0, 1000)
      .pipe(
        switchMap(() => this.receiptsApi.get(buildId, receiptId)),
        takeWhile((receipt) => receipt.state === 'queued' || receipt.state === 'reading', true),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (receipt) => this.show(receipt),
        error: (error: unknown) => this.problem.set(toApiError(error).message),
      });
  }

  protected show(receipt: ReceiptDto): void {
    this.receipt.set(receipt);
    this.header.setValue(
      {
        vendorName: receipt.vendorName ?? '',
        purchaseDate: receipt.purchaseDate ?? '',
        receiptNumber: receipt.receiptNumber,
        subtotal: receipt.subtotal ?? '',
        tax: receipt.tax ?? '',
        shipping: receipt.shipping ?? '',
        discount: receipt.discount ?? '',
        total: receipt.total ?? '',
      },
      { emitEvent: false },
    );
    this.lineForms.clear({ emitEvent: false });
    for (const line of receipt.lines) this.lineForms.push(lineGroup(line), { emitEvent: false });
    this.bump();
    this.loadSuggestions(receipt);
  }

  /** Asked once per set of lines (a split, merge or new line asks again); a receipt still being read has none yet. */
  private loadSuggestions(receipt: ReceiptDto): void {
    const key = receipt.editable && receipt.state !== 'queued' && receipt.state !== 'reading' ? receipt.lines.map((line) => line.id).join(',') : '';
    if (key === this.suggestionsKey) return;
    this.suggestionsKey = key;
    if (!key) return;
    this.receiptsApi.suggestions(this.buildId(), this.receiptId()).subscribe({
      next: (answer) => {
        this.suggestionThreshold.set(answer.threshold);
        this.suggestions.set(Object.fromEntries(answer.lines.map((line) => [line.lineId, line.suggestions])));
      },
      // Suggestions help; without them the person assigns by hand.
      error: () => this.suggestions.set({}),
    });
  }

  private bump(): void {
    this.formTick.update((tick) => tick + 1);
  }
}
