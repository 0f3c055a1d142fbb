// A receipt line as a card, for phones: what was bought and what it cost at a glance, one field to assign it, the
// reader's best suggestion one tap away, and the read figures behind "Correct" for when the reader got one wrong.
import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { PartDto, SystemDto } from '../../../../../../shared/api/parts';
import type { PriceHistoryResponse } from '../../../../../../shared/api/price-history';
import type { ReceiptLineDto } from '../../../../../../shared/api/receipts';
import type { LineSuggestionDto } from '../../../../../../shared/api/suggestions';
import { RECEIPT_LINE_KINDS, RECEIPT_LINE_KIND_LABELS } from '../../../../../../shared/enums';
import { errorOf } from '../../../../core/forms/form-errors';
import { moneyText } from '../../../../ui/money';
import { LINE_FIELD_LABELS, LINE_TEXT_FIELDS, type LineAction, type LineField, type LineGroup } from '../../models/line-form';
import { AssignPicker, type Assignment } from '../assign-picker/assign-picker';
import { LineMenu } from '../line-menu/line-menu';
import { PriceHint } from '../price-hint/price-hint';
import { WarrantyHint } from '../warranty-hint/warranty-hint';

@Component({
  selector: 'th-line-card',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, AssignPicker, LineMenu, WarrantyHint, PriceHint],
  templateUrl: './line-card.html',
  styleUrl: './line-card.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LineCard {
  readonly line = input.required<ReceiptLineDto>();
  readonly lineNumber = input.required<number>();
  /** The line's form, shared with the page, which saves it. */
  readonly group = input.required<LineGroup>();
  readonly editable = input(false);
  readonly currency = input.required<string>();
  readonly locale = input.required<string>();
  readonly parts = input.required<readonly PartDto[]>();
  readonly systems = input.required<readonly SystemDto[]>();
  readonly suggestions = input<readonly LineSuggestionDto[]>([]);
  readonly receiptId = input('');
  /** Every price filed before, for the price hint; null until it arrives. */
  readonly priceHistory = input<PriceHistoryResponse | null>(null);
  readonly problem = input('');
  readonly busy = input(false);

  readonly save = output<LineField>();
  readonly assign = output<Assignment>();
  readonly action = output<LineAction>();

  protected readonly kinds = RECEIPT_LINE_KINDS;
  protected readonly kindLabels = RECEIPT_LINE_KIND_LABELS;
  protected readonly textFields = LINE_TEXT_FIELDS;
  protected readonly fieldLabels = LINE_FIELD_LABELS;
  protected readonly errorOf = errorOf;
  protected readonly correcting = signal(false);

  /** The best suggestion, offered as one tap while the line has no system yet. */
  protected readonly offer = computed(() => (this.line().systemId ? null : (this.suggestions()[0] ?? null)));

  /** "2 × $12.50" when the slip printed a quantity and a unit price. */
  protected readonly perUnit = computed(() => {
    const line = this.line();
    if (!line.unitPrice) return '';
    return `${line.quantity} × ${moneyText(line.unitPrice, this.currency(), this.locale(), 4)}`;
  });

  /** For a reader: where the line went, in words. */
  protected readonly assignedText = computed(() => {
    const line = this.line();
    const system = line.systemId ? (this.systems().find((candidate) => candidate.id === line.systemId)?.name ?? 'A system') : null;
    if (!system) return 'Not assigned';
    return line.partDescription ? `${line.partDescription} · ${system}` : system;
  });

  protected money(amount: string): string {
    return moneyText(amount, this.currency(), this.locale());
  }

  protected accept(suggestion: LineSuggestionDto): void {
    this.assign.emit({ partId: suggestion.partId, systemId: suggestion.systemId });
  }
}
