// Splits one receipt line into shares by system (a kit used by two systems); the shares must add up to the line exactly.
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { SystemDto } from '../../../../../shared/api/parts';
import { Decimal, minorUnits, parseMoney, subtract, sum, toDecimal, toWire } from '../../../../../shared/money';
import { moneyText } from '../../../ui/money';

export interface SplitDialogData {
  description: string;
  amount: string;
  currency: string;
  locale: string;
  systems: SystemDto[];
  systemId: string | null;
}

export interface SplitShare {
  amount: string;
  systemId: string | null;
  partId: null;
}

type ShareGroup = FormGroup<{ amount: FormControl<string>; systemId: FormControl<string> }>;

@Component({
  selector: 'th-split-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './split-dialog.html',
  styleUrl: './split-dialog.css',
})
export class SplitDialog {
  protected readonly data = inject<SplitDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<SplitDialog, SplitShare[]>>(MatDialogRef);
  private readonly lineAmount = toDecimal(this.data.amount);
  protected readonly lineText = moneyText(this.data.amount, this.data.currency, this.data.locale);
  protected readonly shares = new FormArray<ShareGroup>([]);
  protected readonly form = new FormGroup({ shares: this.shares });
  private readonly tick = signal(0);

  constructor() {
    // Start with two halves, the second taking the odd cent, so the shares already add up.
    const decimals = minorUnits(this.data.currency);
    const half = this.lineAmount.dividedBy(2).toDecimalPlaces(decimals, Decimal.ROUND_DOWN);
    this.shares.push(this.share(toWire(half, decimals), this.data.systemId ?? ''));
    this.shares.push(this.share(toWire(subtract(this.lineAmount, half), decimals), ''));
  }

  /** The line amount minus the shares entered, or null while a share is not an amount. */
  private readonly remaining = computed(() => {
    this.tick();
    const amounts: Decimal[] = [];
    for (const share of this.shares.controls) {
      const parsed = parseMoney(share.controls.amount.value, { maxDecimals: minorUnits(this.data.currency) });
      if (!parsed.ok) return null;
      amounts.push(parsed.value);
    }
    return subtract(this.lineAmount, sum(amounts));
  });
  protected readonly balanced = computed(() => this.remaining()?.isZero() ?? false);
  protected readonly remainingText = computed(() => {
    const remaining = this.remaining();
    if (remaining === null) return 'Enter each share as an amount, such as 12.50.';
    const text = moneyText(remaining.abs(), this.data.currency, this.data.locale);
    return remaining.isPositive() ? `${text} of the line is not shared out yet.` : `The shares are ${text} more than the line.`;
  });

  protected changed(): void {
    this.tick.update((value) => value + 1);
  }

  protected add(): void {
    this.shares.push(this.share('0', ''));
    this.changed();
  }

  protected remove(index: number): void {
    this.shares.removeAt(index);
    this.changed();
  }

  protected submit(): void {
    if (!this.balanced()) return;
    this.dialogRef.close(
      this.shares.controls.map((share) => ({ amount: share.controls.amount.value.trim(), systemId: share.controls.systemId.value || null, partId: null })),
    );
  }

  private share(amount: string, systemId: string): ShareGroup {
    return new FormGroup({ amount: new FormControl(amount, { nonNullable: true }), systemId: new FormControl(systemId, { nonNullable: true }) });
  }
}
