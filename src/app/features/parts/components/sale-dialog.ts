// Asks for the asking price of a spare offered for sale, checked in the currency's minor units.
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MONEY_MESSAGES, minorUnits, parseMoney, toWire } from '../../../../../shared/money';
import { errorOf } from '../../../core/forms/form-errors';

export interface SaleDialogData {
  description: string;
  currency: string;
  /** The current asking price, when changing it. */
  askingPrice: string | null;
}

@Component({
  selector: 'th-sale-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sale-dialog.html',
})
export class SaleDialog {
  protected readonly data = inject<SaleDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<SaleDialog, string>>(MatDialogRef);
  protected readonly errorOf = errorOf;
  protected readonly form = inject(NonNullableFormBuilder).group({ askingPrice: this.data.askingPrice ?? '' });

  protected submit(): void {
    const control = this.form.controls.askingPrice;
    const places = minorUnits(this.data.currency);
    const parsed = parseMoney(control.value, { maxDecimals: places });
    const message = !parsed.ok ? parsed.message : parsed.value.isNegative() ? MONEY_MESSAGES.negative : '';
    if (message || !parsed.ok) {
      control.setErrors({ message });
      control.markAsTouched();
      return;
    }
    this.dialogRef.close(toWire(parsed.value, places));
  }
}
