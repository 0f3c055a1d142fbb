// A receipt line's editable figures as a form, shared by the check table (desktop) and the line cards (phones).
import { FormControl, FormGroup } from '@angular/forms';
import type { ReceiptLineDto } from '../../../../../shared/api/receipts';
import type { ReceiptLineKind } from '../../../../../shared/enums';

export const LINE_TEXT_FIELDS = ['description', 'partNumber', 'quantity', 'unitPrice', 'amount'] as const;
export type LineTextField = (typeof LINE_TEXT_FIELDS)[number];
/** Fields saved one at a time as they are left. */
export type LineField = LineTextField | 'kind';

export const LINE_FIELD_LABELS: Record<LineTextField, string> = {
  description: 'Description',
  partNumber: 'Part number',
  quantity: 'Quantity',
  unitPrice: 'Unit price',
  amount: 'Amount',
};

/** What a line's menu can ask the page to do. */
export type LineAction = 'newPart' | 'linkReturn' | 'split' | 'remove';

export function lineGroup(line: ReceiptLineDto) {
  return new FormGroup({
    kind: new FormControl<ReceiptLineKind>(line.kind, { nonNullable: true }),
    description: new FormControl(line.description, { nonNullable: true }),
    partNumber: new FormControl(line.partNumber, { nonNullable: true }),
    quantity: new FormControl(line.quantity, { nonNullable: true }),
    unitPrice: new FormControl(line.unitPrice ?? '', { nonNullable: true }),
    amount: new FormControl(line.amount, { nonNullable: true }),
    taxable: new FormControl(line.taxable, { nonNullable: true }),
  });
}
export type LineGroup = ReturnType<typeof lineGroup>;
